import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { type z } from "zod";
import { type rainfallCsvFields, type RainfallTable } from "../../../../shared/schemas/rainfall";
import { apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";
import { uploadForm } from "../../../lib/upload";
import { rainfallTableAnswer } from "./get-rainfall-tables";

export interface RainfallCsvInput {
  fields: z.output<typeof rainfallCsvFields>;
  file: File;
}

export async function uploadRainfallCsv(
  projectId: string,
  { fields, file }: RainfallCsvInput,
): Promise<RainfallTable> {
  const form = new FormData();
  form.append("name", fields.name);
  form.append("sourceNote", fields.sourceNote);
  form.append("kind", fields.kind);
  form.append("p2_24h", fields.p2_24h === null ? "" : String(fields.p2_24h));
  form.append("file", file);
  const { body } = await uploadForm(
    apiPath`/api/projects/${projectId}/rainfall-tables/upload`,
    form,
    rainfallTableAnswer,
  );
  return body;
}

export const uploadRainfallCsvMutationOptions = (queryClient: QueryClient, projectId: string) =>
  mutationOptions({
    mutationKey: ["projects", projectId, "upload-rainfall"],
    mutationFn: (input: RainfallCsvInput) => uploadRainfallCsv(projectId, input),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: queryKeys.rainfallTables(projectId) });
    },
  });

export function useUploadRainfallCsv(projectId: string) {
  return useMutation(uploadRainfallCsvMutationOptions(useQueryClient(), projectId));
}
