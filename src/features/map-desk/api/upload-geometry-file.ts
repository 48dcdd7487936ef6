import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { subcatchmentSchema, type Subcatchment } from "../../../../shared/schemas/subcatchments";
import { apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";
import { uploadForm } from "../../../lib/upload";

export interface GeometryFileInput {
  what: "flow-path" | "boundary";
  file: File;
  /** The version the upload replaces: the path's for a path, the subcatchment's for a boundary. */
  version: number;
}

/** A flow path or boundary from a KML, KMZ, GPX, GeoJSON or zipped shapefile. */
export async function uploadGeometryFile(
  id: string,
  input: GeometryFileInput,
): Promise<Subcatchment> {
  const form = new FormData();
  // Text fields before the file: the server reads them first.
  form.append("version", String(input.version));
  form.append("file", input.file);
  const path =
    input.what === "flow-path"
      ? apiPath`/api/subcatchments/${id}/flow-path/file`
      : apiPath`/api/subcatchments/${id}/boundary/file`;
  return (await uploadForm(path, form, subcatchmentSchema)).body;
}

export const uploadGeometryFileMutationOptions = (queryClient: QueryClient, id: string) =>
  mutationOptions({
    mutationKey: [...queryKeys.subcatchment(id), "file"],
    mutationFn: (input: GeometryFileInput) => uploadGeometryFile(id, input),
    onSuccess: (saved) => {
      queryClient.setQueryData(queryKeys.subcatchment(id), saved);
    },
  });

export function useUploadGeometryFile(id: string) {
  return useMutation(uploadGeometryFileMutationOptions(useQueryClient(), id));
}
