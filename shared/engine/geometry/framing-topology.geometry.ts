/**
 * Framing topology: what each member end lands on, found from geometry (design-basis §2:
 * "Every member end lands on a support: a column, another member, or a bearing wall").
 * Bearing walls are not modelled in plan version 1.
 *
 * Order: a topological sort of "is supported by" with carried members first, so a member is
 * designed after every member that frames into it (its reactions then include theirs).
 */
import type { Plan, PlanMember } from '../../schemas/plan.schema';
import { planProblem, type PlanProblem } from '../../schemas/plan-problem.schema';
import { distanceFt, projectPointOnSegment, type Point } from './polygon.geometry';
import { SegmentGridIndex } from './spatial-index.geometry';

/** Two points closer than this (plan feet) coincide; a member end this close to a support bears on it. */
export const SUPPORT_TOLERANCE_FT = 0.01;

/** Bucket size of the spatial index, ft: about a bay, so each query sees a handful of members. */
const INDEX_CELL_FT = 10;

export type MemberEnd = 'start' | 'end';

export type EndSupport =
  | { kind: 'column'; id: string }
  /** position_ft is measured along the supporting member from its start. */
  | { kind: 'member'; id: string; position_ft: number }
  | { kind: 'none' };

export interface FramingMember {
  id: string;
  member: PlanMember;
  level: string;
  start: Point;
  end: Point;
  span_ft: number;
  /** Unit vector start → end. */
  direction: Point;
  supports: Record<MemberEnd, EndSupport>;
  /** Members whose ends bear on this member, with the position along this member. */
  carries: { memberId: string; end: MemberEnd; position_ft: number }[];
}

export interface FramingTopology {
  members: Map<string, FramingMember>;
  /** Carried members first; members in a support cycle are left out (and reported). */
  order: string[];
  /** Members left out of the framing entirely (zero length, duplicate, overlapping, unknown level). */
  excluded: Set<string>;
  problems: PlanProblem[];
  /** Spatial indexes per level, for "what is at this point" queries. */
  memberIndex: Map<string, SegmentGridIndex<FramingMember>>;
  columnIndex: Map<string, SegmentGridIndex<PlacedColumn>>;
}

export interface PlacedColumn {
  id: string;
  at: Point;
}

const fmt = (p: Point) => `(${+p[0].toFixed(3)}, ${+p[1].toFixed(3)})`;

export function memberSpanFt(m: Pick<PlanMember, 'start' | 'end'>): number {
  return distanceFt(m.start, m.end);
}

/** Collinear with an overlap longer than the tolerance (a duplicate is the full-overlap case). */
export function membersOverlapFt(a: FramingMember, b: FramingMember): number {
  const ux = a.direction[0];
  const uy = a.direction[1];
  const dxA = b.start[0] - a.start[0];
  const dyA = b.start[1] - a.start[1];
  if (Math.abs(-dxA * uy + dyA * ux) > SUPPORT_TOLERANCE_FT) return 0;
  const dxB = b.end[0] - a.start[0];
  const dyB = b.end[1] - a.start[1];
  if (Math.abs(-dxB * uy + dyB * ux) > SUPPORT_TOLERANCE_FT) return 0;
  const s1 = dxA * ux + dyA * uy;
  const s2 = dxB * ux + dyB * uy;
  const lo = Math.max(0, Math.min(s1, s2));
  const hi = Math.min(a.span_ft, Math.max(s1, s2));
  return hi - lo;
}

/**
 * What a member end at point p bears on: a column at the member's level first, else a member
 * whose interior it lies on, else a member whose end it touches (girders before beams, then by id).
 */
