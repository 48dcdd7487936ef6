import { type Browser, type Page } from "playwright-core";
import { ApiClient } from "../../../server/seed/api-client";
import { loadDemoScenario } from "../../../server/seed/demo-geodata-steps";
import { DEMO_OUT_DIR } from "../../../server/seed/demo-scenario";
import { DEMO_PASSWORD, demoEmail } from "./demo";
import { freshProject } from "./project";

/**
 * From the projects list to the project's Map desk, waiting for the map to be drawn. Both links
 * match their names exactly: on a database earlier runs have used, other projects' names may
 * contain this project's name or the words "Map desk".
 */
export async function openMapDesk(page: Page, projectName: string): Promise<void> {
  await page.getByRole("link", { name: projectName, exact: true }).click();
  await page
    .getByRole("navigation", { name: "Project pages" })
    .getByRole("link", { name: "Map desk", exact: true })
    .click();
  await page.getByRole("heading", { level: 1, name: "Map desk" }).waitFor();
  await page.getByTestId("desk-map").locator("canvas").waitFor();
}

/** Each method's total Tc (min) as the sheet shows it, by method label. */
export async function totalsByMethod(page: Page): Promise<Record<string, string>> {
  const rows = page.getByRole("table", { name: "Tc by method" }).locator("tbody tr");
  const out: Record<string, string> = {};
  for (const row of await rows.all()) {
    const label = (await row.locator("th").getAttribute("data-label")) ?? "";
    const value = (await row.locator("[data-total-min]").textContent())?.trim() ?? "";
    if (label && value !== "—") out[label] = value;
  }
  return out;
}

/** The path version the sheet on screen was computed for (0 when there is none). */
export async function pathVersion(page: Page): Promise<number> {
  const status = (await page.getByTestId("sheet-status").textContent()) ?? "";
  const match = /^Computed .* path version (\d+)\./.exec(status);
  return match ? Number(match[1]) : 0;
}

/**
 * A fresh project holding the invented demo scenario (layers, rainfall, rules, one computed
 * subcatchment), loaded through the API as the seed does, so a test may edit it freely without
 * touching the demo project other files read.
 */
export async function scenarioProject(browser: Browser, baseURL: string, prefix: string) {
  const made = await freshProject(browser, baseURL, prefix);
  const gis = await ApiClient.signIn(baseURL, demoEmail("gis"), DEMO_PASSWORD);
  const engineer = await ApiClient.signIn(baseURL, demoEmail("engineer"), DEMO_PASSWORD);
  const subcatchmentId = await loadDemoScenario(
    { gis, engineer },
    { id: made.projectId, teamId: made.teamId },
    DEMO_OUT_DIR,
  );
  return { ...made, subcatchmentId };
}

/** Waits until the map has drawn everything it first asked for. */
export async function waitForMapIdle(page: Page): Promise<void> {
  await page.locator('[data-testid="desk-map"][data-idle="true"]').waitFor({ timeout: 30_000 });
}
