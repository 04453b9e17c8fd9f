import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { invalidateProjectSchemes } from './get-schemes.api';
import { schemeResponseSchema, type SchemeSummary } from './scheme.schema';

/** A new scheme with an empty plan (one level, the default design basis). */
export async function createScheme(projectId: string, name: string): Promise<SchemeSummary> {
  const body = await api.post<unknown>(`/api/projects/${encodeURIComponent(projectId)}/schemes`, { name });
  return schemeResponseSchema.parse(body).scheme;
}

export function useCreateScheme(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (name: string) => createScheme(projectId, name),
    onSuccess: () => invalidateProjectSchemes(queryClient, projectId),
  });
}
