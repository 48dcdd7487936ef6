/**
 * The committed geodata fixtures are exactly what the writers make of the invented scenario
 * today. A change to a writer that alters its bytes shows up here; if the change is meant,
 * run `npm run fixtures` and review the new files in the diff.
 */
import { readFileSync, readdirSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { buildFixtures } from "../../../tests/fixtures/geo/make-fixtures";
import { FIXTURES } from "../readers/test-support";

const built = buildFixtures();

describe("committed geodata fixtures", () => {
  it.each([...built.keys()])("%s matches what the fixture script makes", (name) => {
    const want = built.get(name)!;
    const have = readFileSync(`${FIXTURES}/${name}`);
    const wantBytes = typeof want === "string" ? Buffer.from(want) : Buffer.from(want);
    expect(have.equals(wantBytes), `${name} differs: run npm run fixtures`).toBe(true);
  });

  it("holds no data file the script does not make", () => {
    const data = readdirSync(FIXTURES).filter((f) => !f.endsWith(".ts"));
    expect(data.sort()).toEqual([...built.keys()].sort());
  });
});
