/**
 * What differs between two plans, counted per kind of element, for the save-conflict banner
 * ("3 members added, 1 deck changed"). Elements are matched by id.
 */
import type { Plan } from '../../../../shared/schemas/plan.schema';
import { sameElement } from '../../../../shared/schemas/plan-element-compare';

export const DIFF_KINDS = [
  ['levels', 'level', 'levels'],
  ['grids', 'grid line', 'grid lines'],
  ['columns', 'column', 'columns'],
  ['members', 'member', 'members'],
  ['decks', 'deck area', 'deck areas'],
  ['zones', 'load zone', 'load zones'],
  ['pointLoads', 'point load', 'point loads'],
  ['lineLoads', 'line load', 'line loads'],
  ['openings', 'opening', 'openings'],
] as const;

export type DiffKind = (typeof DIFF_KINDS)[number][0];

export interface KindDiff {
  kind: DiffKind;
  added: number;
  removed: number;
  changed: number;
}

export interface PlanDiff {
  kinds: KindDiff[];
  /** Design basis or name changed. */
  settingsChanged: boolean;
  total: number;
}

/** Counts of elements added, removed and changed going from `from` to `to`. */
export function diffPlans(from: Plan, to: Plan): PlanDiff {
  const kinds: KindDiff[] = [];
  let total = 0;
  for (const [kind] of DIFF_KINDS) {
    const a = new Map(((from[kind] ?? []) as { id: string }[]).map((e) => [e.id, e]));
    const b = new Map(((to[kind] ?? []) as { id: string }[]).map((e) => [e.id, e]));
    let added = 0;
    let removed = 0;
    let changed = 0;
    for (const [id, e] of b) {
      const before = a.get(id);
      if (!before) added++;
      else if (!sameElement(kind, before, e)) changed++;
    }
    for (const id of a.keys()) if (!b.has(id)) removed++;
    if (added + removed + changed > 0) kinds.push({ kind, added, removed, changed });
    total += added + removed + changed;
  }
  const settingsChanged = from.name !== to.name || JSON.stringify(from.designBasis) !== JSON.stringify(to.designBasis);
  return { kinds, settingsChanged, total: total + (settingsChanged ? 1 : 0) };
}

/** "2 members added, 1 member removed, 1 deck area changed; design basis changed" or "no differences". */
export function describeDiff(diff: PlanDiff): string {
  const parts: string[] = [];
  for (const k of diff.kinds) {
    const [, one, many] = DIFF_KINDS.find(([kind]) => kind === k.kind)!;
    for (const [n, verb] of [[k.added, 'added'], [k.removed, 'removed'], [k.changed, 'changed']] as const) {
      if (n > 0) parts.push(`${n} ${n === 1 ? one : many} ${verb}`);
    }
  }
  if (diff.settingsChanged) parts.push('name or design basis changed');
  return parts.length ? parts.join(', ') : 'no differences';
}
