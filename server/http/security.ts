import type { RequestHandler } from "express";
import helmet from "helmet";
import { HttpError } from "./errors";

const STATE_CHANGING = new Set(["POST", "PUT", "PATCH", "DELETE"]);

/**
 * helmet with a self-only content security policy. The map (maplibre) runs its worker from a
 * blob: URL and draws tiles into blob:/data: images, so those two directives allow blob:.
 * `mapOrigins` are hosts of a self-hosted basemap style the browser may fetch from.
 */
export function securityHeaders(publicBaseUrl: string, mapOrigins: string[] = []): RequestHandler {
  const https = publicBaseUrl.startsWith("https:");
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        scriptSrcAttr: ["'none'"],
        styleSrc: ["'self'"],
        imgSrc: ["'self'", "data:", "blob:", ...mapOrigins],
        fontSrc: ["'self'"],
        connectSrc: ["'self'", ...mapOrigins],
        workerSrc: ["'self'", "blob:"],
        objectSrc: ["'none'"],
        baseUri: ["'self'"],
        formAction: ["'self'"],
        frameAncestors: ["'none'"],
        // Only over HTTPS: on plain http://127.0.0.1 it would send the browser to a port with
        // no TLS.
        ...(https ? { upgradeInsecureRequests: [] } : {}),
      },
    },
    strictTransportSecurity: https ? { maxAge: 15_552_000, includeSubDomains: false } : false,
  });
}

/**
 * CSRF defence (docs/decisions/002-csrf-same-origin.md): a state-changing request must come from
 * our own origin. Browsers send Origin on every cross-site POST and Sec-Fetch-Site on every
 * request; a request with neither is a non-browser client, which no cookie can be forced into.
 */
export function sameOriginOnly(publicBaseUrl: string): RequestHandler {
  const ownOrigin = new URL(publicBaseUrl).origin;
  return (req, _res, next) => {
    if (!STATE_CHANGING.has(req.method)) return next();
    const origin = req.get("origin");
    const fetchSite = req.get("sec-fetch-site");
    if (origin === undefined && fetchSite === undefined) return next();
    if (origin === ownOrigin || fetchSite === "same-origin") return next();
    next(
      new HttpError(
        403,
        "cross_origin",
        "This request came from another site and was refused. Use Rillmark's own pages.",
      ),
    );
  };
}

/** A request with a body must send JSON; anything else is 415 rather than a confusing 422. */
export const requireJsonBody: RequestHandler = (req, _res, next) => {
  // An empty body (Content-Length: 0, as fetch sends for a bare POST) needs no type; req.is()
  // answers null when there is no body at all.
  if (req.get("content-length") === "0") return next();
  if (req.is(["application/json", "application/*+json"]) !== false) return next();
  next(
    new HttpError(
      415,
      "unsupported_media_type",
      "Send the request body as JSON (Content-Type: application/json).",
    ),
  );
};
