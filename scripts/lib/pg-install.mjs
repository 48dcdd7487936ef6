// Find Debian's PostgreSQL and PostGIS, installing them as root when missing.
import fs from "node:fs";
import path from "node:path";
import { BootstrapError, say } from "./log.mjs";
import { installPackages } from "./apt.mjs";

export const PG_LIB = "/usr/lib/postgresql";
export const PG_SHARE = "/usr/share/postgresql";

/**
 * Installed PostgreSQL versions, highest first: [{ version, bin, postgis }].
 * Folders are injectable so the selection logic can be checked without a real install.
 */
export function listPostgres({ libDir = PG_LIB, shareDir = PG_SHARE } = {}) {
  let names = [];
  try {
    names = fs.readdirSync(libDir);
  } catch {
    return [];
  }
  return names
    .filter((name) => /^\d+(\.\d+)?$/.test(name))
    .map((version) => ({
      version,
      bin: path.join(libDir, version, "bin"),
      postgis: fs.existsSync(path.join(shareDir, version, "extension", "postgis.control")),
    }))
    .filter((entry) => fs.existsSync(path.join(entry.bin, "postgres")))
    .sort((a, b) => Number(b.version) - Number(a.version));
}

/** Pure: which installation to use, or what to install. */
export function choosePostgres(installed, wantedVersion) {
  if (wantedVersion) {
    const match = installed.find((entry) => entry.version === wantedVersion);
    if (match?.postgis) return { use: match };
    return {
      install: match
        ? [`postgresql-${wantedVersion}-postgis-3`]
        : [`postgresql-${wantedVersion}`, `postgresql-${wantedVersion}-postgis-3`],
    };
  }
  const ready = installed.find((entry) => entry.postgis);
  if (ready) return { use: ready };
  if (installed[0]) return { install: [`postgresql-${installed[0].version}-postgis-3`] };
  return { install: ["postgresql", "postgresql-postgis"] };
}

/**
 * PostgreSQL with PostGIS: { version, bin }. `wantedVersion` is the major version of an
 * existing cluster, whose data only that version can open.
 */
export async function ensurePostgres(wantedVersion) {
  let choice = choosePostgres(listPostgres(), wantedVersion);
  if (choice.install) {
    await installPackages(choice.install, {
      why: "PostgreSQL with PostGIS",
      noRecommends: true,
      noDefaultCluster: true,
    });
    choice = choosePostgres(listPostgres(), wantedVersion);
    if (!choice.use) {
      throw new BootstrapError("PostgreSQL or PostGIS is still missing after apt-get install", {
        hint: `Expected ${PG_LIB}/<version>/bin/postgres and ${PG_SHARE}/<version>/extension/postgis.control.`,
      });
    }
  }
  say(`PostgreSQL ${choice.use.version} with PostGIS (${choice.use.bin})`);
  return { version: choice.use.version, bin: choice.use.bin };
}