export function findEndSupport(
  p: Point,
  self: FramingMember,
  columnsAtLevel: readonly { id: string; at: Point }[],
  membersNear: readonly FramingMember[],
): EndSupport {
  // The column with the least id among those at p.
  let column: { id: string } | null = null;
  for (let i = 0; i < columnsAtLevel.length; i++) {
    const c = columnsAtLevel[i];
    if (distanceFt(c.at, p) <= SUPPORT_TOLERANCE_FT && (column === null || c.id < column.id)) column = c;
  }
  if (column !== null) return { kind: 'column', id: column.id };
  // Interior before end, girder before beam, then least id; the first listed wins a full tie.
  let best: FramingMember | null = null;
  let bestInterior = false;
  let bestPosition = 0;
  for (let i = 0; i < membersNear.length; i++) {
    const m = membersNear[i];
    if (m.id === self.id) continue;
    const { distanceFt: d, t } = projectPointOnSegment(p, m.start, m.end);
    if (d > SUPPORT_TOLERANCE_FT) continue;
    const position_ft = t * m.span_ft;
    const interior = position_ft > SUPPORT_TOLERANCE_FT && position_ft < m.span_ft - SUPPORT_TOLERANCE_FT;
    const better =
      best === null ||
      (interior !== bestInterior ? interior : m.member.kind !== best.member.kind ? m.member.kind === 'girder' : m.id < best.id);
    if (better) {
      best = m;
      bestInterior = interior;
      bestPosition = position_ft;
    }
  }
  if (best === null) return { kind: 'none' };
  return { kind: 'member', id: best.id, position_ft: bestPosition };
}

/** The member a point lies on (within the tolerance): interior first, girders before beams, then by id. */
export function memberAtPoint(p: Point, candidates: readonly FramingMember[]): { member: FramingMember; position_ft: number } | null {
  let best: { member: FramingMember; position_ft: number; interior: boolean } | null = null;
  for (const m of candidates) {
    const { distanceFt: d, t } = projectPointOnSegment(p, m.start, m.end);
    if (d > SUPPORT_TOLERANCE_FT) continue;
    const position_ft = t * m.span_ft;
    const interior = position_ft > SUPPORT_TOLERANCE_FT && position_ft < m.span_ft - SUPPORT_TOLERANCE_FT;
    const better =
      !best ||
      (interior !== best.interior ? interior : m.member.kind !== best.member.member.kind ? m.member.kind === 'girder' : m.id < best.member.id);
    if (better) best = { member: m, position_ft, interior };
  }
  return best && { member: best.member, position_ft: best.position_ft };
}

const overlapsMember = (candidate: FramingMember, fm: FramingMember) => membersOverlapFt(candidate, fm) > SUPPORT_TOLERANCE_FT;

