/**
 * Mixed load (run by `npm run bench`, or alone with `DATABASE_URL=… npx tsx bench/load.ts`):
 * the real multi-process server (`server/main.ts`, as `npm start` runs it) with one app process,
 * then with WEB_CONCURRENCY app processes (default one per core), each loaded by the Map desk
 * mix of bench/load-mix.ts at 10, 50 and 100 connections for LOAD_SECONDS (default 20) on
 * loopback. Prints requests/s, p50, p99 and errors per row, both settings side by side.
 * Target at 50 connections on a 2-core machine: ≥ 300 req/s, p99 ≤ 300 ms, 0 errors. The
 * machine's load average is printed too: on a shared machine it moves every figure.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { prepareMix, runMix, type LoadResult } from "./load-mix";
import type { BenchRow } from "./table";

const CONNECTIONS = [10, 50, 100];
const seconds = Number(process.env.LOAD_SECONDS ?? 20);

async function startServer(
  webProcesses: number,
  dir: string,
): Promise<{ url: string; stop(): Promise<void> }> {
  const child: ChildProcess = spawn(process.execPath, ["--import", "tsx", "server/main.ts"], {
    env: {
      ...process.env,
      NODE_ENV: "test",
      PORT: "0",
      WEB_CONCURRENCY: String(webProcesses),
      FAKE_S3_DIR: path.join(dir, "s3"),
      STORAGE_CACHE_DIR: path.join(dir, `cache-${webProcesses}`),
      UPLOAD_DIR: path.join(dir, "uploads"),
      CLIENT_DIST: "tests/support/no-client-build",
    },
    stdio: ["ignore", "pipe", "inherit"],
  });
  const url = await new Promise<string>((resolve, reject) => {
    let seen = "";
    child.stdout?.on("data", (chunk: Buffer) => {
      seen += chunk.toString();
      const m = /Rillmark is running at (http:\/\/[\d.:]+)/.exec(seen);
      if (m?.[1]) resolve(m[1]);
    });
    child.once("exit", (code) => reject(new Error(`the server stopped (exit ${code})`)));
  });
  return {
    url,
    stop: () =>
      new Promise<void>((resolve) => {
        child.once("exit", () => resolve());
        child.kill("SIGTERM");
      }),
  };
}

function row(setting: string, connections: number, r: LoadResult): BenchRow {
  const at50 = connections === 50;
  return {
    name: `mixed load, ${setting}, ${connections} connections (${seconds} s)`,
    value:
      `${r.requestsPerSecond.toFixed(0)} req/s, p50 ${r.p50Ms} ms, p99 ${r.p99Ms} ms, ` +
      `${r.errors} errors`,
    target: at50 ? "≥ 300 req/s, p99 ≤ 300 ms, 0 errors" : undefined,
    ok: at50 ? r.requestsPerSecond >= 300 && r.p99Ms <= 300 && r.errors === 0 : undefined,
  };
}

export async function run(): Promise<BenchRow[]> {
  if (!process.env.DATABASE_URL) return [{ name: "mixed load", value: "skipped: no DATABASE_URL" }];
  const dir = mkdtempSync(path.join(os.tmpdir(), "rillmark-bench-load-"));
  const multi = Number(process.env.WEB_CONCURRENCY ?? os.availableParallelism());
  const rows: BenchRow[] = [];
  try {
    for (const processes of [1, multi]) {
      const server = await startServer(processes, dir);
      try {
        const target = await prepareMix(server.url);
        await runMix(target, 10, 3); // warm-up: caches, plans, connections
        const setting = processes === 1 ? "1 app process" : `${processes} app processes`;
        for (const connections of CONNECTIONS) {
          const load = os.loadavg()[0]?.toFixed(1);
          const result = await runMix(target, connections, seconds);
          const measured = row(setting, connections, result);
          rows.push({ ...measured, value: `${measured.value}; load average ${load}` });
        }
      } finally {
        await server.stop();
      }
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  rows.push({
    name: "mixed load before this change (issue 9, one process, 60 s)",
    value: "10: 90 req/s p99 294 ms; 50: 102 req/s p99 1.2 s; 100: 117 req/s p99 2.2 s",
  });
  return rows;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  const { formatTable } = await import("./table");
  console.log(formatTable(await run()));
}
