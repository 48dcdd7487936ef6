/**
 * Command line: `npm run delineate -- <terrain.tif> --outlet <lon>,<lat> [--outlet …]
 * [--snap <cells>] [--vertical-unit m|ft] [--conditioning fill|breach]`.
 *
 * Routes the terrain (server/terrain-flow) and prints a JSON array with one proposed
 * subcatchment per outlet, in the order given (shared/schemas/delineation.ts). Outlets split
 * the area between them: each gets only what does not drain to another outlet first. Exit
 * codes: 0 success; 1 a terrain or outlet the engine refuses (outside the grid, on nodata, two
 * outlets on one cell, a grid too large); 2 usage, or a file that cannot be read. Every refusal
 * is one line on stderr.
 */
import { existsSync } from "node:fs";
import { parseArgs } from "node:util";
import { z } from "zod";
import { positionSchema } from "../shared/schemas/subcatchments";
import { ReadError } from "../server/geodata/readers/types";
import { delineate, DEFAULT_SNAP_CELLS, MAX_SNAP_CELLS } from "../server/terrain-flow/delineate";
import { TerrainFlowError } from "../server/terrain-flow/errors";
import { readElevationGrid } from "../server/terrain-flow/read-terrain";
import { conditionAndRoute } from "../server/terrain-flow/route";

const USAGE =
  "usage: npm run delineate -- <terrain.tif> --outlet <lon>,<lat> [--outlet <lon>,<lat> …] " +
  "[--snap <cells>] [--vertical-unit m|ft] [--conditioning fill|breach]";

function fail(code: number, message: string): never {
  process.stderr.write(`delineate: ${message.replace(/\s+/g, " ")}\n`);
  process.exit(code);
}

const outletSchema = z
  .string()
  .regex(/^\s*-?[\d.]+(e-?\d+)?\s*,\s*-?[\d.]+(e-?\d+)?\s*$/i, "must be <lon>,<lat> in degrees")
  .transform((text) => text.split(",").map(Number))
  .pipe(positionSchema);

const optionsSchema = z.strictObject({
  outlet: z.array(outletSchema).min(1, "give at least one --outlet <lon>,<lat>"),
  snap: z.coerce
    .number({ error: "--snap must be a number of cells" })
    .int("--snap must be a whole number of cells")
    .min(0, "--snap must be 0 or more")
    .max(MAX_SNAP_CELLS, `--snap must be at most ${MAX_SNAP_CELLS} cells`)
    .default(DEFAULT_SNAP_CELLS),
  "vertical-unit": z.enum(["m", "ft"], { error: "--vertical-unit must be m or ft" }).default("m"),
  conditioning: z
    .enum(["fill", "breach"], { error: "--conditioning must be fill or breach" })
    .default("fill"),
});

const VALUED = new Set(["--outlet", "--snap", "--vertical-unit", "--conditioning"]);

/**
 * `--outlet -96.5,38.4` as `--outlet=-96.5,38.4`: Node's parser takes a value that starts with
 * a dash for another option, and western longitudes are negative.
 */
function joinValues(argv: string[]): string[] {
  const out: string[] = [];
  for (let i = 0; i < argv.length; i += 1) {
    const arg = argv[i]!;
    if (VALUED.has(arg) && i + 1 < argv.length) {
      out.push(`${arg}=${argv[i + 1]}`);
      i += 1;
    } else out.push(arg);
  }
  return out;
}

async function main(argv: string[]): Promise<void> {
  let parsed;
  try {
    parsed = parseArgs({
      args: joinValues(argv),
      allowPositionals: true,
      options: {
        outlet: { type: "string", multiple: true },
        snap: { type: "string" },
        "vertical-unit": { type: "string" },
        conditioning: { type: "string" },
        help: { type: "boolean" },
      },
    });
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    fail(2, `${message.replace(/\.$/, "")}. ${USAGE}`);
  }
  const { help, ...values } = parsed.values;
  if (help === true) {
    process.stdout.write(`${USAGE}\nOutput: docs/delineation.md\n`);
    return;
  }
  const [file, ...extra] = parsed.positionals;
  if (file === undefined || extra.length > 0) fail(2, `give exactly one terrain file. ${USAGE}`);
  const options = optionsSchema.safeParse({ outlet: [], ...values });
  if (!options.success) {
    const issue = options.error.issues[0]!;
    const which = issue.path[1];
    const at = typeof which === "number" ? `--outlet ${which + 1}: ` : "";
    fail(2, `${at}${issue.message}`);
  }
  if (!existsSync(file)) fail(2, `cannot read ${file}: no such file`);
  try {
    const grid = await readElevationGrid(file, options.data["vertical-unit"], file);
    const routed = conditionAndRoute(grid, { conditioning: options.data.conditioning });
    const proposals = delineate(
      routed,
      options.data.outlet.map(([lon, lat]) => [lon, lat] as const),
      { snapCells: options.data.snap },
    );
    process.stdout.write(`${JSON.stringify(proposals)}\n`);
  } catch (error) {
    if (error instanceof TerrainFlowError) fail(1, error.message);
    if (error instanceof ReadError) fail(2, error.message);
    throw error;
  }
}

await main(process.argv.slice(2));
