/**
 * Tile benchmark (run by `npm run bench`, or alone with `DATABASE_URL=… npx tsx bench/tiles.ts`):
 * a cover layer of 100,000 polygons (synthetic, invented: 12-sided rings on a 20 m grid over a
 * 6.3 km square in UTM 10N, inserted with SQL, six surface classes) and the demo terrain file;
 * then tiles requested one after another over HTTP on loopback from the real app (session
 * cookie, the whole middleware chain), a deterministic spread of tiles at zooms 13–17 (cover
 * polygons are served from zoom 15; the lower zooms show what the other layers cost).
 * Prints p50 / p95 per zoom, the tile sizes, whether the tile query uses the GiST index, and
 * the terrain and basemap tile times, and where a terrain tile's time goes (bench/terrain-tiles.ts).
 * Target: p95 under 50 ms per tile.
 */
import http from "node:http";
import type { AddressInfo } from "node:net";
import { pathToFileURL } from "node:url";
import { eq, sql } from "drizzle-orm";
import { SESSION_COOKIE } from "../server/auth/session";
import { runMigrations } from "../server/db/migrate";
import { layers, surfaceClasses } from "../server/db/schema-geodata";
import { ensureTeamCatalog } from "../server/geodata/catalog-seed";
import { inspectTerrain } from "../server/geodata/terrain";
import { seedBasemap } from "../server/seed/basemap";
import { projectTileQuery } from "../server/tiles/project-tiles";
import { createTeam, startTestApp, type TestApp } from "../tests/support/app";
import type { BenchRow } from "./table";
import { run as terrainTileParts } from "./terrain-tiles";

const POLYGONS = 100_000;
const SIDE = Math.ceil(Math.sqrt(POLYGONS));
const TILES_PER_ZOOM = 40;
const TARGET_MS = 50;

/** WGS84 corners of the synthetic cover (UTM 10N 560000–566340 E, 4240000–4246340 N). */
const AREA = { west: -122.3137, south: 38.3057, east: -122.2407, north: 38.3632 };

function tileRange(z: number) {
  const n = 2 ** z;
  const tx = (lon: number) => Math.floor(((lon + 180) / 360) * n);
  const ty = (lat: number) => {
    const r = (lat * Math.PI) / 180;
    return Math.floor(((1 - Math.log(Math.tan(r) + 1 / Math.cos(r)) / Math.PI) / 2) * n);
  };
  return { x0: tx(AREA.west), x1: tx(AREA.east), y0: ty(AREA.north), y1: ty(AREA.south) };
}

/** A fixed pseudo-random spread (mulberry32), so every run asks for the same tiles. */
function spread(z: number, count: number): [number, number, number][] {
  const { x0, x1, y0, y1 } = tileRange(z);
  const all: [number, number, number][] = [];
  for (let x = x0; x <= x1; x += 1) for (let y = y0; y <= y1; y += 1) all.push([z, x, y]);
  let seed = 0x5eed + z;
  const next = () => {
    seed = (seed + 0x6d2b79f5) | 0;
    let v = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    v = (v + Math.imul(v ^ (v >>> 7), 61 | v)) ^ v;
    return ((v ^ (v >>> 14)) >>> 0) / 4294967296;
  };
  for (let k = all.length - 1; k > 0; k -= 1) {
    const j = Math.floor(next() * (k + 1));
    [all[k], all[j]] = [all[j] as [number, number, number], all[k] as [number, number, number]];
  }
  return all.slice(0, count);
}

const quantile = (sorted: number[], q: number) =>
  sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))] ?? Number.NaN;

async function insertCover(t: TestApp, projectId: string, teamId: string): Promise<void> {
  await ensureTeamCatalog(t.db, teamId);
  const classes = await t.db
    .select({ id: surfaceClasses.id })
    .from(surfaceClasses)
    .where(eq(surfaceClasses.teamId, teamId))
    .limit(6);
  const [layer] = await t.db
    .insert(layers)
    .values({
      projectId,
      kind: "cover",
      name: "100k polygons (synthetic)",
      format: "shapefile",
      originalFilename: "cover-100k.zip",
      sizeBytes: 0,
      status: "ready",
      featureCount: POLYGONS,
    })
    .returning({ id: layers.id });
  if (!layer) throw new Error("bench layer insert failed");
  const ids = classes.map((c) => c.id);
  await t.db.execute(sql`
    insert into layer_features (layer_id, feature_index, geom, attributes, surface_class_id)
    select ${layer.id}::uuid, k,
      ST_Transform(ST_Buffer(ST_SetSRID(ST_MakePoint(
        560000 + (k % ${SIDE}) * 20 + 10, 4240000 + (k / ${SIDE}) * 20 + 10), 26910), 8, 3), 4326),
      jsonb_build_object('ID', k),
      (${`{${ids.join(",")}}`}::uuid[])[1 + k % ${ids.length}]
    from generate_series(0, ${POLYGONS - 1}) k`);
  await t.db.execute(sql`analyze layer_features`);
}

