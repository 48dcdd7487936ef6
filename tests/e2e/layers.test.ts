import path from "node:path";
import { describe, expect, it } from "vitest";
import { seriousAxeViolations } from "./support/axe";
import { guardedContext } from "./support/browser";
import { demoEmail, signIn } from "./support/demo";
import { freshProject } from "./support/project";
import { saveScreenshot } from "./support/screenshots";
import { useServerAndBrowser } from "./support/session";

const e2e = useServerAndBrowser();
const COVER_ZIP = path.resolve("tests/fixtures/geo/cover-utm10.zip");

describe("Layers page", () => {
  it("lets the GIS specialist upload a cover layer, follow its progress and map its values", async () => {
    const { projectId } = await freshProject(e2e.browser, e2e.server.url, "Layers upload");
    const guard = await guardedContext(e2e.browser, e2e.server.url);
    const { page } = guard;
    await signIn(page, demoEmail("gis"));
    await page.goto(`/projects/${projectId}`);
    await page
      .getByRole("navigation", { name: "Project pages" })
      .getByRole("link", { name: "Layers" })
      .click();
    await page.getByRole("heading", { level: 1, name: "Layers" }).waitFor();

    const form = page.getByRole("form", { name: "Upload a layer" });
    await form.getByLabel("Kind of layer").selectOption("cover");
    await form.getByLabel("Layer name").fill("Cover from the fixture");
    await form.getByLabel("File").setInputFiles(COVER_ZIP);
    await form.getByRole("button", { name: "Upload layer" }).click();
    // The bar shows while the file goes up and is read; the notice once the layer is ready.
    await form.getByText(/“Cover from the fixture” is ready: 4 features/).waitFor();
    await form.getByRole("progressbar").waitFor();

    const list = page.getByRole("table", { name: "Layers of the project" });
    const row = list.getByRole("row").filter({ hasText: "Cover from the fixture" });
    await row.getByText("Ready").waitFor();
    // Not mapped yet: the layer lists it as a problem.
    await row.getByText(/Choose the field that holds the cover/).waitFor();

    await row.getByRole("button", { name: "Map values of Cover from the fixture" }).click();
    const mapping = page.getByRole("form", { name: "Mapping of Cover from the fixture" });
    await page.getByLabel("Field that holds the values").selectOption("NAME");
    const values = mapping.getByRole("table", { name: /Values of NAME/ });
    for (const v of ["woods", "range", "lawn", "pavement"]) {
      await values.getByRole("rowheader", { name: v }).waitFor();
    }
    // Leave "range" unmapped on purpose: it must stay listed as a problem.
    await mapping.getByLabel("range maps to").selectOption({ label: "Not mapped" });
    const lawnChoice = mapping.getByLabel("lawn maps to");
    const lawnOptions = await lawnChoice.locator("option").allTextContents();
    const grass = lawnOptions.find((o) => /lawn|grass|turf/i.test(o));
    expect(grass, `a lawn class among ${lawnOptions.join(", ")}`).toBeDefined();
    await lawnChoice.selectOption({ label: grass! });
    for (const v of ["woods", "pavement"]) {
      const chosen = await mapping.getByLabel(`${v} maps to`).inputValue();
      if (chosen === "") await mapping.getByLabel(`${v} maps to`).selectOption({ index: 1 });
    }
    await mapping.getByRole("button", { name: "Save mapping" }).click();
    await mapping.getByText("Mapping saved.").waitFor();

    await row.getByText(/Not mapped: range/).waitFor();
    expect(await row.textContent()).not.toMatch(/woods|lawn|pavement/);

    // The mapping reads back from the server after a reload.
    await page.reload();
    const again = page.getByRole("form", { name: "Mapping of Cover from the fixture" });
    expect(await again.getByLabel("range maps to").inputValue()).toBe("");
    expect(await again.getByLabel("lawn maps to").locator("option:checked").textContent()).toBe(
      grass,
    );

    expect(await seriousAxeViolations(page)).toEqual([]);
    await saveScreenshot(page, "layers-mapping");
    expect(guard.offHostRequests).toEqual([]);
    await guard.close();
  });

  it("shows the server's message, with the file, when an upload is refused", async () => {
    const { projectId } = await freshProject(e2e.browser, e2e.server.url, "Layers refusal");
    const guard = await guardedContext(e2e.browser, e2e.server.url);
    const { page } = guard;
    await signIn(page, demoEmail("gis"));
    await page.goto(`/projects/${projectId}/layers`);
    const form = page.getByRole("form", { name: "Upload a layer" });
    await form.getByLabel("File").setInputFiles(path.resolve("tests/fixtures/geo/no-prj.zip"));
    await form.getByRole("button", { name: "Upload layer" }).click();
    const alert = form.getByRole("alert");
    await alert.waitFor();
    expect(await alert.textContent()).toMatch(/\.prj/);
    // Nothing was kept.
    await page.getByText("No layers yet.").waitFor();
    await guard.close();
  });
});
