import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { underlaysQueryKey } from './get-underlays.api';
import { underlaySchema, type Underlay, type UnderlayPatch } from './underlay.schema';

const responseSchema = z.object({ underlay: underlaySchema });

export async function updateUnderlay(underlayId: string, patch: UnderlayPatch): Promise<Underlay> {
  const body = await api.patch<unknown>(`/api/underlays/${encodeURIComponent(underlayId)}`, patch);
  return responseSchema.parse(body).underlay;
}

function applyPatch(u: Underlay, patch: UnderlayPatch): Underlay {
  return {
    ...u,
    ...(patch.opacity !== undefined ? { opacity: patch.opacity } : {}),
    ...(patch.visible !== undefined ? { visible: patch.visible } : {}),
    ...(patch.locked !== undefined ? { locked: patch.locked } : {}),
    // A new page keeps showing the old one until the server answers with its size.
    placement: { ...u.placement, ...(patch.placement ?? {}) },
  };
}

/** Changes show at once (optimistic); a refused change is rolled back. */
export function useUpdateUnderlay(schemeId: string) {
  const queryClient = useQueryClient();
  const key = underlaysQueryKey(schemeId);
  return useMutation({
    mutationFn: ({ underlayId, patch }: { underlayId: string; patch: UnderlayPatch }) => updateUnderlay(underlayId, patch),
    onMutate: async ({ underlayId, patch }) => {
      await queryClient.cancelQueries({ queryKey: key });
      const previous = queryClient.getQueryData<Underlay[]>(key);
      queryClient.setQueryData<Underlay[]>(key, (list) => list?.map((u) => (u.id === underlayId ? applyPatch(u, patch) : u)));
      return { previous };
    },
    onError: (_error, _vars, context) => {
      if (context?.previous) queryClient.setQueryData(key, context.previous);
    },
    onSuccess: (saved) => {
      queryClient.setQueryData<Underlay[]>(key, (list) => list?.map((u) => (u.id === saved.id ? saved : u)));
    },
  });
}
