import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import {
  projectSchema,
  type CreateProjectBody,
  type Project,
} from "../../../../shared/schemas/projects";
import { apiPath, apiSend } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function createProject(teamId: string, body: CreateProjectBody): Promise<Project> {
  return apiSend("POST", apiPath`/api/teams/${teamId}/projects`, projectSchema, body);
}

export const createProjectMutationOptions = (queryClient: QueryClient, teamId: string) =>
  mutationOptions({
    mutationKey: ["teams", teamId, "create-project"],
    mutationFn: (body: CreateProjectBody) => createProject(teamId, body),
    onSuccess: async (project) => {
      queryClient.setQueryData(queryKeys.project(project.id), project);
      await queryClient.invalidateQueries({ queryKey: queryKeys.projects(teamId) });
    },
  });

export function useCreateProject(teamId: string) {
  return useMutation(createProjectMutationOptions(useQueryClient(), teamId));
}
