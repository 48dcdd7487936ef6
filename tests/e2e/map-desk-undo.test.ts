import { describe, expect, it } from "vitest";
import { SLOW, TRACE, clickAll, coordsOf, openDesk } from "./support/desk-tools";
import { pathVersion, totalsByMethod } from "./support/map-desk";
import { useServerAndBrowser } from "./support/session";

const e2e = useServerAndBrowser();

describe("Map desk undo and redo", () => {
  it("undoes a reversal: the path's first point, its breaks and every total come back", async () => {
    const desk = await openDesk(e2e, "Undo reverse");
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

  it("undoes a traced path back to the one before it, and redoes it", async () => {
    const desk = await openDesk(e2e, "Undo trace");
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
    const desk = await openDesk(e2e, "Undo break");
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
});
