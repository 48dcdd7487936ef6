/**
 * Seeds a team's Surface catalog from the engineering core's published defaults
 * (shared/hydrology/catalog), once: a team that already has classes is left as it is, so edits
 * and deletions stay. Called when a team is created and before any catalog read.
 */
import { eq, sql } from "drizzle-orm";
import { catalog } from "../../shared/hydrology";
import type { CatalogField } from "../../shared/hydrology/catalog";
import { surfaceValuesSchema, type SurfaceValues } from "../../shared/schemas/catalog";
import type { DbOrTx } from "../db/client";
import { surfaceClasses } from "../db/schema-geodata";

/** Rillmark's own palette: impervious greys, grass greens, woods dark green, water blue. */
const COLOURS: Record<string, string> = {
  pavement: "#5b5f66",
  concrete: "#9a9ea6",
  roof: "#b4523d",
  "drive-walk": "#c9c2b0",
  gravel: "#a8957a",
  "bare-soil": "#c7a36b",
  "lawn-good": "#7fbf5a",
  "lawn-fair": "#9cc86a",
  "lawn-poor": "#bcd27e",
  "turf-bermuda": "#6aa84f",
  "grass-swale": "#4f9d7a",
  "pasture-good": "#a9c25d",
  "pasture-poor": "#cfd08a",
  meadow: "#d8c86a",
  "range-natural": "#c2b37a",
  "desert-shrub": "#d9b98c",
  "woods-light": "#3f7d3a",
  "woods-dense": "#22552a",
  "cultivated-row": "#b8934a",
  "cultivated-residue": "#a57f3f",
  fallow: "#8d6e4f",
  water: "#3a78b5",
};

function sourced<V>(field: CatalogField<V>) {
  return field.value === null
    ? null
    : { value: field.value, source: field.source, note: field.note, rowId: field.rowId };
}

/** The stored values of a default class (validated, so a bad default fails loudly in tests). */
export function defaultValues(cls: catalog.SurfaceClass): SurfaceValues {
  const vk = sourced(cls.velocityK);
  const sk = sourced(cls.shallowFlowK);
  const c = cls.runoffC.value === null ? null : cls.runoffC;
  return surfaceValuesSchema.parse({
    sheetFlowN: sourced(cls.sheetFlowN),
    velocityKFtPerS: vk && { ...vk, value: vk.value.kFtPerS },
    shallowKFtPerS: sk && { ...sk, value: sk.value.kFtPerS },
    kerbyN: sourced(cls.kerbyN),
    cn: {
      ...cls.curveNumber.value,
      source: cls.curveNumber.source,
      note: cls.curveNumber.note,
      rowId: cls.curveNumber.rowId,
    },
    runoffC: c && {
      low: c.value.low,
      high: c.value.high,
      design: c.value.design,
      source: c.source,
      note: c.note,
      rowId: c.rowId,
    },
    colour: COLOURS[cls.id] ?? "#8a8f7a",
  });
}

// Serialises two first reads of one team's catalog (both would otherwise insert).
const CATALOG_LOCK = 0x4341_5441; // "CATA"

export async function ensureTeamCatalog(db: DbOrTx, teamId: string): Promise<void> {
  const [existing] = await db
    .select({ id: surfaceClasses.id })
    .from(surfaceClasses)
    .where(eq(surfaceClasses.teamId, teamId))
    .limit(1);
  if (existing) return;
  await db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(${CATALOG_LOCK}, hashtext(${teamId}))`);
    const [again] = await tx
      .select({ id: surfaceClasses.id })
      .from(surfaceClasses)
      .where(eq(surfaceClasses.teamId, teamId))
      .limit(1);
    if (again) return;
    await tx.insert(surfaceClasses).values(
      catalog.SURFACE_CLASSES.map((cls) => ({
        teamId,
        key: cls.id,
        name: cls.name,
        description: cls.description,
        values: defaultValues(cls),
        seededFrom: cls.id,
      })),
    );
  });
}
