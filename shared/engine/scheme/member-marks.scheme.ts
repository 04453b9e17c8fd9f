/**
 * Piece marks (Baywright's own rule, common practice in spirit): level prefix + kind letter
 * (G girder, B beam) + number. One mark per distinct design on a level (same kind, shape,
 * span to 0.01 ft, and for a composite member the same stud count and camber: one mark is one
 * fabricated piece).
 *
 * Marks once issued stay put: a member carries the mark it was last given (`issuedMark`, the
 * plan member's `mark` without `markLocked`), and keeps it while its design still matches the
 * others carrying it. Only a design with no usable issued mark gets a new one, numbered after
 * the highest issued on its prefix; so adding, moving or deleting one member never renames
 * another. A fresh plan (nothing issued yet) is numbered in plan order of the first member of
 * each design (midpoint by y, then x). Renumbering in plan order happens only on request
 * (the marks service clears the issued marks first). A member whose mark is locked keeps it;
 * identical members beside it keep theirs too, since a locked mark may be shared by the design
 * it belongs to.
 */
import type { Plan, PlanLevel } from '../../schemas/plan.schema';

export interface MarkInput {
  id: string;
  level: string;
  kind: 'girder' | 'beam';
  shape: string | null;
  span_ft: number;
  midpoint: readonly [number, number];
  lockedMark: string | null;
  /** The mark issued to this member earlier and stored with it (kept while it still fits). */
  issuedMark?: string | null;
  /** Composite members: studs on the member and camber (in); null or absent for bare steel. */
  studs?: number | null;
  camber_in?: number | null;
}

/**
 * The level part of a mark, from what a person calls the level: the first number in its name
 * ("Level 3" → "3", "L3" → "3"), "R" for a roof, else the name's first letter; the level id
 * only when the name gives nothing (an internal id must not reach a drawing).
 */
export function levelMarkPrefix(level: Pick<PlanLevel, 'id'> & Partial<Pick<PlanLevel, 'name' | 'roof'>>): string {
  const name = (level.name ?? '').trim();
  const number = /\d+/.exec(name);
  if (number) return String(Number(number[0]));
  if (level.roof || /\broof\b/i.test(name)) return 'R';
  const letter = /[A-Za-z]/.exec(name);
  if (letter) return letter[0].toUpperCase();
  const m = /^L(?:evel)?[-_ ]?(\d+)$/i.exec(level.id) ?? /^(\d+)$/.exec(level.id);
  return m ? m[1] : level.id;
}

type LevelLike = Pick<PlanLevel, 'id'> & Partial<Pick<PlanLevel, 'name' | 'roof'>>;

const designKey = (m: MarkInput) => `${m.level}\u0000${m.kind}\u0000${m.shape ?? '?'}\u0000${m.span_ft.toFixed(2)}\u0000${m.studs ?? ''}\u0000${m.camber_in ?? ''}`;
const escapeRe = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

