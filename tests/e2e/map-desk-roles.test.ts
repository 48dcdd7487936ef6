import path from "node:path";
import { PNG } from "pngjs";
import { describe, expect, it } from "vitest";
import { ApiClient } from "../../server/seed/api-client";
import { seriousAxeViolations } from "./support/axe";
import { guardedContext } from "./support/browser";
import { DEMO_PASSWORD, DEMO_PROJECT, demoEmail, signIn } from "./support/demo";
import { openMapDesk, totalsByMethod, waitForMapIdle } from "./support/map-desk";
import { freshProject } from "./support/project";
import { saveScreenshot } from "./support/screenshots";
import { useServerAndBrowser } from "./support/session";

const e2e = useServerAndBrowser();

interface CatalogClass {
  id: string;
  key: string;
  values: { colour: string };
}

/** Pixels of the PNG within 2 levels per channel of a #rrggbb colour. */
function pixelsOf(png: PNG, hex: string): number {
  const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16)) as [
    number,
    number,
    number,
  ];
  let count = 0;
  for (let i = 0; i < png.data.length; i += 4) {
    const d = png.data;
    if (Math.abs(d[i]! - r) <= 2 && Math.abs(d[i + 1]! - g) <= 2 && Math.abs(d[i + 2]! - b) <= 2) {
      count += 1;
    }
  }
  return count;
}

describe("Map desk by role", () => {
  it("shows a viewer the map, the sheet and the exports, with no way to edit", async () => {
    const guard = await guardedContext(e2e.browser, e2e.server.url);
    const { page } = guard;
    await signIn(page, demoEmail("viewer"));
    await openMapDesk(page, DEMO_PROJECT.name);
    await waitForMapIdle(page);
    await page.getByRole("table", { name: "Travel time by segment" }).waitFor();
    expect(Object.keys(await totalsByMethod(page)).length).toBeGreaterThanOrEqual(3);
    expect(await page.locator("[data-segment]").count()).toBeGreaterThanOrEqual(1);

    // No drawing tools, no editable cells, no compute button.
    expect(await page.getByRole("toolbar", { name: "Drawing tools" }).count()).toBe(0);
    expect(await page.getByRole("button", { name: "Trace path" }).count()).toBe(0);
    expect(await page.getByLabel(/Segment \d+ elevation up/).count()).toBe(0);
    expect(await page.getByLabel(/Segment \d+ flow regime/).count()).toBe(0);
    expect(await page.getByRole("button", { name: "Compute now" }).count()).toBe(0);

    // Exports work for viewers.
    const [download] = await Promise.all([
      page.waitForEvent("download"),
      page.getByRole("link", { name: "Download XLSX" }).click(),
    ]);
    expect(download.suggestedFilename()).toMatch(/\.xlsx$/);

    // And the API refuses an edit even when sent by hand.
    const projectId = /\/projects\/([^/]+)\/map/.exec(page.url())?.[1] ?? "";
    const list = await page.request.get(`/api/projects/${projectId}/subcatchments`);
    const [first] = (await list.json()) as { id: string; flowPath: { version: number } }[];
    const refused = await page.request.put(`/api/subcatchments/${first!.id}/flow-path`, {
      data: {
        geometry: {
          type: "LineString",
          coordinates: [
            [0, 0],
            [0.001, 0.001],
          ],
        },
        version: first!.flowPath.version,
      },
    });
    expect(refused.status()).toBe(403);

    expect(await seriousAxeViolations(page)).toEqual([]);
    expect(guard.offHostRequests).toEqual([]);
    await guard.close();
  });

  it("gives the engineer's desk, tools and editable cells showing, no serious axe finding", async () => {
    const guard = await guardedContext(e2e.browser, e2e.server.url);
    const { page } = guard;
    await signIn(page, demoEmail("engineer"));
    await openMapDesk(page, DEMO_PROJECT.name);
    await waitForMapIdle(page);
    await page.getByRole("toolbar", { name: "Drawing tools" }).waitFor();
    await page.getByLabel("Segment 1 elevation up").waitFor();
    await page.getByLabel("Segment 1 flow regime").waitFor();
    // The layer panel's toggles, opacity sliders and legend are part of the page too.
    await page.getByText("Layers and legend").click();
    await page.getByRole("checkbox", { name: "Basemap" }).waitFor();
    expect(await seriousAxeViolations(page)).toEqual([]);
    expect(guard.offHostRequests).toEqual([]);
    await guard.close();
  });

  it("draws a cover layer the GIS specialist uploaded and mapped in its classes' colours", async () => {
    const { projectId, teamId, name } = await freshProject(
      e2e.browser,
      e2e.server.url,
      "Cover colours",
    );
    const gis = await ApiClient.signIn(e2e.server.url, demoEmail("gis"), DEMO_PASSWORD);
    const sent = await gis.upload<{ id: string }>(
      `/projects/${projectId}/layers`,
      path.resolve("tests/fixtures/geo/cover-utm10.zip"),
      { kind: "cover", name: "Cover for the map" },
    );
    const ready = await gis.get<{ status: string }>(`/layers/${sent.body.id}?waitMs=20000`);
    expect(ready.status).toBe("ready");
    // Three classes of clearly different colours for the fixture's values.
    const classes = await gis.get<CatalogClass[]>(`/teams/${teamId}/surface-classes`);
    const picked: CatalogClass[] = [];
    for (const c of classes) {
      if (picked.every((p) => p.values.colour.toLowerCase() !== c.values.colour.toLowerCase()))
        picked.push(c);
      if (picked.length === 3) break;
    }
    const values = ["woods", "lawn", "pavement", "range"];
    await gis.json("PUT", `/layers/${sent.body.id}/mapping`, {
      field: "NAME",
      entries: values.map((value, i) => ({ value, surfaceClassId: picked[i % 3]!.id })),
    });

    const guard = await guardedContext(e2e.browser, e2e.server.url);
    const { page } = guard;
    await signIn(page, demoEmail("gis"));
    await openMapDesk(page, name);
    await waitForMapIdle(page);
    // Cover at full strength over nothing else, so its pixels are the classes' own colours.
    await page.getByText("Layers and legend").click();
    await page.getByRole("checkbox", { name: "Basemap" }).uncheck();
    await page.getByLabel("Cover opacity").fill("1");
    await page.waitForTimeout(1000);
    const png = PNG.sync.read(await page.getByTestId("desk-map").screenshot());
    for (const c of picked) {
      expect(pixelsOf(png, c.values.colour), `${c.key} ${c.values.colour}`).toBeGreaterThan(200);
    }
    await saveScreenshot(page, "map-desk-cover");
    expect(guard.offHostRequests).toEqual([]);
    await guard.close();
  });
});
