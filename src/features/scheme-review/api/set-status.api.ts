import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { reviewQueryKey, SCHEME_STATUSES, type SchemeStatus } from './review.schema';

const responseSchema = z.object({
  scheme: z.object({ id: z.string(), status: z.enum(SCHEME_STATUSES) }),
  unchosen: z.array(z.object({ id: z.string(), name: z.string() })),
  notified: z.array(z.string()),
});

export async function setSchemeStatus(schemeId: string, status: SchemeStatus) {
  return responseSchema.parse(await api.post<unknown>(`/api/schemes/${encodeURIComponent(schemeId)}/status`, { status }));
}

/** onChanged lets the page refresh what shows the status (the comparison, the schemes list). */
export function useSetSchemeStatus(schemeId: string, onChanged?: () => unknown) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (status: SchemeStatus) => setSchemeStatus(schemeId, status),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: reviewQueryKey(schemeId, 'activity') });
      await onChanged?.();
    },
  });
}
