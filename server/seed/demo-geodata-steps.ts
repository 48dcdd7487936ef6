/**
 * The steps of loading the invented demo scenario, each one call (or a few) of Rillmark's own
 * API, as the GIS specialist and the engineer would make them in the browser.
 */
import path from "node:path";
import type { Geometry } from "geojson";
import type { DesignRules } from "../../shared/schemas/design-rules";
import type { Layer } from "../../shared/schemas/layers";
import type { RainfallTable } from "../../shared/schemas/rainfall";
import type { TravelTimeSheet } from "../../shared/schemas/sheet";
import type { Subcatchment } from "../../shared/schemas/subcatchments";
import { readVectorFile } from "../geodata/readers";
import type { ApiClient } from "./api-client";
import { readDemoScenario, type DemoLayer, type DemoScenario } from "./demo-scenario";

/** How long the seed waits for one layer's background ingest before giving up. */
const LAYER_DEADLINE_MS = 120_000;

/** Uploads one layer file and waits for its ingest job; throws when the layer failed. */
export async function uploadLayer(
  gis: ApiClient,
  projectId: string,
  dir: string,
  layer: DemoLayer,
): Promise<Layer> {
  const fields: Record<string, string> = { kind: layer.kind, name: layer.name };
  if (layer.kind === "terrain") fields.verticalUnit = layer.verticalUnit;
  const sent = await gis.upload<Layer>(
    `/projects/${projectId}/layers`,
    path.join(dir, layer.file),
    fields,
  );
  let current = sent.body;
  const deadline = Date.now() + LAYER_DEADLINE_MS;
  while (current.status === "queued" || current.status === "processing") {
    if (Date.now() > deadline) throw new Error(`${layer.file}: ingest did not finish in time`);
    current = await gis.get<Layer>(`/layers/${current.id}?waitMs=5000`);
  }
  if (current.status !== "ready") {
    throw new Error(`${layer.file}: ingest failed: ${current.error?.message ?? "no message"}`);
  }
  return current;
}

interface CatalogClass {
  readonly id: string;
  readonly key: string;
}

/** Maps a cover layer's codes to the team's Surface catalog classes (by class key). */
export async function mapCover(
  gis: ApiClient,
  teamId: string,
  layer: Layer,
  demo: Extract<DemoLayer, { kind: "cover" }>,
): Promise<Layer> {
  const classes = await gis.get<CatalogClass[]>(`/teams/${teamId}/surface-classes`);
  const entries = Object.entries(demo.mapping).map(([value, key]) => {
    const found = classes.find((c) => c.key === key);
    if (!found) throw new Error(`the team's Surface catalog has no class "${key}" for ${value}`);
    return { value, surfaceClassId: found.id };
  });
  return gis.json<Layer>("PUT", `/layers/${layer.id}/mapping`, {
    field: demo.mappingField,
    entries,
  });
}

export async function mapSoil(
  gis: ApiClient,
  layer: Layer,
  demo: Extract<DemoLayer, { kind: "soil" }>,
): Promise<Layer> {
  const entries = Object.entries(demo.mapping).map(([value, hsg]) => ({ value, hsg }));
  return gis.json<Layer>("PUT", `/layers/${layer.id}/mapping`, {
    field: demo.mappingField,
    entries,
  });
}

/**
 * The project's own changes to team classes (the demo fills a value the published defaults
 * leave open); the API checks each value and its source.
 */
export async function putCatalogOverrides(
  engineer: ApiClient,
  projectId: string,
  overrides: DemoScenario["catalogOverrides"],
): Promise<void> {
  const classes = await engineer.get<CatalogClass[]>(`/projects/${projectId}/surface-classes`);
  for (const override of overrides) {
    const found = classes.find((c) => c.key === override.classKey);
    if (!found) throw new Error(`the Surface catalog has no class "${override.classKey}"`);
    await engineer.json("PUT", `/projects/${projectId}/surface-classes/${found.id}/override`, {
      values: override.values,
      note: override.note,
    });
  }
}

