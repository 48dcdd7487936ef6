import { type Page } from "playwright-core";
import { describe, expect, it } from "vitest";
import { seriousAxeViolations } from "./support/axe";
import { guardedContext } from "./support/browser";
import { DEMO_PROJECT, demoEmail, signIn, unique } from "./support/demo";
import { connectDatabase } from "../../server/db/client";
import { createTeam, type TestTeam } from "../support/app";
import { saveScreenshot } from "./support/screenshots";
import { useServerAndBrowser } from "./support/session";

const e2e = useServerAndBrowser();

/** A team of the test's own (one member per role), so the demo team's catalog stays as seeded. */
async function ownTeam(tag: string): Promise<TestTeam> {
  const { pool, db } = connectDatabase(e2e.server.config.databaseUrl, 1);
  try {
    return await createTeam(db, tag);
  } finally {
    await pool.end();
  }
}

/** The Surface catalog through the main navigation, its classes listed. */
async function openCatalog(page: Page) {
  await page
    .getByRole("navigation", { name: "Main" })
    .getByRole("link", { name: "Surface catalog" })
    .click();
  await page.getByRole("heading", { level: 1, name: "Surface catalog" }).waitFor();
  const table = page.getByRole("table", { name: "Surface catalog classes" });
  await table.getByRole("row").nth(2).waitFor();
  return table;
}

