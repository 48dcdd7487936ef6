// GRASS GIS (Debian's grass-core), the general-purpose GIS the terrain engine is checked and
// benchmarked against. Installed as root when missing; when it cannot be, the checks and the
// bench row that need it skip with a message instead of failing the run.
import { installPackages } from "./apt.mjs";
import { say, warn } from "./log.mjs";
import { which } from "./proc.mjs";

export async function ensureGrass() {
  if (which("grass")) return true;
  try {
    await installPackages(["grass-core"], {
      why: "GRASS GIS (the reference for the terrain checks)",
      noRecommends: true,
    });
  } catch (error) {
    warn(`GRASS GIS is not installed; the checks against it are skipped (${error.message})`);
    if (error.hint) say(error.hint);
    return false;
  }
  return Boolean(which("grass"));
}
