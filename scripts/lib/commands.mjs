// npm start, npm run dev, npm run bench and `node scripts/bootstrap.mjs db`.
import fs from "node:fs";
import path from "node:path";
import { BootstrapError, ROOT, color, ensureDataDirs, say, warn } from "./log.mjs";
import { binPath } from "./node-deps.mjs";
import { ensureClientBuild } from "./client-build.mjs";
import { exitZeroOnSignal, isStopping, spawnChild } from "./children.mjs";
import { prepare, redactUrl, serverEnv } from "./setup.mjs";
import { ensureGrass } from "./grass.mjs";
import { savedCluster, stopCluster } from "./cluster.mjs";
import { clearAutoStop, otherLeases, withClusterLock } from "./leases.mjs";

function requireFile(relPath, who) {
  if (!fs.existsSync(path.join(ROOT, relPath))) {
    throw new BootstrapError(`${relPath} is missing`, {
      hint: `${who} needs it; is the checkout complete?`,
    });
  }
}

function describeExit({ code, signal }) {
  return signal ? `signal ${signal}` : `exit ${code}`;
}

/** npm start: set up everything, build the client when it changed, serve until Ctrl-C. */
export async function start() {
  requireFile("server/main.ts", "npm start");
  const { databaseUrl } = await prepare({ command: "start", database: "rillmark" });
  const env = serverEnv(databaseUrl);
  await ensureClientBuild(env);
  say("starting the server …");
  exitZeroOnSignal();
  // The server migrates, seeds the demo once and prints the address and the demo accounts.
  const { done } = spawnChild(process.execPath, ["--import", "tsx", "server/main.ts"], { env });
  const result = await done;
  if (result.code !== 0 && !isStopping()) warn(`the server stopped (${describeExit(result)})`);
  return result.code;
}

/** npm run dev: Vite with hot reload in front of the API server under watch. */
export async function dev() {
  requireFile("server/main.ts", "npm run dev");
  const { databaseUrl } = await prepare({ command: "dev", database: "rillmark" });
  const env = {
    ...serverEnv(databaseUrl),
    // The browser talks to Vite (vite.config.ts: 5181), which proxies /api: links in e-mails
    // and the same-origin check must name Vite's address.
    PUBLIC_BASE_URL: process.env.PUBLIC_BASE_URL ?? "http://127.0.0.1:5181",
    ...(process.stdout.isTTY ? { FORCE_COLOR: "1" } : {}),
  };
  exitZeroOnSignal();
  const api = spawnChild(binPath("tsx"), ["watch", "--clear-screen=false", "server/main.ts"], {
    env,
    prefix: color.cyan("[api]"),
  });
  const web = spawnChild(binPath("vite"), [], { env, prefix: color.green("[web]") });
  say(`open ${env.PUBLIC_BASE_URL} (hot reload); Ctrl-C stops both servers`);
  const first = await Promise.race([
    api.done.then((result) => ({ name: "API server", ...result })),
    web.done.then((result) => ({ name: "Vite", ...result })),
  ]);
  if (!isStopping()) warn(`${first.name} stopped (${describeExit(first)}); stopping the rest`);
  return first.code;
}

/** npm run bench: a fresh benchmark database, then bench/run.ts prints its table. */
export async function bench(args) {
  requireFile("bench/run.ts", "npm run bench");
  const { databaseUrl } = await prepare({
    command: "bench",
    database: "rillmark_bench",
    fresh: true,
  });
  // The terrain rows run GRASS GIS side by side; without it they say why and go on.
  await ensureGrass();
  const { done } = spawnChild(binPath("tsx"), ["bench/run.ts", ...args], {
    env: serverEnv(databaseUrl),
  });
  const result = await done;
  if (result.code !== 0) warn(`the benchmarks failed (${describeExit(result)})`);
  return result.code;
}

/** npm run outbox: the local mail server's messages, for whoever runs this machine. */
export async function outbox(args) {
  requireFile("scripts/outbox.ts", "npm run outbox");
  const { databaseUrl } = await prepare({ command: "outbox", database: "rillmark" });
  const { done } = spawnChild(binPath("tsx"), ["scripts/outbox.ts", ...args], {
    env: serverEnv(databaseUrl),
  });
  return (await done).code;
}

/**
 * db [name]: start the cluster (if needed), make sure the database exists, print its URL; the
 * server keeps running. db stop: stop it unless another Rillmark command still uses it.
 */
export async function db(args) {
  if (args[0] === "stop") return dbStop();
  const name = args[0] ?? "rillmark";
  const { databaseUrl, cluster } = await prepare({
    command: "db",
    database: name,
    needDeps: false,
  });
  process.stdout.write(`DATABASE_URL=${databaseUrl}\n`);
  if (cluster) {
    process.stdout.write(
      `${color.dim(`psql:  ${path.join(cluster.bin, "psql")} ${databaseUrl}`)}\n`,
    );
    process.stdout.write(`${color.dim("stop:  node scripts/bootstrap.mjs db stop")}\n`);
  } else {
    say(`(managed database ${redactUrl(databaseUrl)}: nothing to start or stop)`);
  }
  return 0;
}

async function dbStop() {
  ensureDataDirs();
  const cluster = savedCluster();
  if (!cluster?.dataDir) {
    say("no project-local database cluster yet");
    return 0;
  }
  return withClusterLock(async () => {
    const others = otherLeases();
    if (others.length > 0) {
      warn(`not stopping: Rillmark process(es) ${others.join(", ")} still use the database`);
      return 1;
    }
    say(
      (await stopCluster(cluster)) ? "database server stopped" : "database server was not running",
    );
    clearAutoStop();
    return 0;
  });
}
