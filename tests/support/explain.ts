/**
 * What a query read from one table, from EXPLAIN (ANALYZE, FORMAT JSON): every scan node on the
 * table, how it found its rows, and how many rows it looked at (returned plus removed by a
 * filter or an index recheck, times its loops). Used to show a query never reads another
 * project's rows, an assertion that does not depend on the machine's speed.
 */
import { sql, type SQL } from "drizzle-orm";
import type { Db } from "../../server/db/client";

interface PlanNode {
  "Node Type": string;
  "Relation Name"?: string;
  "Index Name"?: string;
  "Index Cond"?: string;
  "Recheck Cond"?: string;
  "Actual Rows"?: number;
  "Actual Loops"?: number;
  "Rows Removed by Filter"?: number;
  "Rows Removed by Index Recheck"?: number;
  Plans?: PlanNode[];
}

export interface TableScan {
  nodeType: string;
  /** The index condition (or the bitmap heap scan's recheck condition); "" for a seq scan. */
  condition: string;
  indexName: string | undefined;
  rowsLookedAt: number;
}

function walk(node: PlanNode, out: PlanNode[]): void {
  out.push(node);
  for (const child of node.Plans ?? []) walk(child, out);
}

export async function scansOf(db: Db, query: SQL, table: string): Promise<TableScan[]> {
  const result = await db.execute<{ "QUERY PLAN": { Plan: PlanNode }[] }>(
    sql`explain (analyze, format json) ${query}`,
  );
  const plan = result.rows[0]?.["QUERY PLAN"][0]?.Plan;
  if (!plan) throw new Error("EXPLAIN answered no plan");
  const nodes: PlanNode[] = [];
  walk(plan, nodes);
  // A bitmap heap scan's index is in its child (a Bitmap Index Scan, with no relation name).
  return nodes
    .filter((n) => n["Relation Name"] === table)
    .map((n) => {
      const bitmap = n.Plans?.find((c) => c["Node Type"] === "Bitmap Index Scan");
      const loops = n["Actual Loops"] ?? 1;
      const rows =
        (n["Actual Rows"] ?? 0) +
        (n["Rows Removed by Filter"] ?? 0) +
        (n["Rows Removed by Index Recheck"] ?? 0);
      return {
        nodeType: n["Node Type"],
        condition: n["Index Cond"] ?? bitmap?.["Index Cond"] ?? n["Recheck Cond"] ?? "",
        indexName: n["Index Name"] ?? bitmap?.["Index Name"],
        rowsLookedAt: rows * loops,
      };
    });
}
