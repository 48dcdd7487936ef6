import { type Browser } from "playwright-core";
import { afterAll, beforeAll } from "vitest";
import { type RunningRillmark } from "../../../server/main";
import { launchBrowser } from "./browser";
import { startServer } from "./server";

export interface E2eSession {
  readonly server: RunningRillmark;
  readonly browser: Browser;
}

/**
 * Registers the hooks every end-to-end file needs: Rillmark in this process and one headless
 * Chromium, both closed after the file. Read the fields inside tests, once the hooks have run.
 */
export function useServerAndBrowser(): E2eSession {
  let server: RunningRillmark | undefined;
  let browser: Browser | undefined;
  beforeAll(async () => {
    server = await startServer();
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });
  const ready = <T>(value: T | undefined, what: string): T => {
    if (value === undefined) throw new Error(`${what} is not started yet (use it inside a test)`);
    return value;
  };
  return {
    get server() {
      return ready(server, "the Rillmark server");
    },
    get browser() {
      return ready(browser, "Chromium");
    },
  };
}
