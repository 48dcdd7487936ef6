import AxeBuilder from "@axe-core/playwright";
import { type Page } from "playwright-core";

/**
 * axe-core's serious and critical findings on the page as it stands (WCAG 2.1 A and AA rules
 * plus axe's best practices), each as "rule: target" so a failure names the element.
 */
export async function seriousAxeViolations(page: Page): Promise<string[]> {
  const results = await new AxeBuilder({ page }).analyze();
  return results.violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .flatMap((v) => v.nodes.map((n) => `${v.id} (${v.impact}): ${n.target.join(" ")}`));
}
