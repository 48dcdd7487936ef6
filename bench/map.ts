/**
 * Map desk benchmark (run by `npm run bench`, or alone with `DATABASE_URL=… npx tsx bench/map.ts`):
 * builds the client, then
 *  - the JavaScript the sign-in page loads before it can paint (the entry chunk and every chunk
 *    it imports statically, gzipped as a server would send them) — target under 250 KB;
 *  - the Map desk's own chunks (loaded with its route only), for reference;
 *  - the first map idle: headless Chromium (Debian's, SwiftShader) signed in as the demo
 *    engineer opens the demo project's Map desk with an empty cache, timed from navigation to
 *    maplibre's first "idle" (every tile, the sheet and the overlays drawn) — target under 3 s.
 *    Median of three cold starts on localhost.
 */
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { gzipSync } from "node:zlib";
import { chromium } from "playwright-core";
import { execFileSync } from "node:child_process";
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_PROJECT } from "../server/seed/demo";
import type { BenchRow } from "./table";

const DIST = path.resolve("dist/client");
const SIGN_IN_TARGET_KB = 250;
const IDLE_TARGET_MS = 3000;
const CHROMIUM = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";

const gzKb = (file: string) => gzipSync(readFileSync(file)).length / 1024;

/** The chunk and every chunk it imports statically (dynamic import() calls are not followed). */
function staticGraph(entry: string, seen = new Set<string>()): Set<string> {
  if (seen.has(entry)) return seen;
  seen.add(entry);
  const code = readFileSync(entry, "utf8");
  const imports = code.matchAll(
    /(?:^|[;\s}])import\s*(?:[\w$*{}\s,]+from\s*)?["']([^"']+\.js)["']/g,
  );
  for (const [, spec] of imports) {
    if (spec) staticGraph(path.resolve(path.dirname(entry), spec), seen);
  }
  return seen;
}

function bundleRows(): BenchRow[] {
  const html = readFileSync(path.join(DIST, "index.html"), "utf8");
  const entry = /<script type="module"[^>]*src="([^"]+)"/.exec(html)?.[1];
  if (!entry) return [{ name: "sign-in page JavaScript", value: "no entry script in index.html" }];
  const graph = staticGraph(path.join(DIST, entry));
  const kb = [...graph].reduce((sum, f) => sum + gzKb(f), 0);
  const css = [...html.matchAll(/<link rel="stylesheet"[^>]*href="([^"]+)"/g)].reduce(
    (sum, [, href]) => sum + (href ? gzKb(path.join(DIST, href)) : 0),
    0,
  );
  const entryCode = readFileSync(path.join(DIST, entry), "utf8");
  // The Map desk's chunk is named after its page; its static graph minus the initial one.
  const deskFile = /MapDeskPage-[\w-]+\.js/.exec(entryCode)?.[0];
  const rows: BenchRow[] = [
    {
      name: `sign-in page JavaScript, gzipped (${graph.size} chunks)`,
      value: kb.toFixed(1),
      unit: "KB",
      target: `< ${SIGN_IN_TARGET_KB} KB`,
      ok: kb < SIGN_IN_TARGET_KB,
    },
    { name: "sign-in page CSS, gzipped", value: css.toFixed(1), unit: "KB" },
  ];
  if (deskFile) {
    const desk = [...staticGraph(path.join(DIST, "assets", path.basename(deskFile)))].filter(
      (f) => !graph.has(f),
    );
    const deskKb = desk.reduce((sum, f) => sum + gzKb(f), 0);
    rows.push({
      name: `Map desk route JavaScript, gzipped (loaded with its route; ${desk.length} chunks)`,
      value: deskKb.toFixed(1),
      unit: "KB",
    });
  }
  return rows;
}

async function idleRows(): Promise<BenchRow[]> {
  if (!process.env.DATABASE_URL)
    return [{ name: "first map idle", value: "skipped: no DATABASE_URL" }];
  if (!existsSync(CHROMIUM)) return [{ name: "first map idle", value: `skipped: no ${CHROMIUM}` }];
  const { startRillmark } = await import("../server/main");
  const server = await startRillmark({ port: 0 });
  const browser = await chromium.launch({
    executablePath: CHROMIUM,
    headless: true,
    args: ["--host-resolver-rules=MAP * ~NOTFOUND , EXCLUDE 127.0.0.1", "--disable-quic"],
  });
  try {
    const email = DEMO_ACCOUNTS.find((a) => a.role === "engineer")!.email;
    const times: number[] = [];
    const canvasTimes: number[] = [];
    for (let run = 0; run < 3; run += 1) {
      const context = await browser.newContext({
        baseURL: server.url,
        viewport: { width: 1280, height: 800 },
      });
      const signIn = await context.request.post("/api/auth/sign-in", {
        data: { email, password: DEMO_PASSWORD },
        headers: { origin: new URL(server.url).origin },
      });
      if (!signIn.ok()) throw new Error(`sign-in: ${signIn.status()}`);
      const me = (await (await context.request.get("/api/auth/me")).json()) as {
        memberships: { teamId: string }[];
      };
      const teamId = me.memberships[0]!.teamId;
      const projects = (await (
        await context.request.get(`/api/teams/${teamId}/projects`)
      ).json()) as { id: string; name: string }[];
      const project = projects.find((p) => p.name === DEMO_PROJECT.name);
      if (!project) throw new Error("the demo project is missing");
      const page = await context.newPage();
      const started = performance.now();
      await page.goto(`/projects/${project.id}/map`);
      await page.getByTestId("desk-map").locator("canvas").waitFor({ timeout: 30_000 });
      canvasTimes.push(performance.now() - started);
      await page.locator('[data-testid="desk-map"][data-idle="true"]').waitFor({ timeout: 30_000 });
      times.push(performance.now() - started);
      await context.close();
    }
    times.sort((a, b) => a - b);
    canvasTimes.sort((a, b) => a - b);
    const median = times[1]!;
    return [
      {
        name: "Map desk: page, data and map canvas ready, cold cache (median of 3)",
        value: canvasTimes[1]!.toFixed(0),
        unit: "ms",
      },
      {
        name: "first Map desk idle, cold cache (median of 3; headless Chromium, SwiftShader)",
        value: median.toFixed(0),
        unit: "ms",
        target: `< ${IDLE_TARGET_MS} ms`,
        ok: median < IDLE_TARGET_MS,
      },
    ];
  } finally {
    await browser.close();
    await server.close();
  }
}

export async function run(): Promise<BenchRow[]> {
  // In a child: Vite's build sets NODE_ENV=production in its process, which the server reads.
  execFileSync(path.resolve("node_modules/.bin/vite"), ["build", "--logLevel", "warn"], {
    stdio: "inherit",
  });
  return [...bundleRows(), ...(await idleRows())];
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  const { formatTable } = await import("./table");
  console.log(formatTable(await run()));
}
