import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { activitySchema, reviewQueryKey } from './review.schema';

const listSchema = z.object({ activity: z.array(activitySchema) });

export function useSchemeActivity(schemeId: string) {
  return useQuery({
    queryKey: reviewQueryKey(schemeId, 'activity'),
    queryFn: async ({ signal }) =>
      listSchema.parse(await api.get<unknown>(`/api/schemes/${encodeURIComponent(schemeId)}/activity`, signal)).activity,
  });
}