describe("Surface catalog and the viewer's read-only pages", () => {
  it("lets an admin add a class with its sources and then edit a value", async () => {
    const { admin } = (await ownTeam("catalog")).members;
    const guard = await guardedContext(e2e.browser, e2e.server.url);
    const { page } = guard;
    await signIn(page, admin.email, admin.password);
    const table = await openCatalog(page);

    // A class of the team's own; the test never changes the published classes others use.
    const name = unique("Crushed shell lot");
    const key = name.toLowerCase().replace(/[^a-z0-9]+/g, "-");
    await page.getByRole("button", { name: "Add a class" }).click();
    const dialog = page.getByRole("dialog", { name: "Add a surface class" });
    await dialog.getByLabel("Class name").fill(name);
    await dialog.getByLabel("Key").fill(key);
    await dialog.getByLabel("Map colour").fill("#b59a6a");
    const n = dialog.getByRole("group", { name: "Manning's n, sheet flow" });
    await n.getByLabel("Value").fill("0.02");
    // A value without a source is refused where it is.
    await dialog.getByRole("button", { name: "Add class" }).click();
    await n.getByText("Say where the value comes from.").waitFor();
    await n.getByLabel("Source").fill("Team criteria, invented for a test");
    await dialog.getByLabel("CN, HSG B").fill("85");
    await dialog
      .getByRole("group", { name: /Curve number/ })
      .getByLabel("Source")
      .fill("Team criteria, invented for a test");
    await dialog.getByRole("button", { name: "Add class" }).click();

    const row = table
      .getByRole("row")
      .filter({ has: page.getByRole("rowheader", { name: new RegExp(name) }) });
    await row.waitFor();
    expect((await row.locator("td").allTextContents()).slice(0, 6)).toEqual([
      "0.02",
      "—",
      "—",
      "—",
      "—",
      "85",
    ]);
    const sourcesButton = row.getByRole("button", { name: `Sources of ${name}` });
    await sourcesButton.click();
    const sourcesId = await sourcesButton.getAttribute("aria-controls");
    await page
      .locator(`[id="${sourcesId}"]`)
      .getByText("Team criteria, invented for a test")
      .first()
      .waitFor();

    await row.getByRole("button", { name: `Edit ${name}` }).click();
    const edit = page.getByRole("dialog", { name: `Edit “${name}”` });
    await edit
      .getByRole("group", { name: "Manning's n, sheet flow" })
      .getByLabel("Value")
      .fill("0.025");
    await edit.getByRole("button", { name: "Save class" }).click();
    await edit.waitFor({ state: "hidden" });
    expect(await row.locator("td").first().textContent()).toBe("0.025");

    expect(await seriousAxeViolations(page)).toEqual([]);
    expect(guard.offHostRequests).toEqual([]);
    await guard.close();

    // The picture of the catalog is the demo team's, only looked at, as seeded.
    const demo = await guardedContext(e2e.browser, e2e.server.url);
    await signIn(demo.page, demoEmail("admin"));
    await openCatalog(demo.page);
    await saveScreenshot(demo.page, "surface-catalog");
    expect(demo.offHostRequests).toEqual([]);
    await demo.close();
  });

  it("shows a viewer every project page without edit controls, and the API refuses edits", async () => {
    const guard = await guardedContext(e2e.browser, e2e.server.url);
    const { page } = guard;
    await signIn(page, demoEmail("viewer"));
    await page.getByRole("link", { name: DEMO_PROJECT.name }).click();
    await page.getByRole("heading", { level: 1, name: DEMO_PROJECT.name }).waitFor();
    const projectId = /\/projects\/([^/]+)$/.exec(page.url())?.[1] ?? "";

    // Overview: the seeded subcatchment, its governing Tc and state; no form to add one.
    const subs = page.getByRole("table", { name: "Subcatchments of the project" });
    await subs.getByRole("row").nth(1).waitFor();
    await subs
      .getByText(/\d+\.\d min/)
      .first()
      .waitFor();
    expect(await page.getByRole("form", { name: "New subcatchment" }).count()).toBe(0);
    expect(await seriousAxeViolations(page)).toEqual([]);
    await saveScreenshot(page, "project-overview");

    const tabs = page.getByRole("navigation", { name: "Project pages" });
    await tabs.getByRole("link", { name: "Layers" }).click();
    await page.getByRole("table", { name: "Layers of the project" }).waitFor();
    expect(await page.getByRole("form", { name: "Upload a layer" }).count()).toBe(0);
    expect(await page.getByRole("button", { name: /^Delete / }).count()).toBe(0);
    expect(await seriousAxeViolations(page)).toEqual([]);

    await tabs.getByRole("link", { name: "Rainfall tables" }).click();
    await page.getByTestId("idf-chart").locator(".recharts-line").first().waitFor();
    expect(await page.getByRole("region", { name: "Add a rainfall table" }).count()).toBe(0);
    expect(await page.getByRole("button", { name: "Delete table" }).count()).toBe(0);
    expect(await seriousAxeViolations(page)).toEqual([]);

    await tabs.getByRole("link", { name: "Design rules" }).click();
    const rules = page.getByRole("form", { name: "Design rules" });
    await rules.waitFor();
    expect(await rules.getByRole("button", { name: "Save design rules" }).count()).toBe(0);
    expect(await rules.getByLabel("Minimum Tc (min)").isDisabled()).toBe(true);
    expect(await seriousAxeViolations(page)).toEqual([]);

    await page
      .getByRole("navigation", { name: "Main" })
      .getByRole("link", { name: "Surface catalog" })
      .click();
    await page.getByRole("table", { name: "Surface catalog classes" }).waitFor();
    expect(await page.getByRole("button", { name: /^Edit / }).count()).toBe(0);
    expect(await page.getByRole("button", { name: "Add a class" }).count()).toBe(0);
    expect(await seriousAxeViolations(page)).toEqual([]);

    // The server is the authority: the same edits straight to the API answer 403.
    const rulesNow = await page.request.get(`/api/projects/${projectId}/design-rules`);
    expect(rulesNow.status()).toBe(200);
    const put = await page.request.put(`/api/projects/${projectId}/design-rules`, {
      data: {
        rules: {},
        dualHsg: "drained",
        channelSlope: "end-to-end",
        profileSpacingM: 5,
        version: 0,
      },
    });
    expect(put.status()).toBe(403);
    const create = await page.request.post(`/api/projects/${projectId}/subcatchments`, {
      data: { name: unique("viewer try") },
    });
    expect(create.status()).toBe(403);
    expect(guard.offHostRequests).toEqual([]);
    await guard.close();
  });
});
