/**
 * `npm start`: one supervisor process runs the migrations and the database seeds, then starts
 *   - the local stand-ins (S3 and SMTP) in one process, when S3_ENDPOINT or SMTP_HOST is unset,
 *     with credentials made here and given to the others as ordinary settings;
 *   - one worker process (layer-reading jobs and the sweep of interrupted reads);
 *   - WEB_CONCURRENCY app processes (default: one per core) sharing PORT through Node's
 *     cluster module;
 * loads the demo's files through the API, and starts again any of them that stops. Ctrl-C
 * stops the app processes, then the worker, then the stand-ins. See
 * docs/decisions/006-processes.md.
 */
import { resolvePublicBaseUrl } from "./config";
import { baseConfig, prepareDatabase, seedDemoThroughApi } from "./processes/prepare";
import { Supervised } from "./processes/supervised";
import type { ToChild } from "./processes/messages";
import { readyLine } from "./seed/demo";
import { needsStandIns, newStandInCredentials, standInSettings } from "./standins";

export async function runSupervisor(): Promise<void> {
  const base = baseConfig();
  const database = await prepareDatabase(base);
  let childEnv: NodeJS.ProcessEnv = { ...process.env };
  const all: Supervised[] = [];
  let stopping: Promise<void> | undefined;
  const stopAll = () =>
    (stopping ??= (async () => {
      // App processes first (they send mail and jobs), the stand-ins last.
      const order = (role: string) => ({ web: 0, worker: 1, standins: 2 })[role] ?? 0;
      for (const rank of [0, 1, 2]) {
        await Promise.all(all.filter((c) => order(c.role) === rank).map((c) => c.stop()));
      }
      await database.pool.end();
    })());
  for (const signal of ["SIGINT", "SIGTERM"] as const) {
    process.on(signal, () => {
      if (stopping) process.exit(1); // a second Ctrl-C: do not wait any longer
      void stopAll().then(() => process.exit(0));
    });
  }

  try {
    if (needsStandIns(base)) {
      const credentials = newStandInCredentials();
      const ports = { s3Port: base.storage.fakePort, smtpPort: base.fakeSmtpPort };
      const standIns = new Supervised("standins", () => process.env);
      standIns.onSpawn = (child) =>
        child.send({ type: "start-standins", credentials, ...ports } satisfies ToChild);
      all.push(standIns);
      const ready = await standIns.start();
      const address = { s3Endpoint: ready.s3Endpoint ?? "", smtpPort: ready.smtpPort ?? 0 };
      // Started again after a crash, the stand-ins come back where the others expect them.
      ports.s3Port = Number(new URL(address.s3Endpoint).port);
      ports.smtpPort = address.smtpPort;
      childEnv = { ...childEnv, ...standInSettings(base, address, credentials) };
    }
    const worker = new Supervised("worker", () => childEnv);
    all.push(worker);
    await worker.start();
    const webs = Array.from(
      { length: base.webProcesses },
      () => new Supervised("web", () => childEnv),
    );
    all.push(...webs);
    const [first] = await Promise.all(webs.map((web) => web.start()));
    const port = first?.port ?? base.port;
    // Every later app process listens on the same port (the cluster module keeps it).
    childEnv = { ...childEnv, PORT: String(port) };
    await seedDemoThroughApi(
      database,
      resolvePublicBaseUrl({ ...base, publicBaseUrl: undefined }, port),
    );
    const url = resolvePublicBaseUrl(base, port);
    console.log(readyLine(url));
    console.log(
      `(${webs.length} app process${webs.length === 1 ? "" : "es"}, a worker process` +
        `${needsStandIns(base) ? " and the local S3 and mail stand-ins" : ""}; Ctrl-C stops them)`,
    );
  } catch (err) {
    await stopAll();
    throw err;
  }
}
