/**
 * How tiles are answered: an ETag from the data's version, 304 when the client already has it,
 * 204 for a tile with nothing in it, and a short private cache life (tiles are per-project data
 * behind a session, and change when layers change).
 */
import { createHash } from "node:crypto";
import type { Request, Response } from "express";

export const MVT_TYPE = "application/vnd.mapbox-vector-tile";

/** A strong ETag from the parts that decide the tile's bytes (version, address, options). */
export function tileEtag(...parts: (string | number)[]): string {
  return `"${createHash("sha1").update(parts.join("|")).digest("base64url").slice(0, 27)}"`;
}

/**
 * Sets the caching headers; true when the request's If-None-Match already names this version
 * (the caller then stops: a 304 has been sent).
 */
export function answeredFromCache(
  req: Request,
  res: Response,
  etag: string,
  maxAgeS: number,
): boolean {
  // Revalidate after maxAgeS: a changed mapping shows within that time, a same one costs a 304.
  res.setHeader("Cache-Control", `private, max-age=${maxAgeS}, must-revalidate`);
  res.setHeader("ETag", etag);
  if (req.fresh) {
    res.status(304).end();
    return true;
  }
  return false;
}

/** Sends a tile's bytes, or 204 when there are none. */
export function sendTile(res: Response, bytes: Uint8Array | null, type: string): void {
  if (!bytes || bytes.length === 0) {
    res.status(204).end();
    return;
  }
  res.type(type).send(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength));
}
