/**
 * A thin helper over zod-to-openapi's registry: one call per route with its summary, the
 * permission it needs, its body and its answer, so every route reads the same in the document.
 */
import "./extend-zod";
import { OpenAPIRegistry, type RouteConfig } from "@asteasolutions/zod-to-openapi";
import { z } from "zod";
import type { Permission } from "../../shared/roles";
import { apiErrorSchema } from "../../shared/schemas/common";
import { openApiPath } from "./mounted-routes";

export interface RouteDoc {
  summary: string;
  tag: string;
  /** null: no session needed. */
  permission: Permission | "signed-in" | null;
  body?: z.ZodType;
  /** multipart/form-data body: the text fields (the file goes in "file"). */
  form?: z.ZodType;
  query?: z.ZodObject;
  response?: z.ZodType;
  /** Success status (200 unless said). */
  status?: number;
  /** Non-JSON answers (CSV, XLSX). */
  mediaType?: string;
}

const errorContent = { "application/json": { schema: apiErrorSchema } };

export class ApiDocs {
  readonly registry = new OpenAPIRegistry();

  constructor() {
    this.registry.registerComponent("securitySchemes", "session", {
      type: "apiKey",
      in: "cookie",
      name: "rillmark.sid",
      description: "The session cookie set by POST /api/auth/sign-in.",
    });
  }

  route(method: RouteConfig["method"], expressPath: string, doc: RouteDoc): void {
    const path = openApiPath(expressPath);
    const names = [...expressPath.matchAll(/:([A-Za-z_]\w*)/g)].map((m) => m[1] ?? "");
    const params =
      names.length > 0
        ? z.object(Object.fromEntries(names.map((n) => [n, z.string()])))
        : undefined;
    const status = doc.status ?? 200;
    const success =
      status === 204
        ? { description: "Done; no content." }
        : {
            description: "Success.",
            content: {
              [doc.mediaType ?? "application/json"]: {
                schema: doc.response ?? z.unknown(),
              },
            },
          };
    const who =
      doc.permission === null
        ? "No session needed."
        : doc.permission === "signed-in"
          ? "Any signed-in user."
          : `Needs the "${doc.permission}" permission in the owning team (shared/roles.ts); other teams' objects answer 404, a role too low 403.`;
    this.registry.registerPath({
      method,
      path,
      summary: doc.summary,
      description: who,
      tags: [doc.tag],
      // Machine-readable for the authorization matrix test: null means no session needed.
      "x-rillmark-permission": doc.permission,
      ...(doc.permission !== null && { security: [{ session: [] }] }),
      request: {
        ...(params && { params }),
        ...(doc.query && { query: doc.query }),
        ...(doc.body && {
          body: { content: { "application/json": { schema: doc.body } }, required: true },
        }),
        ...(doc.form && {
          body: {
            content: {
              "multipart/form-data": {
                schema: z.object({ file: z.string().openapi({ format: "binary" }) }).and(doc.form),
              },
            },
            required: true,
          },
        }),
      },
      responses: {
        [status]: success,
        ...(doc.permission !== null && {
          401: { description: "Not signed in.", content: errorContent },
          403: { description: "Role too low.", content: errorContent },
          404: { description: "Not found, or another team's.", content: errorContent },
        }),
        ...(["post", "put", "patch"].includes(method) && {
          422: { description: "Invalid input; `fields` names each field.", content: errorContent },
        }),
      },
    });
  }
}
