import { describe, expect, it } from "vitest";
import { safeNext, signInPath } from "./navigation";

describe("safeNext", () => {
  it("keeps same-site paths with their query", () => {
    expect(safeNext("/teams/abc/projects")).toBe("/teams/abc/projects");
    expect(safeNext("/invitations/tok?x=1")).toBe("/invitations/tok?x=1");
  });

  it.each([
    ["https://elsewhere.example/", "an absolute URL"],
    ["//elsewhere.example/", "a protocol-relative URL"],
    ["/\\elsewhere.example/", "a backslash trick browsers read as //"],
    ["javascript:alert(1)", "a script URL"],
    ["teams/abc", "a relative path"],
    ["", "nothing"],
  ])("refuses %s (%s) and falls back", (next) => {
    expect(safeNext(next)).toBe("/");
    expect(safeNext(next, "/account")).toBe("/account");
  });

  it("falls back when there is no next at all", () => {
    expect(safeNext(null)).toBe("/");
    expect(safeNext(undefined)).toBe("/");
  });
});

describe("signInPath", () => {
  it("encodes where to return and the address to fill in", () => {
    expect(signInPath("/invitations/abc", "a+b@x.test")).toBe(
      "/sign-in?next=%2Finvitations%2Fabc&email=a%2Bb%40x.test",
    );
    expect(signInPath("/account")).toBe("/sign-in?next=%2Faccount");
  });
});
