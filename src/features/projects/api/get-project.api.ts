import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { projectsQueryKey } from './get-projects.api';
import { projectSchema, type Project } from './project.schema';

export const projectQueryKey = (projectId: string) => [...projectsQueryKey, projectId] as const;

export const projectResponseSchema = z.object({ project: projectSchema });

export async function getProject(projectId: string, signal?: AbortSignal): Promise<Project> {
  const body = await api.get<unknown>(`/api/projects/${encodeURIComponent(projectId)}`, signal);
  return projectResponseSchema.parse(body).project;
}

export function projectQueryOptions(projectId: string) {
  return queryOptions({
    queryKey: projectQueryKey(projectId),
    queryFn: ({ signal }) => getProject(projectId, signal),
  });
}

export function useProject(projectId: string) {
  return useQuery(projectQueryOptions(projectId));
}
