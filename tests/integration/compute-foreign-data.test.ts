/**
 * Another team's data in the same place must neither change a project's compute nor be read by
 * it. The other team's cover and soil (synthetic, invented) lie over the test subcatchment;
 * the sheet is the same as without them, and EXPLAIN ANALYZE of the compute's feature queries
 * shows every scan of layer_features found its rows by layer first and looked only at the
 * project's own features (a count, not a time: the plan is what keeps the time flat).
 */
import { eq, inArray, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { projects } from "../../server/db/schema";
import { layers, surfaceClasses } from "../../server/db/schema-geodata";
import { ensureTeamCatalog } from "../../server/geodata/catalog-seed";
import { coverSoilAreaQuery } from "../../server/geodata/compute/figures";
import { featuresNearQuery } from "../../server/geodata/compute/load";
import type { TravelTimeSheet } from "../../shared/schemas/sheet";
import { COVER, SOILS } from "../fixtures/geo/scenario";
import { createTeam, startTestApp, type TestApp } from "../support/app";
import { scansOf } from "../support/explain";
import { BOUNDARY, buildGeodataCase, type GeodataCase } from "../support/geodata-case";

/** Per kind: enough that a scan of every feature in the box would be plainly visible. */
const FOREIGN_PER_KIND = 3000;

let t: TestApp;
let c: GeodataCase;
let alone: TravelTimeSheet;
let among: TravelTimeSheet;

async function compute(): Promise<TravelTimeSheet> {
  // The intersection areas are cached under the layers' updated_at: touch them for a cold run.
  await t.db.update(layers).set({ updatedAt: new Date() }).where(eq(layers.projectId, c.projectId));
  const res = await c.engineer.post(`/api/subcatchments/${c.subcatchmentId}/compute`).send({});
  if (res.status !== 200) throw new Error(`compute answered ${res.status}`);
  return res.body as TravelTimeSheet;
}

/** Another team's project with a cover and a soil layer of small polygons over the boundary. */
async function addForeignLayers(): Promise<void> {
  const team = await createTeam(t.db, "foreign-owner");
  await ensureTeamCatalog(t.db, team.id);
  const [project] = await t.db
    .insert(projects)
    .values({ teamId: team.id, name: "Neighbour", units: "si", designReturnPeriodYears: 10 })
    .returning({ id: projects.id });
  const [cls] = await t.db
    .select({ id: surfaceClasses.id })
    .from(surfaceClasses)
    .where(eq(surfaceClasses.teamId, team.id))
    .limit(1);
  if (!project || !cls) throw new Error("foreign set-up failed");
  const ring = BOUNDARY.type === "Polygon" ? BOUNDARY.coordinates[0] : undefined;
  const [w, s] = ring?.[0] ?? [0, 0];
  const [e, n] = ring?.[2] ?? [0, 0];
  const side = Math.ceil(Math.sqrt(FOREIGN_PER_KIND));
  for (const kind of ["cover", "soil"] as const) {
    const [layer] = await t.db
      .insert(layers)
      .values({
        projectId: project.id,
        kind,
        name: `Neighbour ${kind}`,
        format: "geojson",
        originalFilename: `${kind}.geojson`,
        sizeBytes: 1,
        status: "ready",
        featureCount: FOREIGN_PER_KIND,
      })
      .returning({ id: layers.id });
    if (!layer) throw new Error("foreign layer insert failed");
    // Squares on a grid over the boundary's box: each would change CN and C if it were read.
    await t.db.execute(sql`
      insert into layer_features (layer_id, feature_index, geom, attributes, surface_class_id, hsg)
      select ${layer.id}::uuid, k,
        ST_Expand(ST_SetSRID(ST_MakePoint(
          ${w}::float8 + (k % ${side} + 0.5) * (${e}::float8 - ${w}::float8) / ${side},
          ${s}::float8 + (k / ${side} + 0.5) * (${n}::float8 - ${s}::float8) / ${side}), 4326),
          0.4 * (${e}::float8 - ${w}::float8) / ${side}),
        '{}'::jsonb,
        ${kind === "cover" ? cls.id : null}::uuid,
        ${kind === "soil" ? "D" : null}
      from generate_series(0, ${FOREIGN_PER_KIND - 1}) k`);
  }
  await t.db.execute(sql`analyze layer_features`);
}

beforeAll(async () => {
  t = await startTestApp();
  c = await buildGeodataCase(t, "foreign-data");
  alone = await compute();
  await addForeignLayers();
  among = await compute();
});
afterAll(() => t.close());

const pathBox = () =>
  sql`(select ST_Envelope(geom) from flow_paths where subcatchment_id = ${c.subcatchmentId})`;

describe("another team's data over the same ground", () => {
  it("leaves the sheet as it was: segments, every method's Tc, peak flow", () => {
    expect(among.segments).toEqual(alone.segments);
    expect(among.methods).toEqual(alone.methods);
    expect(among.peakFlow).toEqual(alone.peakFlow);
    expect(among.governing).toEqual(alone.governing);
  });

  it("is never read: the compute's feature queries scan layer_features by layer, own rows only", async () => {
    const own = await t.db
      .select({ n: sql<number>`count(*)::int` })
      .from(sql`layer_features`)
      .where(inArray(sql`layer_id`, [c.coverLayerId, c.soilLayerId]));
    const ownCount = own[0]?.n ?? 0;
    expect(ownCount).toBe(COVER.length + SOILS.length);
    const queries = [
      coverSoilAreaQuery(c.projectId, c.subcatchmentId),
      featuresNearQuery(c.projectId, "cover", pathBox()),
      featuresNearQuery(c.projectId, "soil", pathBox()),
    ];
    for (const query of queries) {
      const scans = await scansOf(t.db, query, "layer_features");
      expect(scans.length).toBeGreaterThan(0);
      for (const scan of scans) {
        expect(scan.nodeType).not.toBe("Seq Scan");
        expect(scan.condition).toContain("layer_id");
      }
      const lookedAt = scans.reduce((sum, s) => sum + s.rowsLookedAt, 0);
      expect(lookedAt).toBeLessThanOrEqual(ownCount);
    }
  });
});
