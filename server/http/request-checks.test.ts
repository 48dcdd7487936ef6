import { describe, expect, it } from "vitest";
import { findUnstorableText } from "./request-checks";

describe("findUnstorableText", () => {
  it("names the field path of a NUL, as the error `fields` do", () => {
    expect(findUnstorableText({ name: "ok", features: [{ p: { label: "a\u0000b" } }] })).toBe(
      "features.0.p.label",
    );
    expect(findUnstorableText("\u0000")).toBe("body");
    expect(findUnstorableText({ x: "1" }, ["query"])).toBeUndefined();
    expect(findUnstorableText({ bbox: "\u0000" }, ["query"])).toBe("query.bbox");
  });

  it("catches unpaired surrogates (high or low) and keeps real pairs and other text", () => {
    expect(findUnstorableText({ a: "x\uD800" })).toBe("a");
    expect(findUnstorableText({ a: "\uDC00x" })).toBe("a");
    expect(findUnstorableText({ a: "\uDBFF\uDBFF\uDC00" })).toBe("a");
    expect(findUnstorableText({ a: "Culvert 💧 at Mühlbach, 12 m³/s — ½ full" })).toBeUndefined();
  });

  it("checks object keys too", () => {
    expect(findUnstorableText({ props: { "bad\u0000key": 1 } })).toBe("props.bad\u0000key");
  });

  it("walks a very deeply nested body without overflowing the stack", () => {
    let deep: unknown = "\u0000";
    for (let i = 0; i < 200_000; i++) deep = [deep];
    expect(findUnstorableText(deep)?.split(".").length).toBe(200_000);
  });
});
