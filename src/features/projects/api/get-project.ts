import { queryOptions, useQuery } from "@tanstack/react-query";
import { projectSchema, type Project } from "../../../../shared/schemas/projects";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function getProject(projectId: string, signal?: AbortSignal): Promise<Project> {
  return apiGet(apiPath`/api/projects/${projectId}`, projectSchema, signal);
}

export const projectQueryOptions = (projectId: string) =>
  queryOptions({
    queryKey: queryKeys.project(projectId),
    queryFn: ({ signal }) => getProject(projectId, signal),
  });

export function useProject(projectId: string | undefined) {
  return useQuery({ ...projectQueryOptions(projectId ?? ""), enabled: Boolean(projectId) });
}
