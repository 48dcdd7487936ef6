import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { layerSchema, type Layer, type UploadLayerFields } from "../../../../shared/schemas/layers";
import { apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";
import { uploadForm, type UploadProgress } from "../../../lib/upload";
import { getLayer } from "./get-layer";

export type LayerUploadStep =
  { step: "sending"; progress: UploadProgress } | { step: "processing"; layer: Layer };

export interface UploadLayerInput {
  fields: UploadLayerFields;
  file: File;
  onStep: (step: LayerUploadStep) => void;
}

const POLL_WAIT_MS = 2000;

/**
 * Sends the file (progress from the browser), then follows the server's processing until the
 * layer is ready; a layer that fails after the upload answered rejects with its error.
 */
export async function uploadLayer(projectId: string, input: UploadLayerInput): Promise<Layer> {
  const form = new FormData();
  form.append("kind", input.fields.kind);
  if (input.fields.name) form.append("name", input.fields.name);
  if (input.fields.verticalUnit) form.append("verticalUnit", input.fields.verticalUnit);
  form.append("file", input.file);
  const { body } = await uploadForm(
    apiPath`/api/projects/${projectId}/layers`,
    form,
    layerSchema,
    (progress) => input.onStep({ step: "sending", progress }),
  );
  let layer = body;
  while (layer.status === "queued" || layer.status === "processing") {
    input.onStep({ step: "processing", layer });
    layer = await getLayer(layer.id, POLL_WAIT_MS);
  }
  input.onStep({ step: "processing", layer });
  if (layer.status === "failed") {
    const where = layer.error?.where ? ` (${layer.error.where})` : "";
    throw new Error(`${layer.error?.message ?? "The file could not be processed."}${where}`);
  }
  return layer;
}

export const uploadLayerMutationOptions = (queryClient: QueryClient, projectId: string) =>
  mutationOptions({
    mutationKey: ["projects", projectId, "upload-layer"],
    mutationFn: (input: UploadLayerInput) => uploadLayer(projectId, input),
    onSettled: async () => {
      await queryClient.invalidateQueries({ queryKey: queryKeys.layers(projectId) });
    },
  });

export function useUploadLayer(projectId: string) {
  return useMutation(uploadLayerMutationOptions(useQueryClient(), projectId));
}
