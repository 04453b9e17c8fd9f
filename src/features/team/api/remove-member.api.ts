import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { teamQueryKey } from './get-team.api';

export async function removeMember(userId: string): Promise<void> {
  await api.delete(`/api/team/${encodeURIComponent(userId)}`);
}

export function useRemoveMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeMember,
    onSettled: () => queryClient.invalidateQueries({ queryKey: teamQueryKey }),
  });
}
