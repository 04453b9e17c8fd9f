import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { schemeSummarySchema, type SchemeSummary } from './scheme.schema';

export const schemesQueryKey = (projectId: string) => ['projects', projectId, 'schemes'] as const;

const schemesResponseSchema = z.object({ schemes: z.array(schemeSummarySchema) });

export async function getSchemes(projectId: string, signal?: AbortSignal): Promise<SchemeSummary[]> {
  const body = await api.get<unknown>(`/api/projects/${encodeURIComponent(projectId)}/schemes`, signal);
  return schemesResponseSchema.parse(body).schemes;
}

export function schemesQueryOptions(projectId: string) {
  return queryOptions({ queryKey: schemesQueryKey(projectId), queryFn: ({ signal }) => getSchemes(projectId, signal) });
}

export function useSchemes(projectId: string) {
  return useQuery(schemesQueryOptions(projectId));
}
