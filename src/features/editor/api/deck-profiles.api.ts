import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import type { DeckProfile, DeckProfileInput } from '../../../../shared/schemas/deck-profile.schema';

// /api/deck-profiles: the built-in slab build-ups and the firm's own, picked from when editing a
// deck on the Plan. Owners and engineers save, rename (PATCH: the name only) and delete the
// firm's own; the server refuses the rest. Every write refreshes the one library list.

const slab = z.object({
  ribHeight_in: z.number(), toppingThickness_in: z.number(), ribAvgWidth_in: z.number(), ribSpacing_in: z.number(),
  concreteWeight_pcf: z.number(), fc_ksi: z.number(), deckWeight_psf: z.number(),
});
const profile = z.object({ id: z.string(), name: z.string(), slab, builtIn: z.boolean() });

export const deckProfilesQueryKey = ['deck-profiles'] as const;

export function useDeckProfiles() {
  return useQuery({
    queryKey: deckProfilesQueryKey,
    queryFn: async ({ signal }): Promise<DeckProfile[]> => z.object({ profiles: z.array(profile) }).parse(await api.get<unknown>('/api/deck-profiles', signal)).profiles,
  });
}

export function useSaveDeckProfile() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: DeckProfileInput): Promise<DeckProfile> => z.object({ profile }).parse(await api.post<unknown>('/api/deck-profiles', input)).profile,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: deckProfilesQueryKey }),
  });
}

export function useRenameDeckProfile() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({ id, name }: { id: string; name: string }): Promise<DeckProfile> =>
      z.object({ profile }).parse(await api.patch<unknown>(`/api/deck-profiles/${encodeURIComponent(id)}`, { name })).profile,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: deckProfilesQueryKey }),
  });
}

export function useDeleteDeckProfile() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (id: string): Promise<void> => api.delete(`/api/deck-profiles/${encodeURIComponent(id)}`),
    // A 404 means someone else removed it first: the list is stale either way.
    onSettled: () => queryClient.invalidateQueries({ queryKey: deckProfilesQueryKey }),
  });
}
