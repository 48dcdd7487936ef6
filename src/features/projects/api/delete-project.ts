import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { type Project } from "../../../../shared/schemas/projects";
import { apiPath, apiSendEmpty } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function deleteProject(projectId: string): Promise<void> {
  return apiSendEmpty("DELETE", apiPath`/api/projects/${projectId}`);
}

export const deleteProjectMutationOptions = (queryClient: QueryClient) =>
  mutationOptions({
    mutationKey: ["projects", "delete"],
    mutationFn: (project: Project) => deleteProject(project.id),
    onSuccess: async (_result, project) => {
      queryClient.removeQueries({ queryKey: queryKeys.project(project.id) });
      // The list is not on screen while its project is deleted; drop the row now so the list
      // never flashes it on the way back.
      queryClient.setQueryData<Project[]>(queryKeys.projects(project.teamId), (list) =>
        list?.filter((p) => p.id !== project.id),
      );
      await queryClient.invalidateQueries({ queryKey: queryKeys.projects(project.teamId) });
    },
  });

export function useDeleteProject() {
  return useMutation(deleteProjectMutationOptions(useQueryClient()));
}
