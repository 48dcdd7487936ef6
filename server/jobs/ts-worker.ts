/**
 * The source of a worker thread that runs one of our TypeScript modules. The server runs
 * TypeScript through tsx; a worker thread starts without it, so its first module registers
 * tsx's loader and then imports the worker's own .ts module. tsx's ESM entry is taken from its
 * package's export map (the CommonJS one cannot register the ESM loader in a thread).
 * Use: `new Worker(tsWorkerSource(new URL("./x-worker.ts", import.meta.url)), { eval: true })`.
 */
import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";
import { pathToFileURL } from "node:url";

let tsxApi: string | null = null;

function tsxEsmApi(): string {
  const manifest = createRequire(import.meta.url).resolve("tsx/package.json");
  const pkg = JSON.parse(readFileSync(manifest, "utf8")) as {
    exports: Record<string, { import: { default: string } }>;
  };
  const entry = pkg.exports["./esm/api"]?.import.default;
  if (!entry) throw new Error("tsx has no ESM API entry");
  return pathToFileURL(path.join(path.dirname(manifest), entry)).href;
}

export function tsWorkerSource(moduleUrl: URL): string {
  tsxApi ??= tsxEsmApi();
  return `
const api = await import(${JSON.stringify(tsxApi)});
api.register();
await import(${JSON.stringify(moduleUrl.href)});
`;
}
