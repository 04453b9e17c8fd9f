/**
 * Piece marks (Baywright's own rule, common practice in spirit): level prefix + kind letter
 * (G girder, B beam) + number. One mark per distinct design on a level (same kind, shape and
 * span to 0.01 ft); numbered in plan order of the first member of each design (midpoint by y,
 * then x). A member whose mark is locked keeps it, and its number is not reused.
 */
import type { PlanLevel } from '../../schemas/plan.schema';

export interface MarkInput {
  id: string;
  level: string;
  kind: 'girder' | 'beam';
  shape: string | null;
  span_ft: number;
  midpoint: readonly [number, number];
  lockedMark: string | null;
}

/** "2" for level "L2" or "2"; otherwise the level id itself. */
export function levelMarkPrefix(level: Pick<PlanLevel, 'id'>): string {
  const m = /^L(?:evel)?[-_ ]?(\d+)$/i.exec(level.id) ?? /^(\d+)$/.exec(level.id);
  return m ? m[1] : level.id;
}

export function assignMarks(members: readonly MarkInput[], levels: readonly Pick<PlanLevel, 'id'>[]): Map<string, string> {
  const marks = new Map<string, string>();
  const prefixOf = new Map(levels.map((l) => [l.id, levelMarkPrefix(l)]));
  const taken = new Set<string>();
  for (const m of members) {
    if (m.lockedMark) {
      marks.set(m.id, m.lockedMark);
      taken.add(m.lockedMark);
    }
  }
  const groups = new Map<string, MarkInput[]>();
  for (const m of members) {
    if (m.lockedMark) continue;
    const key = `${m.level}\u0000${m.kind}\u0000${m.shape ?? '?'}\u0000${m.span_ft.toFixed(2)}`;
    let g = groups.get(key);
    if (!g) groups.set(key, (g = []));
    g.push(m);
  }
  const byPrefix = new Map<string, MarkInput[][]>();
  for (const g of groups.values()) {
    g.sort(planOrder);
    const prefix = `${prefixOf.get(g[0].level) ?? g[0].level}${g[0].kind === 'girder' ? 'G' : 'B'}`;
    let list = byPrefix.get(prefix);
    if (!list) byPrefix.set(prefix, (list = []));
    list.push(g);
  }
  for (const [prefix, list] of [...byPrefix].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))) {
    list.sort((a, b) => planOrder(a[0], b[0]));
    let n = 1;
    for (const g of list) {
      while (taken.has(`${prefix}${n}`)) n++;
      const mark = `${prefix}${n}`;
      taken.add(mark);
      for (const m of g) marks.set(m.id, mark);
    }
  }
  return marks;
}

const r = (v: number) => Math.round(v * 100) / 100;

function planOrder(a: MarkInput, b: MarkInput): number {
  return r(a.midpoint[1]) - r(b.midpoint[1]) || r(a.midpoint[0]) - r(b.midpoint[0]) || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0);
}
