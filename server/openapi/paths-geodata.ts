/** The document entries of the geodata pipeline's routes (catalog to travel-time sheet). */
import { z } from "zod";
import {
  createSurfaceClassBody,
  surfaceOverrideBody,
  surfaceValuesSchema,
  updateSurfaceClassBody,
} from "../../shared/schemas/catalog";
import { designRulesBody, designRulesSchema } from "../../shared/schemas/design-rules";
import {
  createRainfallBody,
  rainfallCsvFields,
  rainfallTableSchema,
  updateRainfallBody,
} from "../../shared/schemas/rainfall";
import { travelTimeSheetSchema } from "../../shared/schemas/sheet";
import {
  createSubcatchmentBody,
  putBreaksBody,
  putElevationsBody,
  putSurfaceOverridesBody,
  putFlowPathBody,
  subcatchmentListItemSchema,
  subcatchmentSchema,
  updateSubcatchmentBody,
  versionBody,
} from "../../shared/schemas/subcatchments";
import type { ApiDocs } from "./registry";

const surfaceClassSchema = z.object({
  id: z.string(),
  teamId: z.string(),
  key: z.string(),
  name: z.string(),
  description: z.string(),
  values: surfaceValuesSchema,
  seededFrom: z.string().nullable(),
  override: z
    .object({ values: surfaceValuesSchema.partial(), note: z.string() })
    .nullable()
    .optional(),
});

const XLSX = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";

