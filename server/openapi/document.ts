/** Rillmark's API as an OpenAPI 3.1 document, generated from the zod schemas of shared/schemas. */
import "./extend-zod";
import { OpenApiGeneratorV31 } from "@asteasolutions/zod-to-openapi";
import { registerCorePaths } from "./paths-core";
import { registerGeodataPaths } from "./paths-geodata";
import { registerMapPaths } from "./paths-map";
import { ApiDocs } from "./registry";

let cached: ReturnType<OpenApiGeneratorV31["generateDocument"]> | undefined;
let cachedDocs: ApiDocs | undefined;

/** Every documented route with its zod schemas (tests walk the bodies). */
export function apiDocs(): ApiDocs {
  if (cachedDocs) return cachedDocs;
  cachedDocs = new ApiDocs();
  registerCorePaths(cachedDocs);
  registerGeodataPaths(cachedDocs);
  registerMapPaths(cachedDocs);
  return cachedDocs;
}

export function openApiDocument() {
  if (cached) return cached;
  cached = new OpenApiGeneratorV31(apiDocs().registry.definitions).generateDocument({
    openapi: "3.1.0",
    info: {
      title: "Rillmark API",
      version: "1",
      description:
        "Time of concentration of subcatchments: layers, Surface catalog, Design rules, rainfall, flow paths and the travel-time sheet. Results are design aids for qualified engineers: local drainage criteria and the engineer of record govern. Errors answer { error: { code, message, fields? } }.",
    },
    servers: [{ url: "/api" }],
  });
  return cached;
}