/** Build the framing topology of a plan and list its problems, each naming the element. */
export function buildFramingTopology(plan: Plan): FramingTopology {
  const problems: PlanProblem[] = [];
  const excluded = new Set<string>();
  const levelIds = new Set(plan.levels.map((l) => l.id));
  const members = new Map<string, FramingMember>();
  const indexByLevel = new Map<string, SegmentGridIndex<FramingMember>>();

  plan.members.forEach((m, i) => {
    if (!levelIds.has(m.level)) {
      excluded.add(m.id);
      return; // reported by the repair step
    }
    const span_ft = memberSpanFt(m);
    if (span_ft <= SUPPORT_TOLERANCE_FT) {
      problems.push(planProblem('error', 'member-zero-length', `Member ${m.id}: zero length (start and end both at ${fmt(m.start)})`, { elementId: m.id, path: `members[${i}]` }));
      excluded.add(m.id);
      return;
    }
    const fm: FramingMember = {
      id: m.id,
      member: m,
      level: m.level,
      start: m.start,
      end: m.end,
      span_ft,
      direction: [(m.end[0] - m.start[0]) / span_ft, (m.end[1] - m.start[1]) / span_ft],
      supports: { start: { kind: 'none' }, end: { kind: 'none' } },
      carries: [],
    };
    let index = indexByLevel.get(m.level);
    if (!index) indexByLevel.set(m.level, (index = new SegmentGridIndex<FramingMember>(INDEX_CELL_FT)));
    // Duplicates and overlaps: the later member (file order) is left out.
    const other = index.firstInBox(
      [Math.min(m.start[0], m.end[0]) - SUPPORT_TOLERANCE_FT, Math.min(m.start[1], m.end[1]) - SUPPORT_TOLERANCE_FT],
      [Math.max(m.start[0], m.end[0]) + SUPPORT_TOLERANCE_FT, Math.max(m.start[1], m.end[1]) + SUPPORT_TOLERANCE_FT],
      overlapsMember,
      fm,
    );
    if (other !== null) {
      const overlap = membersOverlapFt(other, fm);
      const duplicate =
        (distanceFt(other.start, fm.start) <= SUPPORT_TOLERANCE_FT && distanceFt(other.end, fm.end) <= SUPPORT_TOLERANCE_FT) ||
        (distanceFt(other.start, fm.end) <= SUPPORT_TOLERANCE_FT && distanceFt(other.end, fm.start) <= SUPPORT_TOLERANCE_FT);
      problems.push(
        duplicate
          ? planProblem('error', 'member-duplicate', `Member ${m.id}: duplicates member ${other.id} (same ends); ${m.id} is left out`, { elementId: m.id, path: `members[${i}]` })
          : planProblem('error', 'member-overlap', `Member ${m.id}: overlaps member ${other.id} over ${overlap.toFixed(2)} ft; ${m.id} is left out`, { elementId: m.id, path: `members[${i}]` }),
      );
      excluded.add(m.id);
      return;
    }
    index.insert(fm, m.start, m.end, SUPPORT_TOLERANCE_FT);
    members.set(m.id, fm);
  });

  const columnsByLevel = new Map<string, { id: string; at: Point }[]>();
  for (const c of plan.columns) {
    for (const level of c.levels) {
      let list = columnsByLevel.get(level);
      if (!list) columnsByLevel.set(level, (list = []));
      list.push({ id: c.id, at: [c.x_ft, c.y_ft] });
    }
  }
  const columnIndexByLevel = new Map<string, SegmentGridIndex<{ id: string; at: Point }>>();
  for (const [level, list] of columnsByLevel) {
    const idx = new SegmentGridIndex<{ id: string; at: Point }>(INDEX_CELL_FT);
    for (const c of list) idx.insert(c, c.at, c.at, SUPPORT_TOLERANCE_FT);
    columnIndexByLevel.set(level, idx);
  }

  // Columns at any level: a member end on a column that does not list the member's level is
  // that omission (not a support cycle of the members meeting there).
  const columnsAnyLevel = new SegmentGridIndex<{ id: string; at: Point; levels: string[] }>(INDEX_CELL_FT);
  for (const c of plan.columns) columnsAnyLevel.insert({ id: c.id, at: [c.x_ft, c.y_ft], levels: c.levels }, [c.x_ft, c.y_ft], [c.x_ft, c.y_ft], SUPPORT_TOLERANCE_FT);

  let memberIndexInFile: Map<string, number> | null = null; // only for problem paths
  const pathOf = (fm: FramingMember, end: MemberEnd) => `members[${(memberIndexInFile ??= new Map(plan.members.map((m, i) => [m.id, i]))).get(fm.id)}].${end}`;
  for (const fm of members.values()) {
    const index = indexByLevel.get(fm.level)!;
    const columnIndex = columnIndexByLevel.get(fm.level);
    for (const end of ['start', 'end'] as const) {
      const p = fm[end];
      let support = findEndSupport(p, fm, columnIndex?.near(p) ?? [], index.near(p));
      let levelMissing = false;
      if (support.kind !== 'column') {
        const onMemberInterior = support.kind === 'member' && support.position_ft > SUPPORT_TOLERANCE_FT && support.position_ft < members.get(support.id)!.span_ft - SUPPORT_TOLERANCE_FT;
        const column = onMemberInterior ? undefined : columnsAnyLevel.near(p).filter((c) => distanceFt(c.at, p) <= SUPPORT_TOLERANCE_FT).sort((a, b) => (a.id < b.id ? -1 : 1))[0];
        if (column) {
          support = { kind: 'none' };
          levelMissing = true;
          problems.push(
            planProblem('error', 'column-level-missing', `Member ${fm.id}: ${end} ${fmt(p)} is on column ${column.id}, but the column's levels (${column.levels.join(', ') || 'none'}) do not include ${fm.level}; add ${fm.level} to the column's levels`, {
              elementId: fm.id,
              path: pathOf(fm, end),
            }),
          );
        }
      }
      fm.supports[end] = support;
      if (support.kind === 'member') {
        members.get(support.id)!.carries.push({ memberId: fm.id, end, position_ft: support.position_ft });
      } else if (support.kind === 'none' && !levelMissing) {
        problems.push(
          planProblem('error', 'member-end-unsupported', `Member ${fm.id}: ${end} ${fmt(p)} lands on no column, member or wall at level ${fm.level}`, {
            elementId: fm.id,
            path: pathOf(fm, end),
          }),
        );
      }
    }
  }
  for (const fm of members.values()) fm.carries.sort((a, b) => a.position_ft - b.position_ft || (a.memberId < b.memberId ? -1 : 1));

  const { order, cyclic } = orderBySupport(members);
  const inCycle = new Set<string>();
  for (const cycle of describeSupportCycles(members, cyclic)) {
    cycle.forEach((id) => inCycle.add(id));
    problems.push(planProblem('error', 'support-cycle', `Member ${cycle[0]}: support cycle ${cycle.join(' → ')} → ${cycle[0]} (members carry each other)`, { elementId: cycle[0] }));
  }
  for (const id of [...cyclic].sort()) {
    if (inCycle.has(id)) continue;
    problems.push(planProblem('error', 'support-cycle-dependent', `Member ${id}: not designed, it carries members caught in a support cycle`, { elementId: id }));
  }
  return { members, order, excluded, problems, memberIndex: indexByLevel, columnIndex: columnIndexByLevel };
}

