import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { underlaysQueryKey } from './get-underlays.api';
import type { Underlay } from './underlay.schema';

export async function deleteUnderlay(underlayId: string): Promise<void> {
  await api.delete(`/api/underlays/${encodeURIComponent(underlayId)}`);
}

export function useDeleteUnderlay(schemeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (underlayId: string) => deleteUnderlay(underlayId),
    onSuccess: (_nothing, underlayId) => {
      queryClient.setQueryData<Underlay[]>(underlaysQueryKey(schemeId), (list) => list?.filter((u) => u.id !== underlayId));
    },
  });
}
