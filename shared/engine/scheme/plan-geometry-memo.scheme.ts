/**
 * Reuse of the geometry-only work across re-designs: the framing topology (with its spatial
 * indexes) and the deck loads (contexts, strips, merged strip loads) depend only on member
 * ids, levels, kinds and ends, on columns, levels, decks, zones and openings. An edit that
 * changes none of them (a size lock, a depth limit, a point or line load, the design basis)
 * reuses both; anything else rebuilds them. The comparison is value by value against a copy
 * taken when they were built, so edits made in place to an earlier plan object are caught.
 */
import type { Plan } from '../../schemas/plan.schema';
import { buildFramingTopology, type FramingMember, type FramingTopology } from '../geometry/framing-topology.geometry';
import { prepareDeckLoads, type PreparedDeckLoads } from '../takedown/gravity-takedown.takedown';
import { sameValue } from '../plain-value';

interface GeometrySignature {
  memberIds: string[];
  memberLevels: string[];
  memberKinds: string[];
  /** start x, start y, end x, end y per member. */
  memberEnds: Float64Array;
  /** Copies of the plan parts that are compared as values. */
  rest: unknown;
}

export interface PlanGeometry {
  topology: FramingTopology;
  deckLoads: PreparedDeckLoads;
}

export interface PlanGeometryMemo extends PlanGeometry {
  signature: GeometrySignature;
  /** The framing member built from plan.members[i], or null where it was left out. */
  framingByIndex: (FramingMember | null)[];
  /** The index in plan.decks of each deck context. */
  deckIndex: number[];
}

function restOf(plan: Plan): unknown {
  return {
    levels: plan.levels.map((l) => ({ id: l.id, roof: l.roof ?? null })),
    columns: plan.columns,
    decks: plan.decks,
    zones: plan.zones,
    openings: plan.openings,
  };
}

function signatureOf(plan: Plan): GeometrySignature {
  const n = plan.members.length;
  const memberEnds = new Float64Array(4 * n);
  const memberIds: string[] = new Array(n);
  const memberLevels: string[] = new Array(n);
  const memberKinds: string[] = new Array(n);
  for (let i = 0; i < n; i++) {
    const m = plan.members[i];
    memberIds[i] = m.id;
    memberLevels[i] = m.level;
    memberKinds[i] = m.kind;
    memberEnds[4 * i] = m.start[0];
    memberEnds[4 * i + 1] = m.start[1];
    memberEnds[4 * i + 2] = m.end[0];
    memberEnds[4 * i + 3] = m.end[1];
  }
  return { memberIds, memberLevels, memberKinds, memberEnds, rest: structuredClone(restOf(plan)) };
}

function geometryUnchanged(memo: PlanGeometryMemo, plan: Plan): boolean {
  const s = memo.signature;
  const n = plan.members.length;
  if (s.memberIds.length !== n) return false;
  for (let i = 0; i < n; i++) {
    const m = plan.members[i];
    if (m.id !== s.memberIds[i] || m.level !== s.memberLevels[i] || m.kind !== s.memberKinds[i]) return false;
    if (!Object.is(m.start[0], s.memberEnds[4 * i]) || !Object.is(m.start[1], s.memberEnds[4 * i + 1])) return false;
    if (!Object.is(m.end[0], s.memberEnds[4 * i + 2]) || !Object.is(m.end[1], s.memberEnds[4 * i + 3])) return false;
  }
  return sameValue(s.rest, restOf(plan));
}

/**
 * Point the reused structures at this plan's objects (members, decks, zones), so nothing
 * reads an earlier plan object that its owner may have edited since.
 */
function rebind(memo: PlanGeometryMemo, plan: Plan): void {
  for (let i = 0; i < memo.framingByIndex.length; i++) {
    const fm = memo.framingByIndex[i];
    if (!fm) continue;
    const m = plan.members[i];
    fm.member = m;
    fm.start = m.start;
    fm.end = m.end;
  }
  const zones = new Map(plan.zones.map((z) => [z.id, z]));
  memo.deckLoads.decks.forEach((ctx, k) => {
    ctx.deck = plan.decks[memo.deckIndex[k]];
    ctx.zone = zones.get(ctx.deck.zone)!;
  });
}

/** The topology and deck loads for this plan: the previous ones when its geometry is unchanged. */
export function planGeometry(plan: Plan, previous: PlanGeometryMemo | null): PlanGeometryMemo {
  if (previous && geometryUnchanged(previous, plan)) {
    rebind(previous, plan);
    return previous;
  }
  const signature = signatureOf(plan);
  const topology = buildFramingTopology(plan);
  const deckLoads = prepareDeckLoads(plan, topology);
  const framingByIndex = plan.members.map((m) => {
    const fm = topology.members.get(m.id);
    return fm && fm.member === m ? fm : null;
  });
  const deckPosition = new Map(plan.decks.map((d, i) => [d, i]));
  const deckIndex = deckLoads.decks.map((ctx) => deckPosition.get(ctx.deck)!);
  return { signature, topology, deckLoads, framingByIndex, deckIndex };
}
