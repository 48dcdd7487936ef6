/**
 * A computed-subcatchment case for the compute and export tests, built from the geodata test
 * fixtures (tests/fixtures/geo: invented cover, soils, path and the analytic plane DEM). Cover
 * and soil features go straight into the tables (as a finished, mapped upload leaves them); the
 * plane DEM goes through the object store and terrain inspection like an uploaded terrain layer.
 */
import path from "node:path";
import { sql } from "drizzle-orm";
import type { Geometry } from "geojson";
import { layers } from "../../server/db/schema-geodata";
import { inspectTerrain } from "../../server/geodata/terrain";
import { COVER, PATH, SOILS } from "../fixtures/geo/scenario";
import { createTeam, signIn, type Agent, type TestApp, type TestTeam } from "./app";

/** Cover fixture names → seeded Surface catalog keys. */
export const COVER_CLASS_KEYS: Record<string, string> = {
  woods: "woods-dense",
  range: "range-natural",
  lawn: "lawn-good",
  pavement: "pavement",
};

// Invented SI IDF table (mm/h), shaped like a real one; not from any atlas.
export const INVENTED_IDF_SI = {
  durationsMin: [5, 10, 15, 30, 60, 120, 360, 1440],
  returnPeriodsYears: [2, 10, 25, 100],
  intensity: [
    [124, 168, 193, 234],
    [99, 135, 155, 188],
    [84, 114, 132, 160],
    [58, 81, 94, 117],
    [38, 53, 63, 79],
    [23, 33, 39, 50],
    [10.7, 15.2, 18.3, 23.4],
    [3.3, 4.8, 5.8, 7.4],
  ],
};

export const BOUNDARY: Geometry = {
  type: "Polygon",
  coordinates: [
    [
      [-122.2, 38.4],
      [-122.196, 38.4],
      [-122.196, 38.404],
      [-122.2, 38.404],
      [-122.2, 38.4],
    ],
  ],
};

export interface GeodataCase {
  team: TestTeam;
  engineer: Agent;
  projectId: string;
  subcatchmentId: string;
  classIdByName: Record<string, string>;
  coverLayerId: string;
  soilLayerId: string;
}

async function insertLayer(
  t: TestApp,
  projectId: string,
  kind: "cover" | "soil",
  features: {
    geometry: Geometry;
    attrs: object;
    surfaceClassId?: string | null;
    hsg?: string | null;
  }[],
) {
  const [layer] = await t.db
    .insert(layers)
    .values({
      projectId,
      kind,
      name: `Fixture ${kind}`,
      format: "geojson",
      originalFilename: `${kind}.geojson`,
      sizeBytes: 1,
      status: "ready",
      featureCount: features.length,
    })
    .returning({ id: layers.id });
  if (!layer) throw new Error("layer insert returned no row");
  for (const [i, f] of features.entries()) {
    await t.db.execute(sql`
      insert into layer_features (layer_id, feature_index, geom, attributes, surface_class_id, hsg)
      values (${layer.id}, ${i}, ST_SetSRID(ST_GeomFromGeoJSON(${JSON.stringify(f.geometry)}), 4326),
        ${JSON.stringify(f.attrs)}::jsonb, ${f.surfaceClassId ?? null}, ${f.hsg ?? null})`);
  }
  return layer.id;
}

export async function addPlaneTerrain(t: TestApp, projectId: string): Promise<void> {
  const file = path.join(import.meta.dirname, "../fixtures/geo/plane-utm10.tif");
  const info = await inspectTerrain(file, "m");
  const objectKey = `tests/${projectId}/plane-utm10.tif`;
  await t.store.putFile(objectKey, file, "image/tiff");
  await t.db.insert(layers).values({
    projectId,
    kind: "terrain",
    name: "Plane DEM",
    format: "geotiff",
    originalFilename: "plane-utm10.tif",
    sizeBytes: 1,
    objectKey,
    status: "ready",
    terrain: { ...info },
    bbox4326: [...info.bbox4326],
  });
}

/** An SI project with cover, soil, the plane DEM, a rainfall table and one subcatchment. */
export async function buildGeodataCase(t: TestApp, tag: string): Promise<GeodataCase> {
  const team = await createTeam(t.db, tag);
  const engineer = t.agent();
  await signIn(engineer, team.members.engineer);
  const project = await engineer
    .post(`/api/teams/${team.id}/projects`)
    .send({ name: `Case ${tag}`, units: "si", designReturnPeriodYears: 10 });
  const projectId = project.body.id as string;
  const classes = (await engineer.get(`/api/teams/${team.id}/surface-classes`)).body as {
    id: string;
    key: string;
  }[];
  const classIdByName: Record<string, string> = {};
  for (const [name, key] of Object.entries(COVER_CLASS_KEYS)) {
    const found = classes.find((c) => c.key === key);
    if (!found) throw new Error(`no class ${key}`);
    classIdByName[name] = found.id;
  }
  const coverLayerId = await insertLayer(
    t,
    projectId,
    "cover",
    COVER.map((f) => ({
      geometry: f.geometry,
      attrs: f.properties,
      surfaceClassId: classIdByName[f.properties.NAME] ?? null,
    })),
  );
  const soilLayerId = await insertLayer(
    t,
    projectId,
    "soil",
    SOILS.map((f) => ({
      geometry: f.geometry,
      attrs: { HSG: f.properties.HSG },
      hsg: f.properties.HSG,
    })),
  );
  await addPlaneTerrain(t, projectId);
  const rain = await engineer.post(`/api/projects/${projectId}/rainfall-tables`).send({
    name: "Invented IDF",
    sourceNote: "Invented for tests",
    p2_24h: 75,
    idf: INVENTED_IDF_SI,
  });
  if (rain.status !== 201) throw new Error(`rainfall: ${JSON.stringify(rain.body)}`);
  const sub = await engineer.post(`/api/projects/${projectId}/subcatchments`).send({
    name: "Invented area A",
    boundary: BOUNDARY,
    channel: { manningN: 0.035, section: { bottomWidth: 0.5, sideSlope: 3, depth: 0.3 } },
  });
  if (sub.status !== 201) throw new Error(`subcatchment: ${JSON.stringify(sub.body)}`);
  const subcatchmentId = sub.body.id as string;
  const put = await engineer
    .put(`/api/subcatchments/${subcatchmentId}/flow-path`)
    .send({ geometry: PATH.geometry, version: 0 });
  if (put.status !== 200) throw new Error(`path: ${JSON.stringify(put.body)}`);
  // Channel flow over the last stretch (a station in metres: the project is SI).
  await engineer
    .put(`/api/subcatchments/${subcatchmentId}/breaks`)
    .send({ channelStart: 400, version: 1 });
  return { team, engineer, projectId, subcatchmentId, classIdByName, coverLayerId, soilLayerId };
}
