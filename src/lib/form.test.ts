import { describe, expect, it } from "vitest";
import { signUpBody } from "../../shared/schemas/auth";
import { createProjectForm } from "../../shared/schemas/projects";
import { fieldErrorsOf } from "./form";

describe("fieldErrorsOf", () => {
  it("maps each invalid field of a shared schema to its first message", () => {
    const result = signUpBody.safeParse({ email: "no", name: "", password: "short", teamName: "" });
    expect(result.success).toBe(false);
    if (result.success) return;
    expect(fieldErrorsOf(result.error)).toEqual({
      email: "Enter a valid e-mail address.",
      name: "Enter a name.",
      password: "Use at least 10 characters.",
      teamName: "Use at least 2 characters.",
    });
  });

  it("reads form values as the browser sends them (strings), like the server does", () => {
    const result = createProjectForm.safeParse({
      name: "Ridge Road",
      units: "si",
      designReturnPeriodYears: "7",
      description: "",
    });
    expect(result.success).toBe(false);
    if (result.success) return;
    expect(Object.keys(fieldErrorsOf(result.error))).toEqual(["designReturnPeriodYears"]);
    const good = createProjectForm.safeParse({
      name: "Ridge Road",
      units: "si",
      designReturnPeriodYears: "10",
    });
    expect(good.success && good.data.designReturnPeriodYears).toBe(10);
  });
});
