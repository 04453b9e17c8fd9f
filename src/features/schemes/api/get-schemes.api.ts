import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { schemeSummarySchema, type SchemeSummary } from './scheme.schema';

export const schemesQueryKey = (projectId: string) => ['projects', projectId, 'schemes'] as const;

/**
 * A scheme was added, copied, renamed, archived or removed: the scheme list and the project's
 * Tonnage comparison (['projects', id, 'comparison'], spelled here since features do not
 * import each other) both list schemes, so both go stale.
 */
export function invalidateProjectSchemes(queryClient: QueryClient, projectId: string): Promise<void[]> {
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: schemesQueryKey(projectId) }),
    queryClient.invalidateQueries({ queryKey: ['projects', projectId, 'comparison'] }),
  ]);
}

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
