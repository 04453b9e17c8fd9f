import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { invalidateProjectSchemes } from './get-schemes.api';
import { schemeResponseSchema, type SchemeSummary } from './scheme.schema';

export type SchemePatch = { name?: string; archived?: boolean };

/** Rename or archive a scheme; neither changes its plan revision. */
export async function updateScheme(schemeId: string, patch: SchemePatch): Promise<SchemeSummary> {
  const body = await api.patch<unknown>(`/api/schemes/${encodeURIComponent(schemeId)}`, patch);
  return schemeResponseSchema.parse(body).scheme;
}

export function useUpdateScheme(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ schemeId, patch }: { schemeId: string; patch: SchemePatch }) => updateScheme(schemeId, patch),
    onSuccess: () => invalidateProjectSchemes(queryClient, projectId),
  });
}
