// Debian packages the project needs (PostgreSQL + PostGIS, Chromium), installed as root.
import fs from "node:fs";
import path from "node:path";
import { BootstrapError, LOG_DIR, say, seconds, tail, warn } from "./log.mjs";
import { isRoot, run, sleep, which } from "./proc.mjs";

const LOCK_PATTERN = /Could not get lock|Unable to acquire the dpkg|lock-frontend/i;
const ATTEMPTS = 6;
const PAUSE_MS = 10_000;

const CREATECLUSTER_DIR = "/etc/postgresql-common/createcluster.d";

/** The command a non-root user is asked to run (as one line they can paste). */
export function aptCommand(packages, { noRecommends = false, noDefaultCluster = false } = {}) {
  const flags = noRecommends ? " --no-install-recommends" : "";
  const before = noDefaultCluster
    ? `mkdir -p ${CREATECLUSTER_DIR} && echo "create_main_cluster = false" > ${CREATECLUSTER_DIR}/rillmark.conf && `
    : "";
  return (
    `sudo sh -c '${before}DEBIAN_FRONTEND=noninteractive apt-get update && ` +
    `DEBIAN_FRONTEND=noninteractive apt-get install -y${flags} ${packages.join(" ")}'`
  );
}

/** Stop apt from creating Debian's default cluster: Rillmark makes its own, project-local. */
export function preventDefaultCluster() {
  fs.mkdirSync(CREATECLUSTER_DIR, { recursive: true });
  const file = path.join(CREATECLUSTER_DIR, "rillmark.conf");
  if (!fs.existsSync(file)) fs.writeFileSync(file, "create_main_cluster = false\n");
}

async function aptGet(args, logFile) {
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  for (let attempt = 1; ; attempt += 1) {
    // apt waits for the dpkg lock itself for a while; the loop covers the lists lock too.
    const result = await run("apt-get", ["-o", "DPkg::Lock::Timeout=60", ...args], {
      env,
      logFile,
    });
    if (result.code === 0) return;
    const lockHeld = LOCK_PATTERN.test(result.err + result.out);
    if (!lockHeld || attempt >= ATTEMPTS) {
      throw new BootstrapError(`apt-get ${args[0]} failed (exit ${result.code})`, {
        logFile,
        details: tail(logFile, 20),
        hint: lockHeld ? "Another package manager holds the dpkg lock; wait and retry." : undefined,
      });
    }
    warn(`dpkg is busy (another apt is running); retrying in ${PAUSE_MS / 1000} s`);
    await sleep(PAUSE_MS);
  }
}

/**
 * Install Debian packages when running as root; otherwise stop with the exact command.
 * `why` names what they are for in the progress line; noDefaultCluster first stops Debian's
 * postgresql package from creating its own cluster.
 */
export async function installPackages(
  packages,
  { why, noRecommends = false, noDefaultCluster = false } = {},
) {
  if (!isRoot || !which("apt-get")) {
    const command = aptCommand(packages, { noRecommends, noDefaultCluster });
    throw new BootstrapError(`${why} is not installed`, {
      hint: which("apt-get")
        ? `Install it once as root, then run the command again:\n${command}`
        : `This is not a Debian-like system; install the equivalent of: ${packages.join(", ")}`,
    });
  }
  if (noDefaultCluster) preventDefaultCluster();
  const logFile = path.join(LOG_DIR, "apt.log");
  say(`installing ${why} (${packages.join(" ")}) with apt-get …`);
  const started = Date.now();
  await aptGet(["update"], logFile);
  const install = ["install", "-y", ...(noRecommends ? ["--no-install-recommends"] : [])];
  await aptGet([...install, ...packages], logFile);
  say(`${why} installed in ${seconds(Date.now() - started)}`);
}