export function registerGeodataPaths(d: ApiDocs): void {
  const classes = z.array(surfaceClassSchema);
  d.route("get", "/teams/:teamId/surface-classes", {
    summary: "The team's Surface catalog (seeded from the published defaults on first read)",
    tag: "Surface catalog",
    permission: "project:read",
    response: classes,
  });
  d.route("post", "/teams/:teamId/surface-classes", {
    summary: "Add a surface class",
    tag: "Surface catalog",
    permission: "catalog:edit",
    body: createSurfaceClassBody,
    response: surfaceClassSchema,
    status: 201,
  });
  d.route("get", "/surface-classes/:id", {
    summary: "One surface class",
    tag: "Surface catalog",
    permission: "project:read",
    response: surfaceClassSchema,
  });
  d.route("patch", "/surface-classes/:id", {
    summary: "Change a surface class",
    tag: "Surface catalog",
    permission: "catalog:edit",
    body: updateSurfaceClassBody,
    response: surfaceClassSchema,
  });
  d.route("delete", "/surface-classes/:id", {
    summary: "Delete a surface class (409 while a layer mapping or a surface override uses it)",
    tag: "Surface catalog",
    permission: "catalog:edit",
    status: 204,
  });
  d.route("get", "/projects/:projectId/surface-classes", {
    summary: "The catalog as this project computes with it (overrides merged)",
    tag: "Surface catalog",
    permission: "project:read",
    response: classes,
  });
  d.route("put", "/projects/:projectId/surface-classes/:classId/override", {
    summary: "Set this project's values for a class",
    tag: "Surface catalog",
    permission: "project-data:edit",
    body: surfaceOverrideBody,
    response: surfaceClassSchema,
  });
  d.route("delete", "/projects/:projectId/surface-classes/:classId/override", {
    summary: "Drop this project's values for a class",
    tag: "Surface catalog",
    permission: "project-data:edit",
    status: 204,
  });

  d.route("get", "/projects/:projectId/design-rules", {
    summary: "Design rules (defaults and version 0 when never saved)",
    tag: "Design rules",
    permission: "project:read",
    response: designRulesSchema,
  });
  d.route("put", "/projects/:projectId/design-rules", {
    summary: "Save design rules under the version read (409 when stale)",
    tag: "Design rules",
    permission: "project-data:edit",
    body: designRulesBody,
    response: designRulesSchema,
  });

  d.route("get", "/projects/:projectId/rainfall-tables", {
    summary: "A project's rainfall tables with their Sherman fits",
    tag: "Rainfall",
    permission: "project:read",
    response: z.array(rainfallTableSchema),
  });
  d.route("post", "/projects/:projectId/rainfall-tables", {
    summary: "Add a rainfall table (IDF table or formulas, project units)",
    tag: "Rainfall",
    permission: "project-data:edit",
    body: createRainfallBody,
    response: rainfallTableSchema,
    status: 201,
  });
  d.route("post", "/projects/:projectId/rainfall-tables/upload", {
    summary: "Add a rainfall table from a CSV file (durations × return periods)",
    tag: "Rainfall",
    permission: "project-data:edit",
    form: rainfallCsvFields,
    response: rainfallTableSchema,
    status: 201,
  });
  d.route("get", "/rainfall-tables/:id", {
    summary: "One rainfall table",
    tag: "Rainfall",
    permission: "project:read",
    response: rainfallTableSchema,
  });
  d.route("patch", "/rainfall-tables/:id", {
    summary: "Change a rainfall table",
    tag: "Rainfall",
    permission: "project-data:edit",
    body: updateRainfallBody,
    response: rainfallTableSchema,
  });
  d.route("delete", "/rainfall-tables/:id", {
    summary: "Delete a rainfall table",
    tag: "Rainfall",
    permission: "project-data:edit",
    status: 204,
  });

  const sub = subcatchmentSchema;
  d.route("get", "/projects/:projectId/subcatchments", {
    summary:
      "A project's subcatchments, each with a summary of its stored sheet (null: not computed)",
    tag: "Subcatchments",
    permission: "project:read",
    response: z.array(subcatchmentListItemSchema),
  });
  d.route("post", "/projects/:projectId/subcatchments", {
    summary: "Add a subcatchment (boundary checked by PostGIS)",
    tag: "Subcatchments",
    permission: "geometry:edit",
    body: createSubcatchmentBody,
    response: sub,
    status: 201,
  });
  d.route("get", "/subcatchments/:id", {
    summary: "A subcatchment with its flow path, breaks and surveyed elevations",
    tag: "Subcatchments",
    permission: "project:read",
    response: sub,
  });
  d.route("patch", "/subcatchments/:id", {
    summary: "Change a subcatchment",
    tag: "Subcatchments",
    permission: "geometry:edit",
    body: updateSubcatchmentBody,
    response: sub,
  });
  d.route("delete", "/subcatchments/:id", {
    summary: "Delete a subcatchment",
    tag: "Subcatchments",
    permission: "geometry:edit",
    status: 204,
  });
  d.route("put", "/subcatchments/:id/flow-path", {
    summary: "Set the flow path under the version read (0 for new; 409 when stale)",
    tag: "Subcatchments",
    permission: "geometry:edit",
    body: putFlowPathBody,
    response: sub,
  });
  d.route("post", "/subcatchments/:id/flow-path/reverse", {
    summary: "Reverse the flow path (breaks dropped, surveyed stations recounted)",
    tag: "Subcatchments",
    permission: "geometry:edit",
    body: versionBody,
    response: sub,
  });
  d.route("post", "/subcatchments/:id/flow-path/file", {
    summary: "Set the flow path from a file holding exactly one line",
    tag: "Subcatchments",
    permission: "geometry:edit",
    form: z.object({ version: z.string().optional() }),
    response: sub,
  });
  d.route("post", "/subcatchments/:id/boundary/file", {
    summary: "Set the boundary from a file holding exactly one polygon",
    tag: "Subcatchments",
    permission: "geometry:edit",
    form: z.object({ version: z.string() }),
    response: sub,
  });
  d.route("put", "/subcatchments/:id/breaks", {
    summary: "Move the regime breaks (stations in the project's length unit)",
    tag: "Subcatchments",
    permission: "geometry:edit",
    body: putBreaksBody,
    response: sub,
  });
  d.route("put", "/subcatchments/:id/elevations", {
    summary: "Replace the surveyed elevations (project length unit)",
    tag: "Subcatchments",
    permission: "geometry:edit",
    body: putElevationsBody,
    response: sub,
  });
  d.route("put", "/subcatchments/:id/surface-overrides", {
    summary:
      "Replace the surface overrides: stretches of the path given a class of the team's catalog (project length unit; the path's version, 409 when stale)",
    tag: "Subcatchments",
    permission: "geometry:edit",
    body: putSurfaceOverridesBody,
    response: sub,
  });

  d.route("post", "/subcatchments/:id/compute", {
    summary: "Compute the travel-time sheet by every method and store it",
    tag: "Travel time",
    permission: "compute:run",
    response: travelTimeSheetSchema,
  });
  d.route("get", "/subcatchments/:id/sheet", {
    summary: "The stored travel-time sheet (stale: the path changed since)",
    tag: "Travel time",
    permission: "project:read",
    response: travelTimeSheetSchema,
  });
  d.route("get", "/subcatchments/:id/sheet.csv", {
    summary: "The segment table as CSV (units row, totals)",
    tag: "Travel time",
    permission: "project:read",
    mediaType: "text/csv",
    response: z.string(),
  });
  d.route("get", "/subcatchments/:id/sheet.xlsx", {
    summary: "The segment table as an XLSX workbook",
    tag: "Travel time",
    permission: "project:read",
    mediaType: XLSX,
    response: z.string().openapi({ format: "binary" }),
  });
}
