import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { type CreateSurfaceClassBody } from "../../../../shared/schemas/catalog";
import { apiPath, apiSend } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";
import { surfaceClassSchema, type SurfaceClass } from "../../../lib/surface-classes";

/** A new class (no id) or the whole of an existing one (PATCH with every field). */
export interface SaveSurfaceClass {
  id: string | null;
  body: CreateSurfaceClassBody;
}

export function saveSurfaceClass(
  teamId: string,
  { id, body }: SaveSurfaceClass,
): Promise<SurfaceClass> {
  return id
    ? apiSend("PATCH", apiPath`/api/surface-classes/${id}`, surfaceClassSchema, body)
    : apiSend("POST", apiPath`/api/teams/${teamId}/surface-classes`, surfaceClassSchema, body);
}

export const saveSurfaceClassMutationOptions = (queryClient: QueryClient, teamId: string) =>
  mutationOptions({
    mutationKey: ["teams", teamId, "save-surface-class"],
    mutationFn: (input: SaveSurfaceClass) => saveSurfaceClass(teamId, input),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: queryKeys.surfaceClasses(teamId) });
      // Projects see the team's classes through their own view (with overrides).
      await queryClient.invalidateQueries({
        predicate: (q) => q.queryKey[0] === "projects" && q.queryKey[2] === "surface-classes",
      });
    },
  });

export function useSaveSurfaceClass(teamId: string) {
  return useMutation(saveSurfaceClassMutationOptions(useQueryClient(), teamId));
}
