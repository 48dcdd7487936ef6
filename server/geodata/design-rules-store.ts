/** A project's Design rules as stored, or the documented defaults when it has none yet. */
import { eq } from "drizzle-orm";
import type { RulesInput } from "../../shared/hydrology/rules";
import { DESIGN_RULE_DEFAULTS, type DesignRules } from "../../shared/schemas/design-rules";
import type { DbOrTx } from "../db/client";
import { designRules } from "../db/schema-geodata";

type Row = typeof designRules.$inferSelect;

export function toDesignRules(projectId: string, row: Row | undefined): DesignRules {
  if (!row) return { projectId, rules: {}, ...DESIGN_RULE_DEFAULTS, version: 0, updatedAt: null };
  return {
    projectId,
    rules: row.rules as RulesInput,
    dualHsg: row.dualHsg === "drained" ? "drained" : "undrained",
    channelSlope: row.channelSlope === "10-85" ? "10-85" : "end-to-end",
    rainfallTableId: row.rainfallTableId,
    profileSpacingM: row.profileSpacingM,
    version: row.version,
    updatedAt: row.updatedAt.toISOString(),
  };
}

export async function loadDesignRules(db: DbOrTx, projectId: string): Promise<DesignRules> {
  const [row] = await db.select().from(designRules).where(eq(designRules.projectId, projectId));
  return toDesignRules(projectId, row);
}
