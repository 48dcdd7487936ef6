import { eq, sql } from "drizzle-orm";
import { layerFeatures, layers } from "../../server/db/schema-geodata";
import type { Agent, TestApp } from "./app";

export interface UploadForm {
  kind: string;
  file: string;
  /** The file name the client sends (defaults to the file's own). */
  filename?: string;
  name?: string;
  verticalUnit?: "m" | "ft";
}

/** A multipart upload as the client sends it: text fields first, then the file. */
export function uploadLayer(agent: Agent, projectId: string, form: UploadForm) {
  let req = agent.post(`/api/projects/${projectId}/layers`).field("kind", form.kind);
  if (form.name) req = req.field("name", form.name);
  if (form.verticalUnit) req = req.field("verticalUnit", form.verticalUnit);
  return req.attach("file", form.file, form.filename ? { filename: form.filename } : undefined);
}

/** What a project's uploads left: layer rows, features, stored objects, queued jobs. */
export async function leftovers(t: TestApp, projectId: string) {
  const rows = await t.db
    .select({ id: layers.id })
    .from(layers)
    .where(eq(layers.projectId, projectId));
  const [features] = await t.db
    .select({ n: sql<number>`count(*)::int` })
    .from(layerFeatures)
    .innerJoin(layers, eq(layers.id, layerFeatures.layerId))
    .where(eq(layers.projectId, projectId));
  const objects = await t.store.list(`projects/${projectId}/`);
  const jobs = await t.pool.query<{ n: number }>(
    "select count(*)::int as n from pgboss.job where name = $1",
    [t.jobs.ingestQueue],
  );
  return {
    layers: rows.length,
    features: features?.n ?? 0,
    objects: objects.length,
    jobs: jobs.rows[0]?.n ?? 0,
  };
}

export const NOTHING = { layers: 0, features: 0, objects: 0, jobs: 0 };
