/**
 * Three-way merge of plans on element ids against the base revision both sides started from:
 * an element changed (added, edited, removed) on one side only takes that side's version; an
 * element both sides changed the same way is taken once; one both changed differently is a
 * conflict, to be asked about. Issued marks do not count as changes (plan-element-compare).
 * The name and design basis merge the same way as one element. Pure.
 */
import type { Plan } from './plan.schema';
import { sameElement } from './plan-element-compare';

export const MERGED_KINDS = ['levels', 'grids', 'columns', 'members', 'decks', 'zones', 'pointLoads', 'lineLoads', 'openings'] as const;
type Kind = (typeof MERGED_KINDS)[number];
type El = { id: string };

export interface MergeConflict {
  kind: Kind | 'settings';
  id: string;
}

export interface PlanMerge {
  plan: Plan;
  conflicts: MergeConflict[];
}

function same(kind: string, a: El | undefined, b: El | undefined): boolean {
  if (!a || !b) return a === b;
  return sameElement(kind, a, b);
}

/** Whose version a conflicting element takes: the engineer's answer, per element. */
export type MergeChoice = 'mine' | 'theirs';

/** The key of a conflict in a choices map ("members:b2", "settings:designBasis"). */
export const conflictKey = (c: MergeConflict) => `${c.kind}:${c.id}`;

/**
 * `choose` answers each conflict (theirs when it is absent or says nothing): the conflicts are
 * still listed, so the caller can tell what was asked.
 */
export function mergePlans(base: Plan, mine: Plan, theirs: Plan, choose?: (c: MergeConflict) => MergeChoice | undefined): PlanMerge {
  const conflicts: MergeConflict[] = [];
  const merged: Record<string, unknown> = { ...theirs };
  for (const kind of MERGED_KINDS) {
    const b = new Map(((base[kind] ?? []) as El[]).map((e) => [e.id, e]));
    const m = new Map(((mine[kind] ?? []) as El[]).map((e) => [e.id, e]));
    const t = new Map(((theirs[kind] ?? []) as El[]).map((e) => [e.id, e]));
    // Their order first, then elements only mine added.
    const ids = [...t.keys(), ...[...m.keys()].filter((id) => !t.has(id))];
    const out: El[] = [];
    for (const id of new Set([...ids, ...b.keys()])) {
      const eb = b.get(id);
      const em = m.get(id);
      const et = t.get(id);
      const mineChanged = !same(kind, eb, em);
      const theirsChanged = !same(kind, eb, et);
      let pick: El | undefined;
      if (!mineChanged) pick = et;
      else if (!theirsChanged) pick = em;
      else if (same(kind, em, et)) pick = et;
      else {
        const conflict = { kind, id };
        conflicts.push(conflict);
        pick = choose?.(conflict) === 'mine' ? em : et; // theirs until the engineer chooses
      }
      if (pick) out.push(pick);
    }
    if (kind === 'grids' && base.grids === undefined && mine.grids === undefined && theirs.grids === undefined) continue;
    merged[kind] = out;
  }
  const settings = (p: Plan) => JSON.stringify({ name: p.name, designBasis: p.designBasis });
  if (settings(mine) !== settings(base)) {
    if (settings(theirs) === settings(base) || settings(theirs) === settings(mine)) Object.assign(merged, { name: mine.name, designBasis: mine.designBasis });
    else {
      const conflict = { kind: 'settings' as const, id: 'designBasis' };
      conflicts.push(conflict);
      if (choose?.(conflict) === 'mine') Object.assign(merged, { name: mine.name, designBasis: mine.designBasis });
    }
  }
  return { plan: merged as unknown as Plan, conflicts };
}
