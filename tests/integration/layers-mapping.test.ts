import { and, eq, isNotNull } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { layerFeatures, surfaceClasses } from "../../server/db/schema-geodata";
import { fieldValuesSchema, layerSchema } from "../../shared/schemas/layers";
import { createTeam, signIn, startTestApp, type Agent, type TestApp } from "../support/app";
import { coverShapefileZip, FileKit, SOIL_GEOJSON } from "../support/layer-files";
import { leftovers, uploadLayer } from "../support/layers";
import { freshProject } from "../support/route-table";

let t: TestApp;
let gis: Agent;
let teamId: string;
let projectId: string;
let coverId: string;
let soilId: string;
const kit = new FileKit();

beforeAll(async () => {
  t = await startTestApp();
  const team = await createTeam(t.db, "layers-map");
  teamId = team.id;
  gis = t.agent();
  await signIn(gis, team.members.gis);
  projectId = await freshProject(t.db, teamId);
  const cover = await uploadLayer(gis, projectId, {
    kind: "cover",
    file: kit.write("cover.zip", coverShapefileZip()),
  });
  const soil = await uploadLayer(gis, projectId, {
    kind: "soil",
    file: kit.write("soils.geojson", SOIL_GEOJSON),
  });
  if (cover.status !== 201 || soil.status !== 201) throw new Error("fixture uploads failed");
  coverId = cover.body.id;
  soilId = soil.body.id;
});
afterAll(async () => {
  await t.close();
  kit.close();
});

async function classId(key: string): Promise<string> {
  const [row] = await t.db
    .select({ id: surfaceClasses.id })
    .from(surfaceClasses)
    .where(and(eq(surfaceClasses.teamId, teamId), eq(surfaceClasses.key, key)));
  if (!row) throw new Error(`no class ${key}`);
  return row.id;
}

describe("cover mapping", () => {
  it("lists a field's values with counts and suggests a class for each", async () => {
    const res = await gis.get(`/api/layers/${coverId}/fields/LANDUSE/values`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ field: "LANDUSE", kind: "cover", truncated: false });
    expect(fieldValuesSchema.safeParse(res.body).error).toBeUndefined();
    expect(res.body.values).toEqual([
      {
        value: "WOODS",
        featureCount: 2,
        mapped: null,
        suggestion: {
          target: await classId("woods-dense"),
          label: expect.any(String),
          confidence: "likely",
        },
      },
      {
        value: "Asphalt",
        featureCount: 1,
        mapped: null,
        suggestion: {
          target: await classId("pavement"),
          label: expect.any(String),
          confidence: "likely",
        },
      },
    ]);
  });

  it("names a field the file does not have", async () => {
    const res = await gis.get(`/api/layers/${coverId}/fields/NOPE/values`);
    expect(res.status).toBe(422);
    expect(res.body.error.fields.field).toMatch(/"NOPE" is not a field of cover\.zip/);
  });

  it("shows the unmapped values as a problem until they are mapped", async () => {
    const before = await gis.get(`/api/layers/${coverId}`);
    expect(before.body.problems).toEqual([
      expect.objectContaining({ kind: "unmapped-values", featureCount: 3 }),
    ]);
    const woods = await classId("woods-dense");
    const partial = await gis
      .put(`/api/layers/${coverId}/mapping`)
      .send({ field: "LANDUSE", entries: [{ value: "WOODS", surfaceClassId: woods }] });
    expect(partial.status, JSON.stringify(partial.body)).toBe(200);
    expect(partial.body.mappingField).toBe("LANDUSE");
    expect(partial.body.problems).toEqual([
      expect.objectContaining({ kind: "unmapped-values", values: ["Asphalt"], featureCount: 1 }),
    ]);
    const mapped = await t.db
      .select({ index: layerFeatures.featureIndex, cls: layerFeatures.surfaceClassId })
      .from(layerFeatures)
      .where(and(eq(layerFeatures.layerId, coverId), isNotNull(layerFeatures.surfaceClassId)));
    expect(mapped.map((m) => m.index).sort()).toEqual([0, 2]);
    expect(mapped.every((m) => m.cls === woods)).toBe(true);

    const full = await gis.put(`/api/layers/${coverId}/mapping`).send({
      field: "LANDUSE",
      entries: [
        { value: "WOODS", surfaceClassId: woods },
        { value: "Asphalt", surfaceClassId: await classId("pavement") },
      ],
    });
    expect(full.body.problems).toEqual([]);
    const values = await gis.get(`/api/layers/${coverId}/fields/LANDUSE/values`);
    expect(values.body.values.map((v: { mapped: string }) => v.mapped)).toEqual([
      woods,
      await classId("pavement"),
    ]);
  });

  it("refuses a class of another team's catalog, naming the entry", async () => {
    const other = await createTeam(t.db, "layers-map-other");
    const foreign = await gis.get(`/api/layers/${coverId}/fields/LANDUSE/values`); // seeds ours
    expect(foreign.status).toBe(200);
    const otherAgent = t.agent();
    await signIn(otherAgent, other.members.gis);
    const otherProject = await freshProject(t.db, other.id);
    const up = await uploadLayer(otherAgent, otherProject, {
      kind: "cover",
      file: kit.write("other.zip", coverShapefileZip()),
    });
    await otherAgent.get(`/api/layers/${up.body.id}/fields/LANDUSE/values`);
    const [theirs] = await t.db
      .select({ id: surfaceClasses.id })
      .from(surfaceClasses)
      .where(eq(surfaceClasses.teamId, other.id))
      .limit(1);
    const res = await gis.put(`/api/layers/${coverId}/mapping`).send({
      field: "LANDUSE",
      entries: [{ value: "WOODS", surfaceClassId: theirs?.id }],
    });
    expect(res.status).toBe(422);
    expect(res.body.error.fields["entries.0.surfaceClassId"]).toMatch(/Surface catalog/);
  });
});

