import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';

const revisionSchema = z.object({
  revision: z.number().int(),
  userId: z.string().nullable(),
  userName: z.string().nullable(),
  createdAt: z.string(),
  note: z.string().nullable(),
  /** What the revision changed, in marks and grid words. */
  summary: z.string().nullable().default(null),
  current: z.boolean(),
});
export type SchemeRevision = z.output<typeof revisionSchema>;

const revisionsResponseSchema = z.object({ revisions: z.array(revisionSchema) });

export const revisionsQueryKey = (schemeId: string) => ['schemes', schemeId, 'revisions'] as const;

export async function getRevisions(schemeId: string, signal?: AbortSignal): Promise<SchemeRevision[]> {
  const body = await api.get<unknown>(`/api/schemes/${encodeURIComponent(schemeId)}/revisions`, signal);
  return revisionsResponseSchema.parse(body).revisions;
}

export function revisionsQueryOptions(schemeId: string) {
  return queryOptions({ queryKey: revisionsQueryKey(schemeId), queryFn: ({ signal }) => getRevisions(schemeId, signal) });
}

export function useRevisions(schemeId: string, enabled = true) {
  return useQuery({ ...revisionsQueryOptions(schemeId), enabled });
}
