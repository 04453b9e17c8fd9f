import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { sessionQueryKey } from './get-session.api';

export async function signOut(): Promise<void> {
  await api.delete('/api/session');
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== sessionQueryKey[0] });
      queryClient.setQueryData(sessionQueryKey, null);
    },
  });
}
