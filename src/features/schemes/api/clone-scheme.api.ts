import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { invalidateProjectSchemes } from './get-schemes.api';
import { schemeResponseSchema, type SchemeSummary } from './scheme.schema';

/** A copy of the scheme's plan and latest design; named "<name> (copy)" unless given. */
export async function cloneScheme(schemeId: string, name?: string): Promise<SchemeSummary> {
  const body = await api.post<unknown>(`/api/schemes/${encodeURIComponent(schemeId)}/clone`, name ? { name } : {});
  return schemeResponseSchema.parse(body).scheme;
}

export function useCloneScheme(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ schemeId, name }: { schemeId: string; name?: string }) => cloneScheme(schemeId, name),
    onSuccess: () => invalidateProjectSchemes(queryClient, projectId),
  });
}
