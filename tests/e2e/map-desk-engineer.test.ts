import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { guardedContext } from "./support/browser";
import { demoEmail, signIn } from "./support/demo";
import {
  openMapDesk,
  pathVersion,
  scenarioProject,
  totalsByMethod,
  waitForMapIdle,
} from "./support/map-desk";
import { saveScreenshot } from "./support/screenshots";
import { useServerAndBrowser } from "./support/session";

const e2e = useServerAndBrowser();

describe("Map desk, engineer", () => {
  it("traces a path, moves a break, types a surveyed elevation and exports the same numbers", async () => {
    const guard = await guardedContext(e2e.browser, e2e.server.url);
    const { page } = guard;
    const project = await scenarioProject(e2e.browser, e2e.server.url, "Path tracing");
    await signIn(page, demoEmail("engineer"));
    await openMapDesk(page, project.name);
    const sheet = page.getByRole("region", { name: "Travel-time sheet" });
    await sheet.getByRole("table", { name: "Travel time by segment" }).waitFor();
    await waitForMapIdle(page);
    await saveScreenshot(page, "map-desk");

    // Trace a new path across the subcatchment by clicking on the map, Enter to finish.
    await page.getByRole("button", { name: "Trace path" }).click();
    const box = await page.getByTestId("desk-map").boundingBox();
    if (!box) throw new Error("the map has no size");
    const at = (fx: number, fy: number) => ({
      x: box.x + box.width * fx,
      y: box.y + box.height * fy,
    });
    const versionBefore = await pathVersion(page);
    // The map opens on the subcatchment: from near its top (the divide) down toward the outlet.
    for (const [fx, fy] of [
      [0.45, 0.18],
      [0.47, 0.4],
      [0.5, 0.6],
      [0.52, 0.8],
    ] as const) {
      const p = at(fx, fy);
      await page.mouse.click(p.x, p.y);
      await page.waitForTimeout(150);
    }
    await page.keyboard.press("Enter");
    // The live split shows at once, then the server's sheet with every method's total.
    await page.locator("[data-live-segment]").first().waitFor();
    await expect.poll(() => pathVersion(page), { timeout: 20_000 }).toBeGreaterThan(versionBefore);
    await page.getByRole("table", { name: "Travel time by segment" }).waitFor();
    const before = await totalsByMethod(page);
    expect(Object.keys(before).length).toBeGreaterThanOrEqual(3);
    const segmentRows = page.locator("[data-segment]");
    expect(await segmentRows.count()).toBeGreaterThanOrEqual(1);

    // Measure two points on the map: the length shows under the tools.
    await page.getByRole("button", { name: "Measure" }).click();
    for (const [fx, fy] of [
      [0.2, 0.5],
      [0.8, 0.5],
    ] as const) {
      const p = at(fx, fy);
      await page.mouse.click(p.x, p.y);
    }
    await page.keyboard.press("Enter");
    await page.getByText(/^Measured: \d+\.\d ft$/).waitFor();
    await page.getByRole("button", { name: "Pan" }).click();

    // Drag the end of sheet flow along the path: the totals change.
    const marker = page.locator('[data-break="sheetEnd"]');
    await marker.waitFor();
    const mb = await marker.boundingBox();
    if (!mb) throw new Error("no break marker");
    // Toward the divide: a shorter stretch of sheet flow (the first click was the divide).
    const start = at(0.45, 0.18);
    const cx = mb.x + mb.width / 2;
    const cy = mb.y + mb.height / 2;
    const end = { x: start.x + (cx - start.x) * 0.45, y: start.y + (cy - start.y) * 0.45 };
    await page.mouse.move(cx, cy);
    await page.mouse.down();
    await page.mouse.move(end.x, end.y, { steps: 12 });
    await page.mouse.up();
    await expect
      .poll(async () => JSON.stringify(await totalsByMethod(page)), { timeout: 20_000 })
      .not.toBe(JSON.stringify(before));

    // Type a surveyed elevation at the top of the first segment: its slope changes.
    await expect
      .poll(() => page.getByTestId("sheet-status").textContent(), { timeout: 20_000 })
      .toMatch(/Computed/);
    const first = page.locator('[data-segment="0"]');
    const slopeBefore = await first.locator('[data-column="slope"]').textContent();
    const up = first.getByLabel("Segment 1 elevation up");
    const current = Number(await up.inputValue());
    await up.fill((current + 25).toFixed(2));
    await up.press("Enter");
    await expect
      .poll(() => first.locator('[data-column="slope"]').textContent(), { timeout: 20_000 })
      .not.toBe(slopeBefore);
    await expect
      .poll(() => page.getByTestId("sheet-status").textContent(), { timeout: 20_000 })
      .toMatch(/Computed/);

    // The CSV has the sheet's numbers.
    const shown = await totalsByMethod(page);
    const slopeShown = await first.locator('[data-column="slope"]').textContent();
    const [download] = await Promise.all([
      page.waitForEvent("download"),
      page.getByRole("link", { name: "Download CSV" }).click(),
    ]);
    const stream = await download.createReadStream();
    const chunks: Buffer[] = [];
    for await (const c of stream) chunks.push(c as Buffer);
    const rows = Papa.parse<string[]>(
      Buffer.concat(chunks)
        .toString("utf8")
        .replace(/^\uFEFF/, ""),
    ).data;
    const titles = rows.findIndex((r) => r[0] === "Segment");
    const slopeCol = rows[titles]!.indexOf("Slope");
    expect(Number(rows[titles + 2]![slopeCol]).toFixed(5)).toBe(slopeShown?.trim());
    for (const [label, min] of Object.entries(shown)) {
      const row = rows.find((r) => r[0] === label);
      expect(row, label).toBeDefined();
      expect(Number(row![2]).toFixed(2)).toBe(min);
    }
    await saveScreenshot(page, "map-desk-edited");
    // The plots: profile, Tc by method and the kinematic-wave rainfall solve with its iterates.
    await page.getByRole("figure", { name: "Longitudinal profile" }).waitFor();
    await page.getByRole("figure", { name: "Tc by method" }).waitFor();
    const solve = page.getByRole("figure", { name: "Kinematic-wave rainfall solve" });
    await solve.scrollIntoViewIfNeeded();
    expect(await solve.textContent()).toMatch(/Solution: tc = \d+\.\d\d min/);
    await saveScreenshot(page, "map-desk-charts");
    expect(guard.offHostRequests).toEqual([]);
    await guard.close();
  });
});
