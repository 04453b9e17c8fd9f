import { z } from 'zod';

export const SCHEME_STATUSES = ['draft', 'in_review', 'chosen'] as const;
export type SchemeStatus = (typeof SCHEME_STATUSES)[number];

export const STATUS_LABELS: Record<SchemeStatus, string> = { draft: 'Draft', in_review: 'In review', chosen: 'Chosen' };

const person = z.object({ id: z.string(), name: z.string() }).nullable();

export const commentSchema = z.object({ id: z.string(), body: z.string(), author: person, createdAt: z.string() });
export type SchemeComment = z.infer<typeof commentSchema>;

export const activitySchema = z.object({
  kind: z.string(),
  at: z.string(),
  actor: person,
  summary: z.string(),
});
export type ActivityEntry = z.infer<typeof activitySchema>;

export const reviewQueryKey = (schemeId: string, what: 'comments' | 'activity') => ['schemes', schemeId, what] as const;
