import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { invalidatePlanResults } from '../../../lib/plan-change-queries';

const restoreResponseSchema = z.object({
  scheme: z.object({ revision: z.number().int() }).passthrough(),
  restoredFrom: z.number().int(),
});

/** Restoring makes a new revision equal to the old one; nothing in between is lost. */
export async function restoreRevision(schemeId: string, revision: number): Promise<{ revision: number; restoredFrom: number }> {
  const body = await api.post<unknown>(`/api/schemes/${encodeURIComponent(schemeId)}/revisions/${revision}/restore`);
  const parsed = restoreResponseSchema.parse(body);
  return { revision: parsed.scheme.revision, restoredFrom: parsed.restoredFrom };
}

export function useRestoreRevision(projectId: string, schemeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (revision: number) => restoreRevision(schemeId, revision),
    onSuccess: () =>
      Promise.all([
        // Tonnage, Schedule, plan sheets, revisions and activity are read from the plan.
        invalidatePlanResults(queryClient, projectId, schemeId),
        // The plan page caches the scheme under its own key; make it read the restored plan.
        queryClient.invalidateQueries({ queryKey: ['editor', 'scheme', schemeId] }),
      ]),
  });
}
