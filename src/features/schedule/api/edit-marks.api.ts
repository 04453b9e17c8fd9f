import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { api, apiRequest } from '../../../lib/api-client';

export interface MarksResult {
  revision: number;
  changed: boolean;
  marks: { memberId: string; level: string; mark: string; manual: boolean }[];
}

/**
 * Marks are saved as a new revision of the plan. Besides the schedule, drop the Plan page's
 * copy of the scheme (['editor', 'scheme', id], kept without refetching while open) so the
 * Plan opens on the new revision; otherwise the next edit there meets its own mark change as
 * "someone else saved first". Only the Schedule edits marks, so the Plan is not open now.
 */
function marksChanged(client: QueryClient, schemeId: string): Promise<void> {
  client.removeQueries({ queryKey: ['editor', 'scheme', schemeId] });
  return client.invalidateQueries({ queryKey: ['schemes', schemeId] });
}

/** PATCH /api/schemes/:id/marks. A null mark returns the member to the marking rule. */
export function useEditMarks(schemeId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: { revision: number; marks: { memberId: string; mark: string | null }[] }) =>
      apiRequest<MarksResult>(`/api/schemes/${encodeURIComponent(schemeId)}/marks`, { method: 'PATCH', body: input }),
    onSettled: () => marksChanged(client, schemeId),
  });
}

/** POST /api/schemes/:id/marks/renumber. */
export function useRenumberMarks(schemeId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: { keepManual: boolean }) => api.post<MarksResult>(`/api/schemes/${encodeURIComponent(schemeId)}/marks/renumber`, input),
    onSettled: () => marksChanged(client, schemeId),
  });
}
