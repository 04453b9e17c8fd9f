import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { projectQueryKey } from './get-project.api';
import { projectsQueryKey } from './get-projects.api';

export async function deleteProject(projectId: string): Promise<void> {
  await api.delete(`/api/projects/${encodeURIComponent(projectId)}`);
}

export function useDeleteProject(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteProject(projectId),
    onSuccess: () => {
      queryClient.removeQueries({ queryKey: projectQueryKey(projectId) });
      return queryClient.invalidateQueries({ queryKey: projectsQueryKey, exact: true });
    },
  });
}