describe("soil mapping", () => {
  it("reads the HSG from the values, dual groups kept as such", async () => {
    const res = await gis.get(`/api/layers/${soilId}/fields/HYDGRP/values`);
    expect(res.status).toBe(200);
    const byValue = Object.fromEntries(
      res.body.values.map((v: { value: string; suggestion: unknown }) => [v.value, v.suggestion]),
    );
    expect(byValue).toEqual({
      B: { target: "B", label: "HSG B", confidence: "exact" },
      "C/D": { target: "C/D", label: "HSG C/D", confidence: "exact" },
      "Group A": { target: "A", label: "HSG A", confidence: "likely" },
      W: null,
    });
  });

  it("stores the HSG on every feature of a value and leaves the rest as a problem", async () => {
    const res = await gis.put(`/api/layers/${soilId}/mapping`).send({
      field: "HYDGRP",
      entries: [
        { value: "B", hsg: "B" },
        { value: "C/D", hsg: "C/D" },
        { value: "Group A", hsg: "A" },
        { value: "W", hsg: null },
      ],
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.problems).toEqual([
      expect.objectContaining({ values: ["W"], featureCount: 1 }),
    ]);
    const rows = await t.db
      .select({ index: layerFeatures.featureIndex, hsg: layerFeatures.hsg })
      .from(layerFeatures)
      .where(eq(layerFeatures.layerId, soilId));
    expect(rows.sort((a, b) => a.index - b.index).map((r) => r.hsg)).toEqual([
      "B",
      "C/D",
      "A",
      null,
    ]);
  });

  it("refuses an HSG that is not a group, naming the entry", async () => {
    const res = await gis
      .put(`/api/layers/${soilId}/mapping`)
      .send({ field: "HYDGRP", entries: [{ value: "B", hsg: "E" }] });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toEqual(["entries.0.hsg"]);
  });
});

describe("reading and deleting layers", () => {
  it("lists the project's layers with status and counts", async () => {
    const res = await gis.get(`/api/projects/${projectId}/layers`);
    expect(res.status).toBe(200);
    // The answer is what the published schema (OpenAPI) says it is.
    expect(layerSchema.array().safeParse(res.body).error).toBeUndefined();
    const ids = res.body.map((l: { id: string }) => l.id);
    expect(ids).toEqual(expect.arrayContaining([coverId, soilId]));
    expect(res.body.find((l: { id: string }) => l.id === soilId)).toMatchObject({
      status: "ready",
      featureCount: 4,
      kind: "soil",
    });
  });

  it("serves GeoJSON features inside a bbox, capped by the limit", async () => {
    const all = await gis.get(`/api/layers/${soilId}/features`);
    expect(all.body.features).toHaveLength(4);
    // The first two squares span -122.400 … -122.398; the box stops short of the third.
    const some = await gis.get(
      `/api/layers/${soilId}/features?bbox=-122.4005,37.6995,-122.3985,37.7005`,
    );
    expect(some.body.features.map((f: { featureIndex: number }) => f.featureIndex)).toEqual([0, 1]);
    const capped = await gis.get(`/api/layers/${soilId}/features?limit=1`);
    expect(capped.body).toMatchObject({ truncated: true });
    expect(capped.body.features[0].properties).toEqual({ HYDGRP: "B" });
  });

  it("deletes a layer with its features, mapping and stored file", async () => {
    const project = await freshProject(t.db, teamId);
    const up = await uploadLayer(gis, project, {
      kind: "cover",
      file: kit.write("gone.zip", coverShapefileZip()),
    });
    expect(await leftovers(t, project)).toMatchObject({ layers: 1, features: 3, objects: 1 });
    const res = await gis.delete(`/api/layers/${up.body.id}`);
    expect(res.status).toBe(204);
    expect(await leftovers(t, project)).toEqual({ layers: 0, features: 0, objects: 0, jobs: 0 });
  });
});
