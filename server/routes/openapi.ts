/**
 * GET /api/openapi.json: the API's OpenAPI 3.1 document. Public on purpose: it describes the
 * contract, holds no data, and tools read it before anyone signs in.
 */
import { Router } from "express";
import { openApiDocument } from "../openapi/document";
import type { RouteDeps } from "./deps";

export function openapiRouter(_deps: RouteDeps): Router {
  const router = Router();
  router.get("/openapi.json", (_req, res) => {
    res.json(openApiDocument());
  });
  return router;
}
