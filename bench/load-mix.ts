/**
 * The mixed load of people working at the Map desk, for `bench/load.ts`: map tiles (project
 * vector tiles, basemap tiles, terrain tiles), the travel-time sheet, the subcatchment list and
 * computing, against a running Rillmark whose invented demo project is seeded. autocannon sends
 * it on many connections at once; each connection goes round the same cycle of 20 requests:
 *
 *   12 map tiles (4 project, 4 basemap, 4 terrain, zooms 15–17 over the demo area),
 *    3 travel-time sheets, 3 subcatchment lists, 2 computes.
 *
 * The computes go to several copies of the demo subcatchment, as several engineers would each
 * compute their own; the reads go to all of them too.
 */
import autocannon from "autocannon";
import { ApiClient } from "../server/seed/api-client";
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_PROJECT } from "../server/seed/demo";

export interface MixTarget {
  baseUrl: string;
  cookie: string;
  projectId: string;
  subcatchmentIds: string[];
  terrainLayerId: string;
  /** WGS84 bbox of the demo area (the terrain layer's). */
  bbox: [number, number, number, number];
}

export interface LoadResult {
  requestsPerSecond: number;
  p50Ms: number;
  p99Ms: number;
  /** Connection errors, timeouts and answers other than 2xx. */
  errors: number;
  requests: number;
}

interface Named {
  id: string;
  name: string;
}

/** How many copies of the demo subcatchment the computes spread over. */
const SUBCATCHMENT_COPIES = 4;

function tileAt(lon: number, lat: number, z: number): [number, number, number] {
  const n = 2 ** z;
  const r = (lat * Math.PI) / 180;
  const x = Math.floor(((lon + 180) / 360) * n);
  const y = Math.floor(((1 - Math.log(Math.tan(r) + 1 / Math.cos(r)) / Math.PI) / 2) * n);
  return [z, x, y];
}

/** Signs in as the demo engineer and finds (or makes) what the mix asks for. */
export async function prepareMix(baseUrl: string): Promise<MixTarget> {
  const email = DEMO_ACCOUNTS.find((a) => a.role === "engineer")?.email;
  if (!email) throw new Error("no demo engineer");
  const api = await ApiClient.signIn(baseUrl, email, DEMO_PASSWORD);
  const me = await api.get<{ memberships: { teamId: string }[] }>("/auth/me");
  const teamId = me.memberships[0]?.teamId;
  const projects = await api.get<Named[]>(`/teams/${teamId}/projects`);
  const project = projects.find((p) => p.name === DEMO_PROJECT.name);
  if (!project) throw new Error("the demo project is not seeded");
  const layers = await api.get<Array<{ id: string; kind: string; bbox4326: number[] | null }>>(
    `/projects/${project.id}/layers`,
  );
  const terrain = layers.find((l) => l.kind === "terrain");
  if (!terrain?.bbox4326) throw new Error("the demo project has no terrain layer");
  const listPath = `/projects/${project.id}/subcatchments`;
  let subs = await api.get<Named[]>(listPath);
  const demo = subs[0];
  if (!demo) throw new Error("the demo project has no subcatchment");
  for (let k = subs.length; k < SUBCATCHMENT_COPIES; k += 1) {
    await copySubcatchment(api, project.id, demo.id, `${demo.name} (load copy ${k})`);
  }
  subs = await api.get<Named[]>(listPath);
  const ids = subs.slice(0, SUBCATCHMENT_COPIES).map((s) => s.id);
  for (const id of ids) await api.json("POST", `/subcatchments/${id}/compute`, {});
  return {
    baseUrl,
    cookie: api.cookieHeader,
    projectId: project.id,
    subcatchmentIds: ids,
    terrainLayerId: terrain.id,
    bbox: terrain.bbox4326 as [number, number, number, number],
  };
}

/** A copy through the API: boundary, outlet and flow path of the demo subcatchment. */
async function copySubcatchment(api: ApiClient, projectId: string, fromId: string, name: string) {
  const from = await api.get<{
    boundary: object | null;
    outlet: object | null;
    channel: object | null;
    flowPath: { geometry: object } | null;
  }>(`/subcatchments/${fromId}`);
  const { boundary, outlet, channel, flowPath } = from;
  const made = await api.json<{ id: string }>("POST", `/projects/${projectId}/subcatchments`, {
    name,
    scenario: "existing",
    boundary,
    outlet,
    channel,
  });
  if (flowPath) {
    await api.json("PUT", `/subcatchments/${made.id}/flow-path`, { geometry: flowPath.geometry });
  }
}

/** The cycle of 20 requests each connection repeats. */
export function mixRequests(t: MixTarget): autocannon.Request[] {
  const [w, s, e, n] = t.bbox;
  const spots: [number, number][] = [
    [w + (e - w) * 0.3, s + (n - s) * 0.4],
    [w + (e - w) * 0.7, s + (n - s) * 0.6],
    [w + (e - w) * 0.5, s + (n - s) * 0.5],
    [w + (e - w) * 0.4, s + (n - s) * 0.7],
  ];
  const zooms = [15, 16, 17, 16];
  const tiles = spots.map(([lon, lat], k) => tileAt(lon, lat, zooms[k] ?? 16));
  const path = (p: string) => ({ method: "GET" as const, path: `/api${p}` });
  const sub = (k: number) => t.subcatchmentIds[k % t.subcatchmentIds.length] ?? "";
  const tileReqs = tiles.flatMap(([z, x, y]) => [
    path(`/projects/${t.projectId}/tiles/${z}/${x}/${y}.mvt`),
    path(`/basemap/tiles/${z}/${x}/${y}.mvt`),
    path(`/layers/${t.terrainLayerId}/terrain/${z}/${x}/${y}.png`),
  ]);
  const sheet = (k: number) => path(`/subcatchments/${sub(k)}/sheet`);
  const list = path(`/projects/${t.projectId}/subcatchments`);
  const compute = (k: number) => ({
    method: "POST" as const,
    path: `/api/subcatchments/${sub(k)}/compute`,
    body: "{}",
  });
  return [
    ...tileReqs.slice(0, 6),
    sheet(0),
    list,
    compute(0),
    sheet(1),
    ...tileReqs.slice(6, 12),
    list,
    sheet(2),
    compute(1),
    list,
  ];
}

/** Runs the mix on `connections` connections for `seconds`. */
export async function runMix(
  t: MixTarget,
  connections: number,
  seconds: number,
): Promise<LoadResult> {
  const result = await autocannon({
    url: t.baseUrl,
    connections,
    duration: seconds,
    headers: {
      cookie: t.cookie,
      origin: t.baseUrl,
      "content-type": "application/json",
      "accept-encoding": "gzip",
    },
    requests: mixRequests(t),
    timeout: 30,
  });
  return {
    requestsPerSecond: result.requests.average,
    p50Ms: result.latency.p50,
    p99Ms: result.latency.p99,
    errors: result.errors + result.timeouts + result.non2xx,
    requests: result.requests.total,
  };
}
