/**
 * Reads the invented demo scenario's description (demo-geo/out/scenario.json, written by
 * demo-geo/generate.ts) and checks it with the same schemas the API applies to a user's input.
 */
import { readFile } from "node:fs/promises";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { z } from "zod";
import { HSG_CODES } from "../../shared/geo/types";
import { rulesSchema } from "../../shared/hydrology/rules";
import { CHANNEL_SLOPE_CHOICES, DUAL_HSG_CHOICES } from "../../shared/schemas/design-rules";
import { channelSchema } from "../../shared/schemas/subcatchments";

export const DEMO_OUT_DIR = fileURLToPath(new URL("../../demo-geo/out/", import.meta.url));

const file = z.string().regex(/^[a-z0-9-]+\.[a-z]+$/, "must be a plain file name in demo-geo/out");

const layer = z.discriminatedUnion("kind", [
  z.object({
    kind: z.literal("terrain"),
    file,
    name: z.string(),
    verticalUnit: z.enum(["m", "ft"]),
  }),
  z.object({
    kind: z.literal("cover"),
    file,
    name: z.string(),
    mappingField: z.string(),
    /** code → Surface catalog class key */
    mapping: z.record(z.string(), z.string()),
  }),
  z.object({
    kind: z.literal("soil"),
    file,
    name: z.string(),
    mappingField: z.string(),
    mapping: z.record(z.string(), z.enum(HSG_CODES)),
  }),
  z.object({ kind: z.literal("channel"), file, name: z.string() }),
]);

export const demoScenarioSchema = z.object({
  about: z.string().regex(/invented/i, "must say that the scenario is invented"),
  layers: z.array(layer).min(1),
  rainfall: z.object({
    file,
    name: z.string(),
    kind: z.enum(["intensity", "depth"]),
    sourceNote: z.string().regex(/invented/i, "must say that the table is invented"),
    p2_24h: z.number().positive(),
  }),
  catalogOverrides: z.array(
    z.object({ classKey: z.string(), note: z.string(), values: z.record(z.string(), z.unknown()) }),
  ),
  designRules: z.object({
    rules: rulesSchema,
    dualHsg: z.enum(DUAL_HSG_CHOICES),
    channelSlope: z.enum(CHANNEL_SLOPE_CHOICES),
    profileSpacingM: z.number().positive(),
  }),
  subcatchment: z.object({
    file,
    name: z.string(),
    scenario: z.enum(["existing", "proposed"]),
    note: z.string(),
    channel: channelSchema,
  }),
});

export type DemoScenario = z.output<typeof demoScenarioSchema>;
export type DemoLayer = DemoScenario["layers"][number];

export async function readDemoScenario(dir = DEMO_OUT_DIR): Promise<DemoScenario> {
  const text = await readFile(path.join(dir, "scenario.json"), "utf8");
  return demoScenarioSchema.parse(JSON.parse(text));
}
