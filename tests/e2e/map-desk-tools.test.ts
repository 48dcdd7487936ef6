import path from "node:path";
import { type Page } from "playwright-core";
import { describe, expect, it } from "vitest";
import { guardedContext, type GuardedContext } from "./support/browser";
import { demoEmail, signIn } from "./support/demo";
import {
  openMapDesk,
  pathVersion,
  scenarioProject,
  totalsByMethod,
  waitForMapIdle,
} from "./support/map-desk";
import { useServerAndBrowser } from "./support/session";

const e2e = useServerAndBrowser();
const SLOW = { timeout: 20_000 };

interface SavedSubcatchment {
  flowPath: { version: number; geometry: { coordinates: [number, number][] } } | null;
  boundary: { type: string; coordinates: unknown } | null;
  outlet: { coordinates: [number, number] } | null;
  breaks: { sheetEnd: number | null; channelStart: number | null };
}

interface Desk {
  guard: GuardedContext;
  page: Page;
  subcatchmentId: string;
  /** The subcatchment as the API has it now. */
  saved: () => Promise<SavedSubcatchment>;
  /** A point on the map by its fraction of the map's width and height. */
  at: (fx: number, fy: number) => { x: number; y: number };
}

/** The demo engineer on the Map desk of a fresh copy of the demo scenario, its sheet computed. */
async function openDesk(prefix: string): Promise<Desk> {
  const guard = await guardedContext(e2e.browser, e2e.server.url);
  const { page } = guard;
  const project = await scenarioProject(e2e.browser, e2e.server.url, prefix);
  await signIn(page, demoEmail("engineer"));
  await openMapDesk(page, project.name);
  await page.getByRole("table", { name: "Travel time by segment" }).waitFor();
  await waitForMapIdle(page);
  const box = await page.getByTestId("desk-map").boundingBox();
  if (!box) throw new Error("the map has no size");
  const saved = async () => {
    const response = await page.request.get(`/api/subcatchments/${project.subcatchmentId}`);
    expect(response.ok()).toBe(true);
    return (await response.json()) as SavedSubcatchment;
  };
  const at = (fx: number, fy: number) => ({
    x: box.x + box.width * fx,
    y: box.y + box.height * fy,
  });
  return { guard, page, subcatchmentId: project.subcatchmentId, saved, at };
}

/** Clicks the points on the map, a little apart in time as a person would. */
async function clickAll(desk: Desk, points: readonly (readonly [number, number])[]) {
  for (const [fx, fy] of points) {
    const p = desk.at(fx, fy);
    await desk.page.mouse.click(p.x, p.y);
    await desk.page.waitForTimeout(150);
  }
}

const TRACE = [
  [0.45, 0.18],
  [0.47, 0.4],
  [0.5, 0.6],
  [0.52, 0.8],
] as const;

const coordsOf = (s: SavedSubcatchment) => s.flowPath?.geometry.coordinates ?? [];

