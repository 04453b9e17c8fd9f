import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { underlaySchema, type Underlay } from './underlay.schema';

export const underlaysQueryKey = (schemeId: string) => ['schemes', schemeId, 'underlays'] as const;

const listSchema = z.object({ underlays: z.array(underlaySchema) });

export async function getUnderlays(schemeId: string, signal?: AbortSignal): Promise<Underlay[]> {
  const body = await api.get<unknown>(`/api/schemes/${encodeURIComponent(schemeId)}/underlays`, signal);
  return listSchema.parse(body).underlays;
}

export function underlaysQueryOptions(schemeId: string) {
  return queryOptions({
    queryKey: underlaysQueryKey(schemeId),
    queryFn: ({ signal }) => getUnderlays(schemeId, signal),
  });
}

/** Every underlay of the scheme; pass levelId to keep that level's only. */
export function useUnderlays(schemeId: string, levelId?: string) {
  return useQuery({
    ...underlaysQueryOptions(schemeId),
    select: levelId === undefined ? undefined : (list: Underlay[]) => list.filter((u) => u.levelId === levelId),
  });
}
