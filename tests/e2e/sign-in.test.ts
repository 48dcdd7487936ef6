import { describe, expect, it } from "vitest";
import { guardedContext } from "./support/browser";
import { demoEmail, signIn, unique } from "./support/demo";
import { saveScreenshot } from "./support/screenshots";
import { useServerAndBrowser } from "./support/session";

const e2e = useServerAndBrowser();

describe("sign-in page", () => {
  it("shows Rillmark's own page in Noto Sans served by Rillmark itself", async () => {
    const guard = await guardedContext(e2e.browser, e2e.server.url);
    const { page } = guard;
    await page.goto("/sign-in");
    await page.getByRole("heading", { level: 1, name: "Sign in to Rillmark" }).waitFor();

    const fonts = await page.evaluate(async () => {
      await document.fonts.ready;
      return {
        bodyFamily: getComputedStyle(document.body).fontFamily,
        loadedFamilies: [...document.fonts]
          .filter((face) => face.status === "loaded")
          .map((face) => face.family.replace(/["']/g, "")),
        usable: document.fonts.check('16px "Noto Sans"'),
      };
    });
    expect(fonts.bodyFamily).toMatch(/^"?Noto Sans"?,/);
    expect(fonts.loadedFamilies).toContain("Noto Sans");
    expect(fonts.usable).toBe(true);
    expect(guard.fontResponses.length).toBeGreaterThan(0);

    await page.getByText("local drainage criteria and the engineer of record govern").waitFor();
    await saveScreenshot(page, "sign-in");
    expect(guard.offHostRequests).toEqual([]);
    await guard.close();
  });

  it("says what is wrong, next to the form, when the password does not match", async () => {
    const guard = await guardedContext(e2e.browser, e2e.server.url);
    const { page } = guard;
    await page.goto("/sign-in");
    await page.getByLabel("E-mail").fill(`${unique("nobody")}@demo.rillmark.test`);
    await page.getByLabel("Password", { exact: true }).fill("not-the-password");
    await page.getByRole("button", { name: "Sign in" }).click();
    const alert = page.getByRole("alert");
    await alert.waitFor();
    expect((await alert.textContent())?.trim()).not.toBe("");
    expect(page.url()).toMatch(/\/sign-in$/);
    expect(guard.offHostRequests).toEqual([]);
    await guard.close();
  });

  it("ties a client-side field error to its input", async () => {
    const guard = await guardedContext(e2e.browser, e2e.server.url);
    const { page } = guard;
    await page.goto("/sign-in");
    await page.getByLabel("E-mail").fill("not an address");
    await page.getByRole("button", { name: "Sign in" }).click();
    const email = page.getByLabel("E-mail");
    await page.getByText("Enter a valid e-mail address.").waitFor();
    expect(await email.getAttribute("aria-invalid")).toBe("true");
    const describedBy = (await email.getAttribute("aria-describedby")) ?? "";
    const described = await page.locator(`[id="${describedBy.split(" ").at(-1)}"]`).textContent();
    expect(described).toContain("Enter a valid e-mail address.");
    await guard.close();
  });

  it("signs out from the account menu, after which pages ask to sign in again", async () => {
    const guard = await guardedContext(e2e.browser, e2e.server.url);
    const { page } = guard;
    await signIn(page, demoEmail("reviewer"));
    await page.getByRole("button", { name: /account menu/ }).click();
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL(/\/sign-in$/);

    await page.goto("/account");
    await page.waitForURL(/\/sign-in\?next=%2Faccount$/);
    await page.getByRole("heading", { level: 1, name: "Sign in to Rillmark" }).waitFor();
    expect(guard.offHostRequests).toEqual([]);
    await guard.close();
  });
});
