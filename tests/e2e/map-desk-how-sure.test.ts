/**
 * The travel-time sheet says how several sheet segments were combined (and what the other
 * rules give) and how sure each Tc is. The invented demo's sheet flow runs over one surface, so
 * the test gives the top of its path another surface through the API first.
 */
import { describe, expect, it } from "vitest";
import { ApiClient } from "../../server/seed/api-client";
import { guardedContext } from "./support/browser";
import { DEMO_PASSWORD, demoEmail, signIn } from "./support/demo";
import { openMapDesk, scenarioProject } from "./support/map-desk";
import { useServerAndBrowser } from "./support/session";

const e2e = useServerAndBrowser();

describe("Map desk, how sure", () => {
  it("shows the multi-surface note with the other rules' Tc, and each Tc's band", async () => {
    const project = await scenarioProject(e2e.browser, e2e.server.url, "How sure");
    const api = await ApiClient.signIn(e2e.server.url, demoEmail("engineer"), DEMO_PASSWORD);
    const classes = await api.get<Array<{ id: string; key: string }>>(
      `/projects/${project.projectId}/surface-classes`,
    );
    const range = classes.find((c) => c.key === "range-natural");
    const sub = await api.get<{ flowPath: { version: number }; lengthUnit: string }>(
      `/subcatchments/${project.subcatchmentId}`,
    );
    if (!range) throw new Error("the demo catalog has no range-natural class");
    await api.json("PUT", `/subcatchments/${project.subcatchmentId}/surface-overrides`, {
      entries: [{ stationFrom: 0, stationTo: 40, surfaceClassId: range.id, note: "e2e" }],
      version: sub.flowPath.version,
    });
    await api.json("POST", `/subcatchments/${project.subcatchmentId}/compute`, {});

    const guard = await guardedContext(e2e.browser, e2e.server.url);
    const { page } = guard;
    await signIn(page, demoEmail("engineer"));
    await openMapDesk(page, project.name);
    const sheet = page.getByRole("region", { name: "Travel-time sheet" });
    const note = sheet.getByTestId("overland-series");
    await note.waitFor();
    await expect.poll(() => note.textContent()).toMatch(/Sheet flow runs over 2 segments/);
    expect(await note.locator('[data-series="kinematic-wave"]').textContent()).toMatch(
      /planes in series.*each segment its own plane from zero flow.*\d+\.\d\d min/,
    );
    const band = sheet.getByTestId("tc-band").locator('[data-band="governing"]');
    expect(await band.textContent()).toMatch(/P10 [\d.]+ · P50 [\d.]+ · P90 [\d.]+ min/);
    expect(await sheet.locator('[data-band="nrcs-segmental"]').textContent()).toMatch(
      /^\d+\.\d–\d+\.\d$/,
    );
    expect(await sheet.locator("[data-tornado^='tcMin:']").count()).toBe(7);
    expect(await sheet.getByTestId("rational-formula").textContent()).toMatch(/× 1\.00833 = /);
    expect(guard.offHostRequests).toEqual([]);
    await guard.close();
    // Loading the invented scenario into a project of its own takes most of the time.
  }, 120_000);
});
