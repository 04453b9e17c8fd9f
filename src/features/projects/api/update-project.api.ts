import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { projectQueryKey, projectResponseSchema } from './get-project.api';
import { projectsQueryKey } from './get-projects.api';
import type { Project, ProjectInput } from './project.schema';

// A PATCH sends every field, so a cleared optional field is cleared on the server too.
export async function updateProject(projectId: string, input: ProjectInput): Promise<Project> {
  const body = await api.patch<unknown>(`/api/projects/${encodeURIComponent(projectId)}`, input);
  return projectResponseSchema.parse(body).project;
}

export function useUpdateProject(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ProjectInput) => updateProject(projectId, input),
    onSuccess: (project) => {
      queryClient.setQueryData(projectQueryKey(projectId), project);
      return queryClient.invalidateQueries({ queryKey: projectsQueryKey, exact: true });
    },
  });
}
