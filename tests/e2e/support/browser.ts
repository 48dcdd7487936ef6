import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";

/**
 * Debian's Chromium, headless, with every host name but 127.0.0.1 unresolvable and background
 * services off, so nothing can reach the internet even by accident.
 */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    args: [
      "--host-resolver-rules=MAP * ~NOTFOUND , EXCLUDE 127.0.0.1",
      "--disable-quic",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
      "--no-first-run",
    ],
  });
}

export interface GuardedContext {
  context: BrowserContext;
  page: Page;
  /** Every request a page tried to send anywhere but 127.0.0.1 (each was aborted or refused). */
  offHostRequests: string[];
  /** URLs of font files the pages received from 127.0.0.1. */
  fontResponses: string[];
  close: () => Promise<void>;
}

const LOCAL_HOST = "127.0.0.1";

function isLocal(url: string): boolean {
  const { protocol, hostname } = new URL(url);
  if (protocol === "data:" || protocol === "blob:" || protocol === "about:") return true;
  return hostname === LOCAL_HOST;
}

/** A fresh browser profile (its own cookies) at 1280×800 that records and blocks off-host traffic. */
export async function guardedContext(browser: Browser, baseURL: string): Promise<GuardedContext> {
  const context = await browser.newContext({ baseURL, viewport: { width: 1280, height: 800 } });
  const offHostRequests: string[] = [];
  const fontResponses: string[] = [];

  await context.route("**/*", async (route) => {
    const url = route.request().url();
    if (isLocal(url)) return route.continue();
    offHostRequests.push(url);
    return route.abort("blockedbyclient");
  });
  context.on("response", (response) => {
    const url = response.url();
    if (/\.woff2?(\?|$)/.test(url) && response.ok() && isLocal(url)) fontResponses.push(url);
  });

  // Requests the page's Content-Security-Policy refuses never reach the network (nor the route
  // above); the page reports them as violations, and they count as attempts all the same.
  await context.exposeFunction("__rillmarkOffHost", (uri: string) => {
    if (/^(https?|wss?):/.test(uri) && !isLocal(uri)) {
      offHostRequests.push(`${uri} (refused by the Content-Security-Policy)`);
    }
  });
  await context.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (event) => {
      const report = (window as unknown as Record<string, (uri: string) => void>).__rillmarkOffHost;
      report?.(event.blockedURI);
    });
  });

  const page = await context.newPage();
  return { context, page, offHostRequests, fontResponses, close: () => context.close() };
}
