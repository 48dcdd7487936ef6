import path from "node:path";
import { describe, expect, it } from "vitest";
import { SLOW, TRACE, clickAll, coordsOf, openDesk } from "./support/desk-tools";
import { pathVersion, totalsByMethod } from "./support/map-desk";
import { useServerAndBrowser } from "./support/session";

const e2e = useServerAndBrowser();

describe("Map desk tools", () => {
  it("reverses the path, flags the wrong way on the sheet and reverses it back from there", async () => {
    const desk = await openDesk(e2e, "Reverse path");
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

  it("splits the path while it is traced, before it is finished, and forgets an unfinished one", async () => {
    const desk = await openDesk(e2e, "Live trace");
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

  it("places the outlet where the engineer clicks", async () => {
    const desk = await openDesk(e2e, "Place outlet");
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
    const desk = await openDesk(e2e, "Outline area");
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
    const desk = await openDesk(e2e, "Load path");
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
    const desk = await openDesk(e2e, "Keep mine");
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
    const desk = await openDesk(e2e, "Take saved");
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
