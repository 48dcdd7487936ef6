/**
 * The routes an Express app really mounts, read from its router stack (method and path with
 * Express's :params), so the OpenAPI test can require a document entry for each one.
 */
import type { Express } from "express";

interface StackLayer {
  route?: { path: string | string[]; methods: Record<string, boolean> };
  handle?: { stack?: StackLayer[] };
}

export interface MountedRoute {
  method: string;
  path: string;
}

function walk(stack: readonly StackLayer[], prefix: string, out: MountedRoute[]): void {
  for (const layer of stack) {
    if (layer.route) {
      const paths = Array.isArray(layer.route.path) ? layer.route.path : [layer.route.path];
      for (const p of paths) {
        for (const [method, on] of Object.entries(layer.route.methods)) {
          if (on && method !== "_all") out.push({ method, path: `${prefix}${p}` });
        }
      }
    } else if (layer.handle?.stack) {
      walk(layer.handle.stack, prefix, out);
    }
  }
}

/**
 * Every route of the app. Express 5 keeps no mount path on a sub-router's layer, so the API
 * router's routes are prefixed with `apiPrefix` (the API is the only router that has routes).
 */
export function mountedRoutes(app: Express, apiPrefix = "/api"): MountedRoute[] {
  const out: MountedRoute[] = [];
  const root = (app as unknown as { router: { stack: StackLayer[] } }).router;
  walk(root.stack, apiPrefix, out);
  return out;
}

/** Express ":name" parameters as OpenAPI "{name}". */
export const openApiPath = (expressPath: string) => expressPath.replace(/:([A-Za-z_]\w*)/g, "{$1}");
