import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { projectSchema, type Project } from './project.schema';

export const projectsQueryKey = ['projects'] as const;

const projectsResponseSchema = z.object({ projects: z.array(projectSchema) });

export async function getProjects(signal?: AbortSignal): Promise<Project[]> {
  return projectsResponseSchema.parse(await api.get<unknown>('/api/projects', signal)).projects;
}

export function projectsQueryOptions() {
  return queryOptions({ queryKey: projectsQueryKey, queryFn: ({ signal }) => getProjects(signal) });
}

export function useProjects() {
  return useQuery(projectsQueryOptions());
}
