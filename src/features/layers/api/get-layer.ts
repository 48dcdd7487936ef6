import { layerSchema, type Layer } from "../../../../shared/schemas/layers";
import { apiGet, apiPath } from "../../../lib/api";

/**
 * One layer; with `waitMs` the server holds the answer until the layer is ready or failed (or
 * the time is up), so a caller loops on it to follow an upload's processing.
 */
export function getLayer(layerId: string, waitMs = 0, signal?: AbortSignal): Promise<Layer> {
  const query = waitMs > 0 ? `?waitMs=${waitMs}` : "";
  return apiGet(`${apiPath`/api/layers/${layerId}`}${query}`, layerSchema, signal);
}
