import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, apiRequest } from '../../../lib/api-client';

export interface MarksResult {
  revision: number;
  changed: boolean;
  marks: { memberId: string; level: string; mark: string; manual: boolean }[];
}

/** PATCH /api/schemes/:id/marks. A null mark returns the member to the marking rule. */
export function useEditMarks(schemeId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: { revision: number; marks: { memberId: string; mark: string | null }[] }) =>
      apiRequest<MarksResult>(`/api/schemes/${encodeURIComponent(schemeId)}/marks`, { method: 'PATCH', body: input }),
    onSettled: () => client.invalidateQueries({ queryKey: ['schemes', schemeId] }),
  });
}

/** POST /api/schemes/:id/marks/renumber. */
export function useRenumberMarks(schemeId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: { keepManual: boolean }) => api.post<MarksResult>(`/api/schemes/${encodeURIComponent(schemeId)}/marks/renumber`, input),
    onSettled: () => client.invalidateQueries({ queryKey: ['schemes', schemeId] }),
  });
}
