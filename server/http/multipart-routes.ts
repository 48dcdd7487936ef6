import type { RequestHandler } from "express";
import { requireJsonBody } from "./security";

/**
 * The only API routes that take multipart/form-data (file uploads), as [method, path pattern]
 * relative to /api. Every other request body must be JSON.
 */
export const MULTIPART_ROUTES: readonly (readonly [string, RegExp])[] = [
  ["POST", /^\/projects\/[^/]+\/layers\/?$/],
  ["POST", /^\/projects\/[^/]+\/rainfall-tables\/upload\/?$/],
  ["POST", /^\/subcatchments\/[^/]+\/(flow-path|boundary)\/file\/?$/],
];

/** requireJsonBody, except a multipart body on exactly the routes above. */
export const requireJsonOrUpload: RequestHandler = (req, res, next) => {
  const upload =
    req.is("multipart/form-data") === "multipart/form-data" &&
    MULTIPART_ROUTES.some(([method, pattern]) => method === req.method && pattern.test(req.path));
  if (upload) return next();
  requireJsonBody(req, res, next);
};
