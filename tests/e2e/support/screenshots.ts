import { mkdirSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { type Page } from "playwright-core";

/**
 * Saves a screenshot for the docs only when asked (UPDATE_SCREENSHOTS=1), so an ordinary test
 * run never rewrites tracked files; otherwise it goes to a temp folder for a look after a run.
 */
export async function saveScreenshot(page: Page, name: string): Promise<string> {
  const dir =
    process.env.UPDATE_SCREENSHOTS === "1"
      ? path.resolve("docs/screenshots")
      : path.join(os.tmpdir(), "rillmark-e2e-screenshots");
  mkdirSync(dir, { recursive: true });
  const file = path.join(dir, `${name}.png`);
  await page.screenshot({ path: file, scale: "css", animations: "disabled", caret: "hide" });
  return file;
}
