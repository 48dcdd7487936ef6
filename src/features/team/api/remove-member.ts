import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { apiPath, apiSendEmpty } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function removeMember(teamId: string, userId: string): Promise<void> {
  return apiSendEmpty("DELETE", apiPath`/api/teams/${teamId}/members/${userId}`);
}

export const removeMemberMutationOptions = (queryClient: QueryClient, teamId: string) =>
  mutationOptions({
    mutationKey: ["teams", teamId, "remove-member"],
    mutationFn: (userId: string) => removeMember(teamId, userId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.members(teamId) }),
  });

export function useRemoveMember(teamId: string) {
  return useMutation(removeMemberMutationOptions(useQueryClient(), teamId));
}
