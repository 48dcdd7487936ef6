import { describe, expect, it } from "vitest";
import type { z } from "zod";
import { createProjectBody, updateProjectBody } from "../../shared/schemas/projects";
import { apiDocs } from "./document";

interface RouteDefinition {
  type: string;
  route?: {
    method: string;
    path: string;
    request?: { body?: { content: Record<string, { schema: z.ZodType }> } };
  };
}

/** Every schema reachable from `root` through zod's own definitions (shapes, items, options…). */
function* schemasIn(root: z.ZodType): Generator<z.ZodType> {
  const seen = new Set<unknown>();
  const queue: unknown[] = [root];
  while (queue.length > 0) {
    const node = queue.shift();
    if (typeof node !== "object" || node === null || seen.has(node)) continue;
    seen.add(node);
    if ("_zod" in node) {
      yield node as z.ZodType;
      queue.push((node as { _zod: { def: unknown } })._zod.def);
    } else {
      queue.push(...Object.values(node));
    }
  }
}

const coerces = (s: z.ZodType) => (s._zod.def as { coerce?: boolean }).coerce === true;

describe("JSON request bodies in the API document", () => {
  const bodies = (apiDocs().registry.definitions as RouteDefinition[]).flatMap((d) => {
    const json = d.route?.request?.body?.content["application/json"]?.schema;
    return json && d.route ? [{ name: `${d.route.method} ${d.route.path}`, schema: json }] : [];
  });

  it("are found (the walk below has something to check)", () => {
    expect(bodies.length).toBeGreaterThan(20);
    expect([...schemasIn(createProjectBody)].length).toBeGreaterThan(5);
  });

  it("never coerce: a JSON body's types are the client's to get right", () => {
    const coercing = bodies.filter((b) => [...schemasIn(b.schema)].some(coerces));
    expect(coercing.map((b) => b.name)).toEqual([]);
  });

  it("refuse true or text where the return period is a number", () => {
    for (const schema of [createProjectBody, updateProjectBody]) {
      for (const bad of [true, "10", null]) {
        const body = { name: "Ridge Road", units: "si", designReturnPeriodYears: bad };
        expect(schema.safeParse(body).success, `${String(bad)}`).toBe(false);
      }
    }
  });
});