async function timeTiles(base: string, cookie: string, paths: string[]) {
  const times: number[] = [];
  const sizes: number[] = [];
  for (const p of paths) {
    const start = performance.now();
    const res = await fetch(`${base}${p}`, { headers: { cookie } });
    const body = new Uint8Array(await res.arrayBuffer());
    times.push(performance.now() - start);
    if (res.status !== 200 && res.status !== 204) throw new Error(`${p} answered ${res.status}`);
    sizes.push(body.length);
  }
  return { times: [...times].sort((a, b) => a - b), sizes: [...sizes].sort((a, b) => a - b) };
}

export async function run(): Promise<BenchRow[]> {
  const databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) return [{ name: "vector tiles", value: "skipped: no DATABASE_URL" }];
  await runMigrations(databaseUrl);
  const t = await startTestApp();
  const server = http.createServer(t.app);
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const rows: BenchRow[] = [];
  let teamId: string | undefined;
  try {
    const team = await createTeam(t.db, "bench-tiles");
    teamId = team.id;
    const [project] = (
      await t.db.execute<{ id: string }>(sql`
        insert into projects (team_id, name, units, design_return_period_years)
        values (${team.id}::uuid, 'Tile bench', 'si', 10) returning id`)
    ).rows;
    if (!project) throw new Error("bench project insert failed");
    const started = performance.now();
    await insertCover(t, project.id, team.id);
    rows.push({
      name: `insert ${POLYGONS.toLocaleString("en")} cover polygons (SQL)`,
      value: ((performance.now() - started) / 1000).toFixed(1),
      unit: "s",
    });
    await seedBasemap(t.db);

    const signIn = await fetch(`${base}/api/auth/sign-in`, {
      method: "POST",
      headers: { "content-type": "application/json", origin: t.config.publicBaseUrl },
      body: JSON.stringify({
        email: team.members.viewer.email,
        password: team.members.viewer.password,
      }),
    });
    const cookie =
      signIn.headers
        .getSetCookie()
        .map((c) => c.split(";")[0] ?? "")
        .find((c) => c.startsWith(`${SESSION_COOKIE}=`)) ?? "";

    const plan = await t.db.execute<{ "QUERY PLAN": string }>(
      sql`explain ${projectTileQuery(project.id, { z: 16, ...tileRange(16), x: tileRange(16).x0 + 3, y: tileRange(16).y0 + 3 })}`,
    );
    const usesGist = plan.rows.some((r) =>
      r["QUERY PLAN"].includes("layer_features_layer_geom_gist"),
    );
    rows.push({
      name: "tile query uses the GiST index (EXPLAIN, z 16)",
      value: usesGist ? "yes" : "no",
      ok: usesGist,
    });

    const all: number[] = [];
    for (const z of [13, 14, 15, 16, 17]) {
      const paths = spread(z, TILES_PER_ZOOM).map(
        ([zz, x, y]) => `/api/projects/${project.id}/tiles/${zz}/${x}/${y}.mvt`,
      );
      await timeTiles(base, cookie, paths.slice(0, 2)); // warm the connection and the plan
      const { times, sizes } = await timeTiles(base, cookie, paths);
      all.push(...times);
      const p95 = quantile(times, 0.95);
      rows.push({
        name: `project tile z ${z} (${paths.length} tiles) p50 / p95`,
        value: `${quantile(times, 0.5).toFixed(1)} / ${p95.toFixed(1)}`,
        unit: "ms",
        target: `p95 < ${TARGET_MS}`,
        ok: p95 < TARGET_MS,
      });
      rows.push({
        name: `project tile z ${z} size median / max`,
        value: `${(quantile(sizes, 0.5) / 1024).toFixed(1)} / ${((sizes[sizes.length - 1] ?? 0) / 1024).toFixed(1)}`,
        unit: "KB",
      });
    }
    all.sort((a, b) => a - b);
    const p95 = quantile(all, 0.95);
    rows.push({
      name: `project tiles, all zooms (${all.length}) p50 / p95`,
      value: `${quantile(all, 0.5).toFixed(1)} / ${p95.toFixed(1)}`,
      unit: "ms",
      target: `p95 < ${TARGET_MS}`,
      ok: p95 < TARGET_MS,
    });
    rows.push(...(await terrainAndBasemap(t, base, cookie, project.id)));
    rows.push(...(await terrainTileParts()));
  } finally {
    await new Promise<void>((resolve) => server.close(() => resolve()));
    server.closeAllConnections();
    // The bench's rows go with its team (projects, layers and features cascade).
    if (teamId) await t.db.execute(sql`delete from teams where id = ${teamId}::uuid`);
    await t.close();
  }
  return rows;
}

