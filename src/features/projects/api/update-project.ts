import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import {
  projectSchema,
  type Project,
  type UpdateProjectBody,
} from "../../../../shared/schemas/projects";
import { apiPath, apiSend } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function updateProject(projectId: string, body: UpdateProjectBody): Promise<Project> {
  return apiSend("PATCH", apiPath`/api/projects/${projectId}`, projectSchema, body);
}

export const updateProjectMutationOptions = (queryClient: QueryClient, projectId: string) =>
  mutationOptions({
    mutationKey: ["projects", projectId, "update"],
    mutationFn: (body: UpdateProjectBody) => updateProject(projectId, body),
    onSuccess: async (project) => {
      queryClient.setQueryData(queryKeys.project(project.id), project);
      await queryClient.invalidateQueries({ queryKey: queryKeys.projects(project.teamId) });
    },
  });

export function useUpdateProject(projectId: string) {
  return useMutation(updateProjectMutationOptions(useQueryClient(), projectId));
}
