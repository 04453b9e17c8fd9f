import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '../../../lib/api-client';

// GET/PUT /api/unit-prices and GET /api/unit-prices/history.

export const pricesSchema = z.object({
  id: z.string(),
  steel_usd_per_ton: z.number(),
  connection_usd_each: z.number(),
  stud_usd_each: z.number().nullable().default(null),
  camber_usd_each: z.number().nullable().default(null),
  example: z.boolean(),
  note: z.string().nullable(),
  setBy: z.object({ id: z.string(), name: z.string() }).nullable(),
  setAt: z.string(),
});
export type UnitPrices = z.infer<typeof pricesSchema>;

const responseSchema = z.object({ prices: pricesSchema.nullable(), notYetPriced: z.array(z.string()) });
export type UnitPricesResponse = z.infer<typeof responseSchema>;
const historySchema = z.object({ history: z.array(pricesSchema) });

export const unitPricesQueryKey = ['unit-prices'] as const;

export function useUnitPrices() {
  return useQuery({
    queryKey: unitPricesQueryKey,
    queryFn: async ({ signal }) => responseSchema.parse(await apiRequest<unknown>('/api/unit-prices', { signal })),
  });
}

export function useUnitPriceHistory() {
  return useQuery({
    queryKey: [...unitPricesQueryKey, 'history'],
    queryFn: async ({ signal }) => historySchema.parse(await apiRequest<unknown>('/api/unit-prices/history', { signal })).history,
  });
}

export interface UnitPricesInput {
  steel_usd_per_ton: number;
  connection_usd_each: number;
  /** null = not priced. */
  stud_usd_each: number | null;
  camber_usd_each: number | null;
  note?: string;
}

export function useSetUnitPrices() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: UnitPricesInput) =>
      responseSchema.parse(await apiRequest<unknown>('/api/unit-prices', { method: 'PUT', body: input })),
    // Prices change every estimate: refresh them and anything priced (comparisons).
    onSuccess: () => queryClient.invalidateQueries(),
  });
}