/** The demo terrain (256 × 256 cells of 2 m) as raster-dem tiles, and the demo basemap. */
async function terrainAndBasemap(t: TestApp, base: string, cookie: string, projectId: string) {
  const file = new URL("../demo-geo/out/terrain.tif", import.meta.url).pathname;
  const info = await inspectTerrain(file, "m");
  const objectKey = `bench/${projectId}/terrain.tif`;
  await t.store.putFile(objectKey, file, "image/tiff");
  const [layer] = await t.db
    .insert(layers)
    .values({
      projectId,
      kind: "terrain",
      name: "Demo terrain",
      format: "geotiff",
      originalFilename: "terrain.tif",
      sizeBytes: 1,
      objectKey,
      status: "ready",
      terrain: { ...info },
      bbox4326: [...info.bbox4326],
    })
    .returning({ id: layers.id });
  if (!layer) throw new Error("bench terrain insert failed");
  const [w, s, e, n] = info.bbox4326;
  const paths: string[] = [];
  const basemap: string[] = [];
  for (const z of [14, 15, 16, 17]) {
    const count = 2 ** z;
    const tx = (lon: number) => Math.floor(((lon + 180) / 360) * count);
    const ty = (lat: number) => {
      const r = (lat * Math.PI) / 180;
      return Math.floor(((1 - Math.log(Math.tan(r) + 1 / Math.cos(r)) / Math.PI) / 2) * count);
    };
    for (let x = tx(w); x <= tx(e); x += 1) {
      for (let y = ty(n); y <= ty(s); y += 1) {
        paths.push(`/api/layers/${layer.id}/terrain/${z}/${x}/${y}.png`);
        basemap.push(`/api/basemap/tiles/${z}/${x}/${y}.mvt`);
      }
    }
  }
  const first = await timeTiles(base, cookie, paths.slice(0, 1));
  // Three rounds: the demo terrain has only 17 tiles at these zooms, too few for a p95.
  const rounds = [...paths, ...paths, ...paths];
  const terrain = await timeTiles(base, cookie, rounds);
  const maps = await timeTiles(base, cookie, basemap);
  const p95 = quantile(terrain.times, 0.95);
  const mp95 = quantile(maps.times, 0.95);
  return [
    {
      name: "terrain tile, first (opens the file)",
      value: (first.times[0] ?? 0).toFixed(1),
      unit: "ms",
    },
    {
      name: `terrain tile z 14–17 (${paths.length} tiles × 3) p50 / p95`,
      value: `${quantile(terrain.times, 0.5).toFixed(1)} / ${p95.toFixed(1)}`,
      unit: "ms",
      target: `p95 < ${TARGET_MS}`,
      ok: p95 < TARGET_MS,
    },
    {
      name: `basemap tile z 14–17 (${basemap.length} tiles) p50 / p95`,
      value: `${quantile(maps.times, 0.5).toFixed(1)} / ${mp95.toFixed(1)}`,
      unit: "ms",
      target: `p95 < ${TARGET_MS}`,
      ok: mp95 < TARGET_MS,
    },
  ] satisfies BenchRow[];
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  const { formatTable } = await import("./table");
  console.log(formatTable(await run()));
}