/** The invented IDF table, uploaded as the CSV a user would send. */
export async function uploadRainfall(
  engineer: ApiClient,
  projectId: string,
  dir: string,
  rainfall: DemoScenario["rainfall"],
): Promise<RainfallTable> {
  const sent = await engineer.upload<RainfallTable>(
    `/projects/${projectId}/rainfall-tables/upload`,
    path.join(dir, rainfall.file),
    {
      name: rainfall.name,
      sourceNote: rainfall.sourceNote,
      kind: rainfall.kind,
      p2_24h: String(rainfall.p2_24h),
    },
  );
  return sent.body;
}

export async function putDesignRules(
  engineer: ApiClient,
  projectId: string,
  rules: DemoScenario["designRules"],
  rainfallTableId: string,
): Promise<DesignRules> {
  const route = `/projects/${projectId}/design-rules`;
  const current = await engineer.get<DesignRules>(route);
  return engineer.json<DesignRules>("PUT", route, {
    ...rules,
    rainfallTableId,
    version: current.version,
  });
}

/** The outlet from the subcatchment file, read by the same reader as an uploaded KML. */
async function outletOf(dir: string, file: string): Promise<Geometry> {
  const read = await readVectorFile(path.join(dir, file), "kml", file);
  const found = read.features.find((f) => f.geometry.type === "Point");
  if (!found) throw new Error(`${file}: no outlet point`);
  return found.geometry;
}

/**
 * Creates the subcatchment with its outlet and channel section, then sends the KML twice as a
 * user would: once as its boundary (the file's one polygon), once as its flow path (its one line).
 */
export async function createSubcatchment(
  engineer: ApiClient,
  projectId: string,
  dir: string,
  demo: DemoScenario["subcatchment"],
): Promise<Subcatchment> {
  const created = await engineer.json<Subcatchment>(
    "POST",
    `/projects/${projectId}/subcatchments`,
    {
      name: demo.name,
      scenario: demo.scenario,
      outlet: await outletOf(dir, demo.file),
      channel: demo.channel,
      note: demo.note,
    },
  );
  const file = path.join(dir, demo.file);
  await engineer.upload(`/subcatchments/${created.id}/boundary/file`, file, {
    version: String(created.version),
  });
  const done = await engineer.upload<Subcatchment>(
    `/subcatchments/${created.id}/flow-path/file`,
    file,
    {
      version: "0",
    },
  );
  return done.body;
}

/** Runs every method on the subcatchment; the sheet is stored as its current result. */
export async function computeSubcatchment(
  engineer: ApiClient,
  subcatchmentId: string,
): Promise<TravelTimeSheet> {
  const sheet = await engineer.json<TravelTimeSheet>(
    "POST",
    `/subcatchments/${subcatchmentId}/compute`,
    {},
  );
  if (sheet.problems.length > 0 || sheet.governing === null) {
    throw new Error(`the demo subcatchment did not compute: ${sheet.problems.join("; ")}`);
  }
  return sheet;
}

/**
 * The whole scenario into one project: the GIS specialist's layers and mappings, then the
 * engineer's catalog override, rainfall, rules and subcatchment, computed. Answers the
 * subcatchment's id; `onLayer` hears of each layer as soon as it exists (for clean-up).
 */
export async function loadDemoScenario(
  people: { gis: ApiClient; engineer: ApiClient },
  project: { id: string; teamId: string },
  dir: string,
  onLayer: (layerId: string) => void = () => undefined,
): Promise<string> {
  const { gis, engineer } = people;
  const scenario = await readDemoScenario(dir);
  for (const demo of scenario.layers) {
    const layer = await uploadLayer(gis, project.id, dir, demo);
    onLayer(layer.id);
    if (demo.kind === "cover") await mapCover(gis, project.teamId, layer, demo);
    if (demo.kind === "soil") await mapSoil(gis, layer, demo);
  }
  await putCatalogOverrides(engineer, project.id, scenario.catalogOverrides);
  const rainfall = await uploadRainfall(engineer, project.id, dir, scenario.rainfall);
  await putDesignRules(engineer, project.id, scenario.designRules, rainfall.id);
  const subcatchment = await createSubcatchment(engineer, project.id, dir, scenario.subcatchment);
  await computeSubcatchment(engineer, subcatchment.id);
  return subcatchment.id;
}
