import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { type Role } from "../../../../shared/roles";
import { memberSchema, type Member } from "../../../../shared/schemas/team";
import { apiPath, apiSend } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function changeRole(teamId: string, userId: string, role: Role): Promise<Member> {
  return apiSend("PATCH", apiPath`/api/teams/${teamId}/members/${userId}`, memberSchema, { role });
}

export const changeRoleMutationOptions = (queryClient: QueryClient, teamId: string) =>
  mutationOptions({
    mutationKey: ["teams", teamId, "change-role"],
    mutationFn: ({ userId, role }: { userId: string; role: Role }) =>
      changeRole(teamId, userId, role),
    onSuccess: async () => {
      // The caller may have changed their own role, which the session and team carry.
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: queryKeys.members(teamId) }),
        queryClient.invalidateQueries({ queryKey: queryKeys.team(teamId), exact: true }),
        queryClient.invalidateQueries({ queryKey: queryKeys.me }),
      ]);
    },
  });

export function useChangeRole(teamId: string) {
  return useMutation(changeRoleMutationOptions(useQueryClient(), teamId));
}
