import { type Page } from "playwright-core";
import { connectDatabase } from "../../../server/db/client";
import { latestMailTo, tokenFromMail } from "../../support/app";

/**
 * Opens the newest Outbox message whose list entry mentions every one of `texts`, and returns
 * the address of the link in it that matches `linkPattern`. The page must be signed in as the
 * recipient, or as an owner or admin of the team the message was sent for.
 */
export async function linkFromOutbox(
  page: Page,
  texts: readonly string[],
  linkPattern: RegExp,
): Promise<string> {
  await page
    .getByRole("navigation", { name: "Main" })
    .getByRole("link", { name: "Outbox" })
    .click();
  let entry = page.getByRole("navigation", { name: "Sent messages" }).getByRole("link");
  for (const text of texts) entry = entry.filter({ hasText: text });
  // Mail is sent after the request that caused it has answered: ask again until it is there.
  for (let attempt = 0; ; attempt++) {
    try {
      await entry.first().waitFor({ timeout: 1_000 });
      break;
    } catch (error) {
      if (attempt >= 20) throw error;
      await page.getByRole("button", { name: "Check for new mail" }).click();
    }
  }
  await entry.first().click();
  const link = page.getByRole("article").getByRole("link", { name: linkPattern });
  const href = await link.getAttribute("href");
  if (!href) throw new Error(`The message has no link matching ${linkPattern}`);
  return href;
}

/**
 * The link (to `serverUrl` + `path`) in the newest stored message to `to`: mail that nobody in
 * the app may read (a confirmation to an address with no account yet), taken from the store as
 * the machine's operator would with `npm run outbox`.
 */
export async function linkFromStoredMail(
  databaseUrl: string,
  serverUrl: string,
  to: string,
  path: string,
): Promise<string> {
  const { pool, db } = connectDatabase(databaseUrl, 1);
  try {
    return `${serverUrl}${path}/${tokenFromMail(await latestMailTo(db, to), path, serverUrl)}`;
  } finally {
    await pool.end();
  }
}
