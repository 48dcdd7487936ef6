import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { projectSchema, type Project } from "../../../../shared/schemas/projects";
import { apiGet, apiPath } from "../../../lib/api";
import { queryKeys } from "../../../lib/query-keys";

export function getProjects(teamId: string, signal?: AbortSignal): Promise<Project[]> {
  return apiGet(apiPath`/api/teams/${teamId}/projects`, z.array(projectSchema), signal);
}

export const projectsQueryOptions = (teamId: string) =>
  queryOptions({
    queryKey: queryKeys.projects(teamId),
    queryFn: ({ signal }) => getProjects(teamId, signal),
  });

export function useProjects(teamId: string) {
  return useQuery(projectsQueryOptions(teamId));
}
