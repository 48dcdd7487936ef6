import { and, eq, inArray, sql } from "drizzle-orm";
import { Router } from "express";
import {
  coverMappingBody,
  fieldName,
  soilMappingBody,
  type FieldValue,
  type FieldValues,
} from "../../shared/schemas/layers";
import { currentTeam, requirePermission, requireUser } from "../auth/guards";
import type { DbOrTx } from "../db/client";
import { attributeMappings, layerFeatures, layers, surfaceClasses } from "../db/schema-geodata";
import { ensureTeamCatalog } from "../geodata/catalog-seed";
import { HttpError, invalidInput } from "../http/errors";
import { validate, validateParam } from "../http/validate";
import { currentLayer, loadLayerAccess } from "../layers/access";
import { toLayer, type LayerRow } from "../layers/dto";
import { suggestCoverClass, suggestHsg } from "../layers/suggest";
import type { RouteDeps } from "./deps";

const MAX_VALUES = 10_000;

function mappable(row: LayerRow): "cover" | "soil" {
  if (row.kind !== "cover" && row.kind !== "soil") {
    throw new HttpError(
      422,
      "not_mappable",
      `Only cover and soil layers are mapped; this is a ${row.kind} layer.`,
    );
  }
  if (row.status !== "ready") {
    throw new HttpError(409, "layer_not_ready", "The layer is still being processed (or failed).");
  }
  return row.kind;
}

function knownField(row: LayerRow, field: string): void {
  if (!(row.fields as string[]).includes(field)) {
    throw invalidInput(
      { field: `"${field}" is not a field of ${row.originalFilename}.` },
      `The layer has no field "${field}".`,
    );
  }
}

async function teamCatalog(db: DbOrTx, teamId: string) {
  await ensureTeamCatalog(db, teamId);
  return db
    .select({ id: surfaceClasses.id, key: surfaceClasses.key, name: surfaceClasses.name })
    .from(surfaceClasses)
    .where(eq(surfaceClasses.teamId, teamId));
}

export function layerMappingRouter({ db }: RouteDeps): Router {
  const router = Router();
  const layer = [requireUser(db), loadLayerAccess(db)];

  // The field's distinct values with counts, what each maps to now, and a suggestion.
  router.get(
    "/layers/:layerId/fields/:field/values",
    ...layer,
    requirePermission("project:read"),
    async (req, res) => {
      const row = currentLayer(req);
      const kind = mappable(row);
      const field = validateParam(fieldName, req.params.field, "This field");
      knownField(row, field);
      const value = sql<string>`coalesce(${layerFeatures.attributes} ->> ${field}, '')`;
      const counts = await db
        .select({ value, count: sql<number>`count(*)::int` })
        .from(layerFeatures)
        .where(eq(layerFeatures.layerId, row.id))
        // By position: the field is a parameter, and two parameters never count as one expression.
        .groupBy(sql`1`)
        .orderBy(sql`2 desc, 1`)
        .limit(MAX_VALUES + 1);
      const mapped = new Map(
        (
          await db.select().from(attributeMappings).where(eq(attributeMappings.layerId, row.id))
        ).map((m) => [m.value, kind === "cover" ? m.surfaceClassId : m.hsg]),
      );
      const catalog = kind === "cover" ? await teamCatalog(db, currentTeam(req).teamId) : [];
      const sameField = row.mappingField === field;
      const values: FieldValue[] = counts.slice(0, MAX_VALUES).map((c) => ({
        value: c.value,
        featureCount: c.count,
        mapped: sameField ? (mapped.get(c.value) ?? null) : null,
        suggestion: kind === "cover" ? suggestCoverClass(c.value, catalog) : suggestHsg(c.value),
      }));
      const body: FieldValues = { field, kind, values, truncated: counts.length > MAX_VALUES };
      res.json(body);
    },
  );

  // Sets the mapping field and value → class (cover) or value → HSG (soil), all at once.
  router.put(
    "/layers/:layerId/mapping",
    ...layer,
    requirePermission("layer:edit"),
    async (req, res) => {
      const row = currentLayer(req);
      const kind = mappable(row);
      const body = validate(kind === "cover" ? coverMappingBody : soilMappingBody, req.body);
      knownField(row, body.field);
      const entries = body.entries.map((e) => ({
        value: e.value,
        surfaceClassId: "surfaceClassId" in e ? e.surfaceClassId : null,
        hsg: "hsg" in e ? e.hsg : null,
      }));
      const seen = new Set<string>();
      for (const [i, e] of entries.entries()) {
        if (seen.has(e.value)) {
          throw invalidInput({ [`entries.${i}.value`]: `"${e.value}" is listed twice.` });
        }
        seen.add(e.value);
      }
      if (kind === "cover") {
        const wanted = [...new Set(entries.flatMap((e) => e.surfaceClassId ?? []))];
        const teamId = currentTeam(req).teamId;
        const found = wanted.length
          ? await db
              .select({ id: surfaceClasses.id })
              .from(surfaceClasses)
              .where(and(eq(surfaceClasses.teamId, teamId), inArray(surfaceClasses.id, wanted)))
          : [];
        const known = new Set(found.map((f) => f.id));
        const bad = entries.findIndex((e) => e.surfaceClassId && !known.has(e.surfaceClassId));
        if (bad >= 0) {
          throw invalidInput({
            [`entries.${bad}.surfaceClassId`]: "No such class in this team's Surface catalog.",
          });
        }
      }
      await db.transaction(async (tx) => {
        await tx.delete(attributeMappings).where(eq(attributeMappings.layerId, row.id));
        const kept = entries.filter((e) => e.surfaceClassId !== null || e.hsg !== null);
        if (kept.length > 0) {
          await tx.insert(attributeMappings).values(kept.map((e) => ({ layerId: row.id, ...e })));
        }
        await tx.update(layers).set({ mappingField: body.field }).where(eq(layers.id, row.id));
        // Every feature takes the mapping of its value; values not listed become unmapped.
        await tx.execute(sql`
          update layer_features f
          set surface_class_id = m.surface_class_id, hsg = m.hsg
          from layer_features f2
          left join attribute_mappings m
            on m.layer_id = f2.layer_id
           and m.value = coalesce(f2.attributes ->> ${body.field}, '')
          where f.id = f2.id and f.layer_id = ${row.id}::uuid`);
      });
      const [updated] = await db.select().from(layers).where(eq(layers.id, row.id));
      res.json(await toLayer(db, updated ?? row));
    },
  );

  return router;
}
