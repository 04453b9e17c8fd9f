import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { projectQueryKey, projectResponseSchema } from './get-project.api';
import { projectsQueryKey } from './get-projects.api';
import { toProjectBody, type Project, type ProjectInput } from './project.schema';

export async function createProject(input: ProjectInput): Promise<Project> {
  return projectResponseSchema.parse(await api.post<unknown>('/api/projects', toProjectBody(input))).project;
}

export function useCreateProject() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createProject,
    onSuccess: (project) => {
      queryClient.setQueryData(projectQueryKey(project.id), project);
      return queryClient.invalidateQueries({ queryKey: projectsQueryKey, exact: true });
    },
  });
}
