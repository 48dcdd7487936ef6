/** The Map desk tool tests' shared set-up: a fresh copy of the demo scenario on the desk. */
import { type Page } from "playwright-core";
import { expect } from "vitest";
import { guardedContext, type GuardedContext } from "./browser";
import { demoEmail, signIn } from "./demo";
import { openMapDesk, scenarioProject, waitForMapIdle } from "./map-desk";
import { type E2eSession } from "./session";

export const SLOW = { timeout: 20_000 };

export interface SavedSubcatchment {
  flowPath: { version: number; geometry: { coordinates: [number, number][] } } | null;
  boundary: { type: string; coordinates: unknown } | null;
  outlet: { coordinates: [number, number] } | null;
  breaks: { sheetEnd: number | null; channelStart: number | null };
}

export interface Desk {
  guard: GuardedContext;
  page: Page;
  subcatchmentId: string;
  /** The subcatchment as the API has it now. */
  saved: () => Promise<SavedSubcatchment>;
  /** A point on the map by its fraction of the map's width and height. */
  at: (fx: number, fy: number) => { x: number; y: number };
}

/** The demo engineer on the Map desk of a fresh copy of the demo scenario, its sheet computed. */
export async function openDesk(e2e: E2eSession, prefix: string): Promise<Desk> {
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
export async function clickAll(desk: Desk, points: readonly (readonly [number, number])[]) {
  for (const [fx, fy] of points) {
    const p = desk.at(fx, fy);
    await desk.page.mouse.click(p.x, p.y);
    await desk.page.waitForTimeout(150);
  }
}

export const TRACE = [
  [0.45, 0.18],
  [0.47, 0.4],
  [0.5, 0.6],
  [0.52, 0.8],
] as const;

export const coordsOf = (s: SavedSubcatchment) => s.flowPath?.geometry.coordinates ?? [];
