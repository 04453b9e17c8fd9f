import { z } from 'zod';
import { ApiError } from '../../../lib/api-client';
import { exportPlanFile, parsePlanFile, type Plan } from '../../../../shared/schemas/plan.schema';

const mergedSchema = z.object({
  basedOn: z.number().int(),
  mergedWith: z.number().int(),
  by: z.array(z.string()).default([]),
  changes: z.array(z.string()).default([]),
  plan: z.unknown(),
});

export const savePlanResponseSchema = z.object({ revision: z.number().int(), repairs: z.array(z.string()).default([]), merged: mergedSchema.optional() });

/** A save based on an older revision that the server merged with the saves made since. */
export interface SaveMerged {
  basedOn: number;
  mergedWith: number;
  /** Who saved the revisions it was merged with. */
  by: string[];
  /** What was taken in from theirs, one line per element, named by mark and grid location. */
  changes: string[];
  /** The plan as saved (theirs and mine together). */
  plan: Plan | null;
}

export interface SaveConflict {
  revision: number;
  plan: Plan | null;
  updatedBy: string | null;
  updatedAt: string | null;
  /** Why the server could not merge the save even though no element was changed by both. */
  mergeProblem?: string | null;
}

export type SavePlanOutcome =
  | { kind: 'saved'; revision: number; repairs: string[]; merged?: SaveMerged }
  | { kind: 'conflict'; current: SaveConflict }
  | { kind: 'invalid'; problems: string[] };

const currentSchema = z.object({
  revision: z.number().int(),
  plan: z.unknown(),
  updatedBy: z.union([z.string(), z.object({ name: z.string() }).transform((u) => u.name)]).nullish(),
  updatedAt: z.string().nullish(),
});

/** `current` may sit in the error envelope or beside it. */
function readConflict(payload: unknown) {
  const p = payload as { current?: unknown; error?: { current?: unknown; mergeProblem?: unknown } } | undefined;
  const parsed = currentSchema.safeParse(p?.error?.current ?? p?.current);
  if (!parsed.success) return null;
  const mergeProblem = typeof p?.error?.mergeProblem === 'string' ? p.error.mergeProblem : null;
  return { ...parsed.data, mergeProblem };
}

/**
 * PUT the plan with the revision it was based on. A 409 (someone saved in between) and a 422
 * (the server refused the plan) are outcomes, not thrown errors: the caller keeps the local
 * plan either way.
 */
export async function savePlan(schemeId: string, revision: number, plan: Plan): Promise<SavePlanOutcome> {
  const path = `/api/schemes/${encodeURIComponent(schemeId)}/plan`;
  const body = JSON.stringify({ revision, plan: exportPlanFile(plan) });
  let response: Response;
  try {
    response = await fetch(path, { method: 'PUT', headers: { 'Content-Type': 'application/json', Accept: 'application/json' }, body, credentials: 'same-origin' });
  } catch {
    throw new ApiError(0, 'network', 'Could not reach the Baywright server. Your changes are kept here and will be saved when it answers.');
  }
  const payload: unknown = await response.json().catch(() => undefined);
  if (response.ok) {
    const r = savePlanResponseSchema.parse(payload);
    if (!r.merged) return { kind: 'saved', revision: r.revision, repairs: r.repairs };
    const { plan: mergedPlan, ...merged } = r.merged;
    return { kind: 'saved', revision: r.revision, repairs: r.repairs, merged: { ...merged, plan: parsePlanFile(mergedPlan).plan } };
  }
  if (response.status === 409) {
    const current = readConflict(payload);
    if (current) {
      return {
        kind: 'conflict',
        current: { revision: current.revision, plan: parsePlanFile(current.plan).plan, updatedBy: current.updatedBy ?? null, updatedAt: current.updatedAt ?? null, mergeProblem: current.mergeProblem },
      };
    }
  }
  if (response.status === 422) {
    const err = (payload as { error?: { message?: string; problems?: unknown[] } } | undefined)?.error;
    const problems = (err?.problems ?? []).map((p) => (typeof p === 'string' ? p : typeof (p as { message?: unknown }).message === 'string' ? (p as { message: string }).message : JSON.stringify(p)));
    return { kind: 'invalid', problems: problems.length ? problems : [err?.message ?? 'The server refused the plan.'] };
  }
  const err = (payload as { error?: { code?: unknown; message?: unknown } } | undefined)?.error;
  throw new ApiError(
    response.status,
    typeof err?.code === 'string' ? err.code : `http_${response.status}`,
    typeof err?.message === 'string' ? err.message : `The server answered ${response.status}; your changes are kept here.`,
  );
}
