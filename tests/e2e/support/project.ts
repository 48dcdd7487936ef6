import { type Browser } from "playwright-core";
import { guardedContext } from "./browser";
import { demoEmail, signIn, unique } from "./demo";

/**
 * A fresh project in the demo team, made through the API by the demo engineer, so a test that
 * uploads or saves never changes the demo project other test files read.
 */
export async function freshProject(
  browser: Browser,
  baseURL: string,
  prefix: string,
  units: "us" | "si" = "us",
): Promise<{ projectId: string; teamId: string; name: string }> {
  const guard = await guardedContext(browser, baseURL);
  try {
    await signIn(guard.page, demoEmail("engineer"));
    const teamId = /\/teams\/([^/]+)\/projects$/.exec(guard.page.url())?.[1];
    if (!teamId) throw new Error(`No team in ${guard.page.url()}`);
    const name = unique(prefix);
    const response = await guard.page.request.post(`/api/teams/${teamId}/projects`, {
      data: {
        name,
        units,
        designReturnPeriodYears: 10,
        description: "Made by an end-to-end test.",
      },
    });
    if (!response.ok()) throw new Error(`Project not created: ${await response.text()}`);
    const { id } = (await response.json()) as { id: string };
    return { projectId: id, teamId, name };
  } finally {
    await guard.close();
  }
}
