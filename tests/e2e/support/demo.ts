import { type Page } from "playwright-core";
import { type Role } from "../../../shared/roles";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "../../../server/seed/demo";

export { DEMO_PASSWORD, DEMO_PROJECT, DEMO_TEAM_NAME } from "../../../server/seed/demo";

/** The seeded account of a role (see the README's demo accounts). */
export function demoEmail(role: Role): string {
  const account = DEMO_ACCOUNTS.find((a) => a.role === role);
  if (!account) throw new Error(`The demo seed has no ${role} account`);
  return account.email;
}

/** A name no earlier run used, so tests sharing the test database never collide. */
export function unique(prefix: string): string {
  return `${prefix}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 7)}`;
}

/** Signs in through the form, as a person would, and waits for the team's projects page. */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password", { exact: true }).fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(/\/teams\/[^/]+\/projects$/);
  await page.getByRole("heading", { level: 1, name: "Projects" }).waitFor();
}
