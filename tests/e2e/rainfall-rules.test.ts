import path from "node:path";
import { describe, expect, it } from "vitest";
import { seriousAxeViolations } from "./support/axe";
import { guardedContext } from "./support/browser";
import { demoEmail, signIn } from "./support/demo";
import { freshProject } from "./support/project";
import { saveScreenshot } from "./support/screenshots";
import { useServerAndBrowser } from "./support/session";

const e2e = useServerAndBrowser();
// Invented rainfall (tests/fixtures/geo/rainfall.csv): 4 return periods, 2-, 10-, 25-, 100-year.
const RAINFALL_CSV = path.resolve("tests/fixtures/geo/rainfall.csv");

describe("Rainfall tables and Design rules pages", () => {
  it("uploads a rainfall CSV and shows its table, the fitted curves over the points, and each fit", async () => {
    const { projectId } = await freshProject(e2e.browser, e2e.server.url, "Rainfall upload");
    const guard = await guardedContext(e2e.browser, e2e.server.url);
    const { page } = guard;
    await signIn(page, demoEmail("engineer"));
    await page.goto(`/projects/${projectId}/rainfall`);
    await page.getByText("No rainfall tables yet.").waitFor();

    const form = page.getByRole("form", { name: "Rainfall table from a CSV file" });
    await form.getByLabel("Table name").fill("Test IDF");
    await form.getByLabel(/2-year 24-hour depth/).fill("2.9");
    await form.getByLabel("Source").fill("Invented for an end-to-end test");
    await form.getByLabel("CSV file").setInputFiles(RAINFALL_CSV);
    await form.getByRole("button", { name: "Upload table" }).click();

    const view = page.getByRole("region", { name: "Test IDF" });
    const values = view.getByRole("table", { name: /Intensity \(in\/h\) by duration/ });
    await values.waitFor();
    expect(await values.getByRole("row").nth(1).textContent()).toMatch(
      /^5\s*4\.9\s*6\.6\s*7\.6\s*9\.2$/,
    );
    // One fitted curve and one set of points per return period, drawn by the chart.
    const chart = view.getByTestId("idf-chart");
    await chart.locator(".recharts-line").first().waitFor();
    expect(await chart.locator(".recharts-line").count()).toBe(4);
    expect(await chart.locator(".recharts-scatter").count()).toBe(4);
    const fits = view.getByRole("table", { name: /Fitted Sherman curves/ });
    for (const years of ["2-year", "10-year", "25-year", "100-year"]) {
      const row = fits
        .getByRole("row")
        .filter({ has: page.getByRole("rowheader", { name: years }) });
      // Cells: a, b, c, R², largest error. The invented table is smooth: a close fit.
      const cells = await row.locator("td").allTextContents();
      expect(cells).toHaveLength(5);
      expect(Number(cells[3])).toBeGreaterThan(0.99);
      expect(cells[4]).toMatch(/^\d+\.\d %$/);
    }
    // The only table of the project is the one the rules compute with.
    await page.getByRole("button", { name: /Test IDF.*design/ }).waitFor();

    expect(await seriousAxeViolations(page)).toEqual([]);
    await saveScreenshot(page, "rainfall-table");
    expect(guard.offHostRequests).toEqual([]);
    await guard.close();
  });

  it("saves the Design rules, and refuses a save over someone else's newer version", async () => {
    const { projectId } = await freshProject(e2e.browser, e2e.server.url, "Design rules");
    const guard = await guardedContext(e2e.browser, e2e.server.url);
    const { page } = guard;
    await signIn(page, demoEmail("engineer"));
    await page.goto(`/projects/${projectId}/rules`);
    const form = page.getByRole("form", { name: "Design rules" });
    await page.getByText("Never saved: the defaults below apply.").waitFor();
    // The source of a preset is shown beside its choice.
    await form.getByText(/Default: 100 ft \(NEH 630 Ch 15, 2010\)/).waitFor();

    await form.getByLabel("Minimum Tc (min)").fill("10");
    await form.getByLabel("Longest sheet flow").selectOption("300ft");
    await form.getByRole("button", { name: "Save design rules" }).click();
    await form.getByText("Design rules saved (version 1).").waitFor();

    let saved = (await (
      await page.request.get(`/api/projects/${projectId}/design-rules`)
    ).json()) as {
      rules: { minTcMin: number; sheetFlowMaxLength: string };
      dualHsg: string;
      channelSlope: string;
      rainfallTableId: string | null;
      profileSpacingM: number;
      version: number;
    };
    expect(saved.rules.minTcMin).toBe(10);
    expect(saved.rules.sheetFlowMaxLength).toBe("300ft");

    // A bad number is refused next to its field, before anything is sent.
    await form.getByLabel("Minimum Tc (min)").fill("500");
    await form.getByRole("button", { name: "Save design rules" }).click();
    await form.getByText("must be at most 120 min").waitFor();
    await form.getByLabel("Minimum Tc (min)").fill("12");

    // Someone else saves version 2 meanwhile.
    const other = await page.request.put(`/api/projects/${projectId}/design-rules`, {
      data: {
        rules: { ...saved.rules, minTcMin: 7 },
        dualHsg: saved.dualHsg,
        channelSlope: saved.channelSlope,
        rainfallTableId: saved.rainfallTableId,
        profileSpacingM: saved.profileSpacingM,
        version: 1,
      },
    });
    expect(other.status()).toBe(200);
    await form.getByRole("button", { name: "Save design rules" }).click();
    const conflict = form
      .getByRole("alert")
      .filter({ hasText: "Someone else changed these rules" });
    await conflict.waitFor();
    expect(await seriousAxeViolations(page)).toEqual([]);

    await conflict.getByRole("button", { name: "Reload the rules" }).click();
    // The reload refetches: wait for the form to show the other person's saved value.
    await expect
      .poll(() => form.getByLabel("Minimum Tc (min)").inputValue(), { timeout: 10_000 })
      .toBe("7");
    saved = (await (
      await page.request.get(`/api/projects/${projectId}/design-rules`)
    ).json()) as typeof saved;
    expect(saved.version).toBe(2);
    expect(saved.rules.minTcMin).toBe(7);
    await saveScreenshot(page, "design-rules");
    expect(guard.offHostRequests).toEqual([]);
    await guard.close();
  });
});