/** Kahn's algorithm on "carries": a member comes after every member that bears on it. Ties by id. */
export function orderBySupport(
  members: Map<string, Pick<FramingMember, 'id' | 'carries' | 'supports'>>,
  /** Filled (when given) with the supporters each member made ready, in the order they were queued. */
  readied?: Map<string, string[]>,
): { order: string[]; cyclic: Set<string> } {
  const pending = new Map<string, number>();
  const ready: string[] = [];
  for (const fm of members.values()) {
    pending.set(fm.id, fm.carries.length);
    if (fm.carries.length === 0) ready.push(fm.id);
  }
  ready.sort();
  const order: string[] = [];
  for (let i = 0; i < ready.length; i++) {
    const id = ready[i];
    order.push(id);
    const fm = members.get(id)!;
    // Supporters that became ready, distinct, in id order.
    let first: string | null = null;
    let second: string | null = null;
    for (let e = 0; e < 2; e++) {
      const s = e === 0 ? fm.supports.start : fm.supports.end;
      if (s.kind !== 'member') continue;
      const left = pending.get(s.id)! - 1;
      pending.set(s.id, left);
      if (left !== 0) continue;
      if (first === null) first = s.id;
      else if (s.id !== first) second = s.id;
    }
    if (first !== null && second !== null && second < first) {
      ready.push(second, first);
      readied?.set(id, [second, first]);
    } else {
      if (first !== null) ready.push(first);
      if (second !== null) ready.push(second);
      if (readied && first !== null) readied.set(id, second !== null ? [first, second] : [first]);
    }
  }
  if (order.length === members.size) return { order, cyclic: new Set() };
  const placed = new Set(order);
  const cyclic = new Set([...members.keys()].filter((id) => !placed.has(id)));
  return { order, cyclic };
}

/** The distinct cycles among the unplaced members, each as its member ids in support order. */
function describeSupportCycles(members: Map<string, FramingMember>, cyclic: Set<string>): string[][] {
  const cycles: string[][] = [];
  const reported = new Set<string>();
  for (const startId of [...cyclic].sort()) {
    if (reported.has(startId)) continue;
    // Follow "is supported by" within the cyclic set until a member repeats.
    const path: string[] = [];
    const seenAt = new Map<string, number>();
    let id: string | undefined = startId;
    while (id !== undefined && !seenAt.has(id) && !reported.has(id)) {
      seenAt.set(id, path.length);
      path.push(id);
      const fm: FramingMember = members.get(id)!;
      id = (['start', 'end'] as const)
        .map((e) => fm.supports[e])
        .filter((s): s is { kind: 'member'; id: string; position_ft: number } => s.kind === 'member' && cyclic.has(s.id))
        .map((s) => s.id)
        .sort()[0];
    }
    if (id !== undefined && seenAt.has(id)) {
      const cycle = path.slice(seenAt.get(id)!);
      cycles.push(cycle);
      cycle.forEach((c) => reported.add(c));
    }
    path.forEach((p) => reported.add(p));
  }
  return cycles;
}