export function assignMarks(members: readonly MarkInput[], levels: readonly LevelLike[]): Map<string, string> {
  const marks = new Map<string, string>();
  const prefixOf = new Map(levels.map((l) => [l.id, levelMarkPrefix(l)]));
  // Which design holds each mark: a mark belongs to one design.
  const claims = new Map<string, string>();
  for (const m of members) {
    if (!m.lockedMark) continue;
    marks.set(m.id, m.lockedMark);
    if (!claims.has(m.lockedMark)) claims.set(m.lockedMark, designKey(m));
  }
  const groups = new Map<string, MarkInput[]>();
  for (const m of members) {
    if (m.lockedMark) continue;
    const key = designKey(m);
    let g = groups.get(key);
    if (!g) groups.set(key, (g = []));
    g.push(m);
  }
  const prefixOfGroup = (g: MarkInput[]) => `${prefixOf.get(g[0].level) ?? g[0].level}${g[0].kind === 'girder' ? 'G' : 'B'}`;
  const ordered = [...groups.entries()].map(([key, g]) => ({ key, g: g.sort(planOrder), prefix: prefixOfGroup(g) }));
  ordered.sort((a, b) => planOrder(a.g[0], b.g[0]));

  // Issued marks: each design keeps the one most of its members carry, unless another design holds it.
  const highestIssued = new Map<string, number>();
  const candidates: { group: number; mark: string; count: number; n: number }[] = [];
  ordered.forEach(({ g, prefix }, group) => {
    const re = new RegExp(`^${escapeRe(prefix)}(\\d+)$`);
    const counts = new Map<string, number>();
    for (const m of g) {
      const hit = m.issuedMark ? re.exec(m.issuedMark) : null;
      if (!hit) continue;
      counts.set(m.issuedMark!, (counts.get(m.issuedMark!) ?? 0) + 1);
      highestIssued.set(prefix, Math.max(highestIssued.get(prefix) ?? 0, Number(hit[1])));
    }
    for (const [mark, count] of counts) candidates.push({ group, mark, count, n: Number(re.exec(mark)![1]) });
  });
  candidates.sort((a, b) => b.count - a.count || a.group - b.group || a.n - b.n);
  const given = new Map<number, string>();
  for (const c of candidates) {
    if (given.has(c.group)) continue;
    const holder = claims.get(c.mark);
    if (holder !== undefined && holder !== ordered[c.group].key) continue;
    given.set(c.group, c.mark);
    claims.set(c.mark, ordered[c.group].key);
  }

  // New designs: numbered after the highest issued mark of their prefix, in plan order.
  const next = new Map<string, number>();
  ordered.forEach(({ key, g, prefix }, group) => {
    let mark = given.get(group);
    if (!mark) {
      let n = next.get(prefix) ?? (highestIssued.get(prefix) ?? 0) + 1;
      while (claims.has(`${prefix}${n}`)) n++;
      mark = `${prefix}${n}`;
      next.set(prefix, n + 1);
      claims.set(mark, key);
    }
    for (const m of g) marks.set(m.id, mark);
  });
  return marks;
}

/** A mark carried by members of more than one design on a level (only locked marks can be). */
export interface SharedMarkConflict {
  mark: string;
  level: string;
  memberIds: string[];
  /** "W18X35, span 30'-0"" per distinct design, in member order. */
  designs: { shape: string | null; span_ft: number; studs: number | null; camber_in: number | null }[];
}

/** Marks that one level's members of different sizes or spans carry (to warn about, never silently). */
export function sharedMarkConflicts(members: readonly MarkInput[], marks: ReadonlyMap<string, string>): SharedMarkConflict[] {
  const byMark = new Map<string, MarkInput[]>();
  for (const m of members) {
    const mark = marks.get(m.id);
    if (!mark) continue;
    const k = `${m.level}\u0000${mark}`;
    let list = byMark.get(k);
    if (!list) byMark.set(k, (list = []));
    list.push(m);
  }
  const out: SharedMarkConflict[] = [];
  for (const list of byMark.values()) {
    const keys = new Map<string, MarkInput>();
    for (const m of list) {
      const key = designKey(m);
      if (!keys.has(key)) keys.set(key, m);
    }
    if (keys.size < 2) continue;
    out.push({
      mark: marks.get(list[0].id)!,
      level: list[0].level,
      memberIds: list.map((m) => m.id),
      designs: [...keys.values()].map((m) => ({ shape: m.shape, span_ft: m.span_ft, studs: m.studs ?? null, camber_in: m.camber_in ?? null })),
    });
  }
  return out;
}

/**
 * The plan with each member's issued mark stored on it (`mark`, not locked), so later designs
 * keep it; members with a locked mark are left alone. Returns the same plan when nothing differs.
 */
export function withIssuedMarks(plan: Plan, marks: ReadonlyMap<string, string>): Plan {
  let changed = false;
  const members = plan.members.map((m) => {
    if (m.markLocked && m.mark) return m;
    const mark = marks.get(m.id);
    if (mark === undefined || m.mark === mark) return m;
    changed = true;
    const { markLocked: _locked, ...rest } = m;
    return { ...rest, mark };
  });
  return changed ? { ...plan, members } : plan;
}

const r = (v: number) => Math.round(v * 100) / 100;

function planOrder(a: MarkInput, b: MarkInput): number {
  return r(a.midpoint[1]) - r(b.midpoint[1]) || r(a.midpoint[0]) - r(b.midpoint[0]) || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0);
}
