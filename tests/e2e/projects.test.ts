import { describe, expect, it } from "vitest";
import { guardedContext } from "./support/browser";
import { DEMO_PROJECT, demoEmail, signIn, unique } from "./support/demo";
import { saveScreenshot } from "./support/screenshots";
import { useServerAndBrowser } from "./support/session";

const e2e = useServerAndBrowser();

describe("projects", () => {
  it("lets an engineer create a project and see it listed, with every request on 127.0.0.1", async () => {
    const guard = await guardedContext(e2e.browser, e2e.server.url);
    const { page } = guard;
    await signIn(page, demoEmail("engineer"));

    const list = page.getByRole("table", { name: /^Projects of / });
    await list.getByRole("link", { name: DEMO_PROJECT.name }).waitFor();

    const name = unique("Culvert Lane");
    const form = page.getByRole("form", { name: "New project" });
    await form.getByLabel("Project name").fill(name);
    await form.getByRole("radio", { name: /^SI/ }).check();
    await form.getByLabel("Design return period").selectOption("50");
    await form.getByLabel("Description").fill("Created by the end-to-end test.");
    await form.getByRole("button", { name: "Create project" }).click();

    const row = list.getByRole("row").filter({ has: page.getByRole("link", { name }) });
    await row.waitFor();
    expect(await row.textContent()).toMatch(/SI.*50-year/);

    // The list comes from the server, not only from the page's memory.
    await page.reload();
    await list.getByRole("link", { name }).waitFor();
    await saveScreenshot(page, "projects");

    await list.getByRole("link", { name }).click();
    await page.getByRole("heading", { level: 1, name }).waitFor();
    await page.getByText("No subcatchments yet").waitFor();

    expect(guard.offHostRequests).toEqual([]);
    await guard.close();
  });

  it("shows a viewer the projects but not the create-project form", async () => {
    const guard = await guardedContext(e2e.browser, e2e.server.url);
    const { page } = guard;
    await signIn(page, demoEmail("viewer"));

    const list = page.getByRole("table", { name: /^Projects of / });
    await list.getByRole("link", { name: DEMO_PROJECT.name }).waitFor();
    await page.getByRole("complementary", { name: "About your role" }).waitFor();

    expect(await page.getByRole("form", { name: "New project" }).count()).toBe(0);
    expect(await page.getByRole("button", { name: "Create project" }).count()).toBe(0);
    expect(await page.getByLabel("Project name").count()).toBe(0);
    expect(guard.offHostRequests).toEqual([]);
    await guard.close();
  });
});
