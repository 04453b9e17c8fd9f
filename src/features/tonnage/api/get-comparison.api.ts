import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';

// GET /api/projects/:id/comparison: every non-archived scheme of the project with its
// tonnage (designed first when stale) and cost at the firm's unit prices.

const figures = z.object({
  steelWeight_lb: z.number(),
  steelWeight_tons: z.number(),
  steel_psf: z.number().nullable(),
  pieces: z.number(),
  connections: z.number(),
  floorArea_ft2: z.number(),
  unsizedPieces: z.number(),
  studs: z.number().default(0),
  camberedPieces: z.number().default(0),
  cost_usd: z.number().nullable(),
  steel_usd: z.number().nullable(),
  connections_usd: z.number().nullable(),
  studs_usd: z.number().nullable().default(null),
  camber_usd: z.number().nullable().default(null),
});
export type TonnageFigures = z.infer<typeof figures>;

export const comparisonSchemeSchema = z.object({
  id: z.string(),
  name: z.string(),
  status: z.enum(['draft', 'in_review', 'chosen']),
  archived: z.boolean(),
  totals: figures.optional(),
  byLevel: z.array(figures.extend({ level: z.string(), levelName: z.string() })).optional(),
  byKind: z.array(figures.extend({ kind: z.enum(['girder', 'beam', 'column']) })).optional(),
  revision: z.number().optional(),
  designedAt: z.string().optional(),
  failingMembers: z.number().optional(),
  problemCount: z.number().optional(),
  designError: z.string().optional(),
});
export type ComparisonScheme = z.infer<typeof comparisonSchemeSchema>;

export const comparisonSchema = z.object({
  project: z.object({ id: z.string(), name: z.string() }),
  schemes: z.array(comparisonSchemeSchema),
  prices: z.object({
    prices: z
      .object({
        steel_usd_per_ton: z.number(),
        connection_usd_each: z.number(),
        stud_usd_each: z.number().nullable().default(null),
        camber_usd_each: z.number().nullable().default(null),
        example: z.boolean(),
        setAt: z.string(),
        setBy: z.object({ id: z.string(), name: z.string() }).nullable(),
      })
      .nullable(),
    notYetPriced: z.array(z.string()),
  }),
  basis: z.string(),
  caution: z.string(),
  generatedAt: z.string(),
});
export type Comparison = z.infer<typeof comparisonSchema>;

export const comparisonQueryKey = (projectId: string) => ['projects', projectId, 'comparison'] as const;

export function comparisonPath(projectId: string, ext: '' | '.csv' | '.pdf' = '', schemeIds?: string[]): string {
  const q = schemeIds && schemeIds.length > 0 ? `?schemes=${schemeIds.map(encodeURIComponent).join(',')}` : '';
  return `/api/projects/${encodeURIComponent(projectId)}/comparison${ext}${q}`;
}

export async function getComparison(projectId: string, signal?: AbortSignal): Promise<Comparison> {
  return comparisonSchema.parse(await api.get<unknown>(comparisonPath(projectId), signal));
}

export function useComparison(projectId: string) {
  return useQuery(
    queryOptions({
      queryKey: comparisonQueryKey(projectId),
      queryFn: ({ signal }) => getComparison(projectId, signal),
    }),
  );
}
