/**
 * The result summaries of a project's subcatchments in one query: each stored sheet's governing
 * Tc, method label and first problem are read from its jsonb, and its path version is compared
 * with the path's current one (the same rule as the stored sheet's `stale`).
 */
import { eq, sql } from "drizzle-orm";
import type { ResultSummary } from "../../shared/schemas/subcatchments";
import type { DbOrTx } from "../db/client";
import { flowPaths, subcatchmentResults, subcatchments } from "../db/schema-geodata";

/** Summary by subcatchment id; a subcatchment never computed has no entry. */
export async function loadResultSummaries(
  db: DbOrTx,
  projectId: string,
): Promise<Map<string, ResultSummary>> {
  const sheet = subcatchmentResults.sheet;
  const rows = await db
    .select({
      id: subcatchments.id,
      flowPathVersion: subcatchmentResults.flowPathVersion,
      computedAt: subcatchmentResults.computedAt,
      pathVersion: flowPaths.version,
      governingTcMin: sql<number | null>`(${sheet} #>> '{governing,tcMin}')::float8`,
      governingMethodLabel: sql<string | null>`${sheet} #>> '{governing,label}'`,
      problem: sql<string | null>`${sheet} #>> '{problems,0}'`,
    })
    .from(subcatchments)
    .innerJoin(subcatchmentResults, eq(subcatchmentResults.subcatchmentId, subcatchments.id))
    .leftJoin(flowPaths, eq(flowPaths.subcatchmentId, subcatchments.id))
    .where(eq(subcatchments.projectId, projectId));
  return new Map(
    rows.map((r) => [
      r.id,
      {
        governingTcMin: r.governingTcMin === null ? null : Number(r.governingTcMin),
        governingMethodLabel: r.governingMethodLabel,
        problem: r.governingTcMin === null ? r.problem : null,
        computedAt: r.computedAt.toISOString(),
        flowPathVersion: r.flowPathVersion,
        stale: (r.pathVersion ?? 0) !== r.flowPathVersion,
      },
    ]),
  );
}
