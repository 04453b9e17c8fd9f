import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { parsePlanFile, type Plan } from '../../../../shared/schemas/plan.schema';

const idSchema = z.union([z.string(), z.number()]).transform(String);

export const schemeResponseSchema = z.object({
  scheme: z.object({
    id: idSchema,
    projectId: idSchema,
    name: z.string(),
    status: z.string(),
    revision: z.number().int(),
    plan: z.unknown(),
  }),
});

export interface EditorScheme {
  id: string;
  projectId: string;
  name: string;
  status: string;
  revision: number;
  /** The plan after migrations, zod parse and repair (null when it could not be read). */
  plan: Plan | null;
  /** Why the plan could not be read, or what the repair step fixed. */
  problems: string[];
}

export const editorSchemeQueryKey = (schemeId: string) => ['editor', 'scheme', schemeId] as const;

export async function getEditorScheme(schemeId: string, signal?: AbortSignal): Promise<EditorScheme> {
  const body = schemeResponseSchema.parse(await api.get<unknown>(`/api/schemes/${encodeURIComponent(schemeId)}`, signal));
  const { plan, repairs, problems } = parsePlanFile(body.scheme.plan);
  return {
    id: body.scheme.id,
    projectId: body.scheme.projectId,
    name: body.scheme.name,
    status: body.scheme.status,
    revision: body.scheme.revision,
    plan,
    problems: [...problems.map((p) => p.message), ...repairs],
  };
}

export function editorSchemeQueryOptions(schemeId: string) {
  // The editor owns the plan once open: no background refetch that could clobber a draft.
  return queryOptions({
    queryKey: editorSchemeQueryKey(schemeId),
    queryFn: ({ signal }) => getEditorScheme(schemeId, signal),
    staleTime: Infinity,
    refetchOnWindowFocus: false,
  });
}

export function useEditorScheme(schemeId: string) {
  return useQuery({ ...editorSchemeQueryOptions(schemeId), enabled: schemeId !== '' });
}
