import { describe, expect, it } from "vitest";
import { compute } from "./compute";
import { parseComputeInput } from "./input-schema";
import { METHOD_IDS } from "./method-ids";
import { fixture } from "./test-support/cases";
import { formatResultText } from "./text-report";

describe("text report", () => {
  it("shows every method, the units, the governing Tc and the caution line", () => {
    const input = parseComputeInput(fixture("example-si"));
    const text = formatResultText(input, compute(input));
    for (const id of METHOD_IDS) expect(text).toContain(id);
    expect(text).toContain("length m");
    expect(text).toContain("m³/s");
    expect(text).toMatch(/Governing Tc: \d+\.\d\d min/);
    expect(text).toContain("engineer of record govern");
  });
  it("shows a validity range beside a result outside it", () => {
    const input = parseComputeInput(fixture("example-us"));
    expect(formatResultText(input, compute(input))).toMatch(/OUTSIDE RANGE: average slope/);
  });
});
