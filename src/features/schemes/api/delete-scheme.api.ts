import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { invalidateProjectSchemes } from './get-schemes.api';

export async function deleteScheme(schemeId: string): Promise<void> {
  await api.delete(`/api/schemes/${encodeURIComponent(schemeId)}`);
}

export function useDeleteScheme(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteScheme,
    onSuccess: () => invalidateProjectSchemes(queryClient, projectId),
  });
}