describe("Map desk tools", () => {
  it("reverses the path, flags the wrong way on the sheet and reverses it back from there", async () => {
    const desk = await openDesk("Reverse path");
    const { page } = desk;
    const original = coordsOf(await desk.saved());
    const version = await pathVersion(page);
    expect(Object.keys(await totalsByMethod(page)).length).toBeGreaterThanOrEqual(3);

    await page.getByRole("button", { name: "Reverse path" }).click();
    await expect.poll(() => pathVersion(page), SLOW).toBe(version + 1);
    expect(coordsOf(await desk.saved())).toEqual([...original].reverse());
    // The outlet end is now the high end: the sheet says so and offers to turn it back.
    const note = page.getByRole("note").filter({ hasText: /drawn the wrong way/ });
    await note.waitFor();
    expect(await totalsByMethod(page)).toEqual({});

    await note.getByRole("button", { name: "Reverse the path" }).click();
    await expect.poll(() => pathVersion(page), SLOW).toBe(version + 2);
    expect(coordsOf(await desk.saved())).toEqual(original);
    expect(await note.count()).toBe(0);
    expect(Object.keys(await totalsByMethod(page)).length).toBeGreaterThanOrEqual(3);
    await desk.guard.close();
  });

  it("undoes a reversal: the path's first point, its breaks and every total come back", async () => {
    const desk = await openDesk("Undo reverse");
    const { page } = desk;
    const before = await desk.saved();
    const original = coordsOf(before);
    const totals = JSON.stringify(await totalsByMethod(page));
    const version = await pathVersion(page);

    await page.getByRole("button", { name: "Reverse path" }).click();
    await expect.poll(() => pathVersion(page), SLOW).toBe(version + 1);
    expect(coordsOf(await desk.saved())[0]).toEqual(original.at(-1));

    await page.getByRole("button", { name: "Undo" }).click();
    await expect.poll(async () => coordsOf(await desk.saved())[0], SLOW).toEqual(original[0]);
    expect(coordsOf(await desk.saved())).toEqual(original);
    await expect.poll(async () => (await desk.saved()).breaks, SLOW).toEqual(before.breaks);
    await expect.poll(async () => JSON.stringify(await totalsByMethod(page)), SLOW).toBe(totals);
    expect(await page.getByRole("button", { name: "Redo" }).isEnabled()).toBe(true);
    await desk.guard.close();
  });

  it("splits the path while it is traced, before it is finished, and forgets an unfinished one", async () => {
    const desk = await openDesk("Live trace");
    const { page } = desk;
    const version = await pathVersion(page);
    const savedVersion = (await desk.saved()).flowPath?.version;
    const preview = page.getByRole("table", { name: "Segments being drawn" });
    const rows = preview.locator("[data-live-segment]");
    // The last row's station to (the traced length so far), in feet on a US project.
    const tracedLength = async () => Number(await rows.last().locator("td").nth(2).textContent());

    await page.getByRole("button", { name: "Trace path" }).click();
    await clickAll(desk, TRACE.slice(0, 2));
    await rows.first().waitFor();
    expect(await preview.locator("caption").textContent()).toMatch(/not saved, not computed yet/);
    const lengths = await rows.locator("td:nth-child(4)").allTextContents();
    expect(lengths.length).toBeGreaterThanOrEqual(1);
    for (const l of lengths) expect(Number(l)).toBeGreaterThan(0);
    const afterTwo = await tracedLength();
    expect(afterTwo).toBeGreaterThan(0);

    // The pointer moving on alone changes nothing; the next click lengthens the split.
    const far = desk.at(0.6, 0.9);
    await page.mouse.move(far.x, far.y, { steps: 5 });
    expect(await tracedLength()).toBe(afterTwo);
    await clickAll(desk, TRACE.slice(2, 3));
    await expect.poll(tracedLength).toBeGreaterThan(afterTwo);
    expect(await page.getByRole("table", { name: "Travel time by segment" }).count()).toBe(0);

    // Escape leaves the trace unfinished: nothing was saved and the computed sheet is back.
    await page.keyboard.press("Escape");
    await page.getByRole("table", { name: "Travel time by segment" }).waitFor();
    expect(await preview.count()).toBe(0);
    expect(await pathVersion(page)).toBe(version);
    expect((await desk.saved()).flowPath?.version).toBe(savedVersion);
    await desk.guard.close();
  });

  it("undoes a traced path back to the one before it, and redoes it", async () => {
    const desk = await openDesk("Undo trace");
    const { page } = desk;
    const original = coordsOf(await desk.saved());
    const version = await pathVersion(page);
    const undo = page.getByRole("button", { name: "Undo" });
    const redo = page.getByRole("button", { name: "Redo" });
    expect(await undo.isDisabled()).toBe(true);

    await page.getByRole("button", { name: "Trace path" }).click();
    await clickAll(desk, TRACE);
    await page.keyboard.press("Enter");
    await expect.poll(() => pathVersion(page), SLOW).toBe(version + 1);
    const traced = coordsOf(await desk.saved());
    expect(traced).toHaveLength(TRACE.length);

    await undo.click();
    await expect.poll(() => pathVersion(page), SLOW).toBe(version + 2);
    expect(coordsOf(await desk.saved())).toEqual(original);
    expect(await redo.isEnabled()).toBe(true);

    await redo.click();
    await expect.poll(() => pathVersion(page), SLOW).toBe(version + 3);
    expect(coordsOf(await desk.saved())).toEqual(traced);
    expect(await redo.isDisabled()).toBe(true);
    await desk.guard.close();
  });

  it("undoes a moved break: the break and every method's total come back", async () => {
    const desk = await openDesk("Undo break");
    const { page } = desk;
    const before = await totalsByMethod(page);
    const breaksBefore = (await desk.saved()).breaks;

    const marker = page.locator('[data-break="sheetEnd"]');
    const mb = await marker.boundingBox();
    if (!mb) throw new Error("no break marker");
    const cx = mb.x + mb.width / 2;
    const cy = mb.y + mb.height / 2;
    // The marker snaps to the path wherever it is let go.
    await page.mouse.move(cx, cy);
    await page.mouse.down();
    await page.mouse.move(cx - 25, cy - 25, { steps: 8 });
    await page.mouse.up();
    await expect
      .poll(async () => (await desk.saved()).breaks.sheetEnd, SLOW)
      .not.toBe(breaksBefore.sheetEnd);
    await expect
      .poll(async () => JSON.stringify(await totalsByMethod(page)), SLOW)
      .not.toBe(JSON.stringify(before));

    await page.getByRole("button", { name: "Undo" }).click();
    await expect.poll(async () => (await desk.saved()).breaks, SLOW).toEqual(breaksBefore);
    await expect
      .poll(async () => JSON.stringify(await totalsByMethod(page)), SLOW)
      .toBe(JSON.stringify(before));
    await desk.guard.close();
  });

  it("places the outlet where the engineer clicks", async () => {
    const desk = await openDesk("Place outlet");
    const { page } = desk;
    const before = (await desk.saved()).outlet?.coordinates ?? null;

    await page.getByRole("button", { name: "Place outlet" }).click();
    await clickAll(desk, [[0.3, 0.7]]);
    await expect
      .poll(async () => JSON.stringify((await desk.saved()).outlet?.coordinates ?? null), SLOW)
      .not.toBe(JSON.stringify(before));
    const outlet = (await desk.saved()).outlet?.coordinates;
    expect(outlet).toHaveLength(2);
    await desk.guard.close();
  });

  it("outlines a new area: the subcatchment's area on the sheet changes", async () => {
    const desk = await openDesk("Outline area");
    const { page } = desk;
    const area = page.locator('[data-figure="Area"]');
    const areaBefore = await area.textContent();
    expect(areaBefore).toMatch(/^\d+\.\d{2} ac$/);

    await page.getByRole("button", { name: "Outline area" }).click();
    await clickAll(desk, [
      [0.3, 0.3],
      [0.7, 0.3],
      [0.7, 0.7],
      [0.3, 0.7],
    ]);
    await page.keyboard.press("Enter");
    await expect.poll(() => area.textContent(), SLOW).not.toBe(areaBefore);
    expect(await area.textContent()).toMatch(/^\d+\.\d{2} ac$/);
    const boundary = (await desk.saved()).boundary;
    expect(boundary?.type).toBe("Polygon");
    expect((boundary?.coordinates as unknown[][])[0]).toHaveLength(5);
    await desk.guard.close();
  });

  it("loads a path file holding one line, and names the problem with a file holding none", async () => {
    const desk = await openDesk("Load path");
    const { page } = desk;
    const version = (await desk.saved()).flowPath?.version ?? 0;

    // The GPX fixture's one track (its elevations are dropped: terrain and survey give them).
    await page
      .getByLabel("Load path file")
      .setInputFiles(path.resolve("tests/fixtures/geo/track.gpx"));
    await expect.poll(async () => (await desk.saved()).flowPath?.version, SLOW).toBe(version + 1);
    expect(coordsOf(await desk.saved())).toEqual([
      [-122.1995, 38.4035],
      [-122.199, 38.402],
      [-122.1975, 38.4005],
      [-122.1965, 38.4001],
    ]);
    await expect.poll(() => pathVersion(page), SLOW).toBe(version + 1);

    // Two soil polygons and no line: refused, and the desk says why.
    await page
      .getByLabel("Load path file")
      .setInputFiles(path.resolve("tests/fixtures/geo/soils.geojson"));
    await page
      .getByRole("alert")
      .filter({ hasText: "soils.geojson: expected exactly one line (the flow path), found 0." })
      .waitFor();
    expect((await desk.saved()).flowPath?.version).toBe(version + 1);
    await desk.guard.close();
  });

  it("asks, when someone saved the path meanwhile, and keeps the engineer's drawing on request", async () => {
    const desk = await openDesk("Keep mine");
    const { page } = desk;
    const theirs = coordsOf(await desk.saved()).slice(0, 12);
    const version = (await desk.saved()).flowPath?.version ?? 0;

    await page.getByRole("button", { name: "Trace path" }).click();
    await clickAll(desk, TRACE);
    // Someone else saves the path before this trace is finished.
    const put = await page.request.put(`/api/subcatchments/${desk.subcatchmentId}/flow-path`, {
      data: { geometry: { type: "LineString", coordinates: theirs }, version },
    });
    expect(put.ok()).toBe(true);
    await page.keyboard.press("Enter");
    const banner = page.getByRole("alert").filter({ hasText: "Someone saved this path" });
    await banner.waitFor(SLOW);
    expect(coordsOf(await desk.saved())).toEqual(theirs);

    await banner.getByRole("button", { name: "Keep my drawing" }).click();
    await expect.poll(() => pathVersion(page), SLOW).toBe(version + 2);
    expect(coordsOf(await desk.saved())).toHaveLength(TRACE.length);
    expect(await banner.count()).toBe(0);
    await desk.guard.close();
  });

  it("takes the path someone else saved meanwhile when the engineer asks for it", async () => {
    const desk = await openDesk("Take saved");
    const { page } = desk;
    const theirs = coordsOf(await desk.saved()).slice(0, 12);
    const version = (await desk.saved()).flowPath?.version ?? 0;

    await page.getByRole("button", { name: "Trace path" }).click();
    await clickAll(desk, TRACE);
    const put = await page.request.put(`/api/subcatchments/${desk.subcatchmentId}/flow-path`, {
      data: { geometry: { type: "LineString", coordinates: theirs }, version },
    });
    expect(put.ok()).toBe(true);
    await page.keyboard.press("Enter");
    const banner = page.getByRole("alert").filter({ hasText: "Someone saved this path" });
    await banner.waitFor(SLOW);

    await banner.getByRole("button", { name: "Use the saved path" }).click();
    // Their path stays; the sheet says it is behind the path and offers to compute it.
    await page.getByRole("button", { name: "Compute now" }).click();
    await expect.poll(() => pathVersion(page), SLOW).toBe(version + 1);
    expect(coordsOf(await desk.saved())).toEqual(theirs);
    expect(await banner.count()).toBe(0);
    await desk.guard.close();
  });
});
