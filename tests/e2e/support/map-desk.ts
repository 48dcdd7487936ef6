import { type Page } from "playwright-core";

/** From the projects list to the project's Map desk, waiting for the map to be drawn. */
export async function openMapDesk(page: Page, projectName: string): Promise<void> {
  await page.getByRole("link", { name: projectName }).first().click();
  await page.getByRole("link", { name: "Map desk" }).click();
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
