/**
 * Bays and infill: the bay is the rectangle between the grid lines around a point; infill
 * places beams across it at equal spacing not more than the one asked for (or a count).
 * Pure: the Plan's Infill tool and the bay study (shared/engine/study) lay out with these.
 */
import type { Plan, PlanMember } from '../../schemas/plan.schema';
import { nextId, usedIds } from '../../schemas/plan-ids';

/** A point in plan, ft (x, y). */
export type PlanPoint = readonly [number, number];

export interface Bay {
  x0: number;
  x1: number;
  y0: number;
  y1: number;
}

const TOL = 0.01;

/** The bay between the grid lines on either side of the point, or null outside the grid. */
export function findBay(plan: Plan, p: PlanPoint): Bay | null {
  const xs = (plan.grids ?? []).filter((g) => g.axis === 'x').map((g) => g.offset_ft).sort((a, b) => a - b);
  const ys = (plan.grids ?? []).filter((g) => g.axis === 'y').map((g) => g.offset_ft).sort((a, b) => a - b);
  const around = (values: number[], v: number): [number, number] | null => {
    for (let i = 0; i + 1 < values.length; i++) if (v >= values[i] && v <= values[i + 1] && values[i + 1] - values[i] > TOL) return [values[i], values[i + 1]];
    return null;
  };
  const x = around(xs, p[0]);
  const y = around(ys, p[1]);
  return x && y ? { x0: x[0], x1: x[1], y0: y[0], y1: y[1] } : null;
}

export function bayPolygon(bay: Bay): PlanPoint[] {
  return [[bay.x0, bay.y0], [bay.x1, bay.y0], [bay.x1, bay.y1], [bay.x0, bay.y1]];
}

/** A girder drawn along the bay edge (constant x or y) and overlapping it. */
function girderAlong(members: PlanMember[], axis: 'x' | 'y', at: number, from: number, to: number): boolean {
  // axis 'y': an edge of constant y = at running in x from..to.
  return members.some((m) => {
    if (m.kind !== 'girder') return false;
    const c = axis === 'y' ? 1 : 0;
    const r = axis === 'y' ? 0 : 1;
    if (Math.abs(m.start[c] - at) > TOL || Math.abs(m.end[c] - at) > TOL) return false;
    const lo = Math.min(m.start[r], m.end[r]);
    const hi = Math.max(m.start[r], m.end[r]);
    return hi - lo > TOL && lo < to - TOL && hi > from + TOL;
  });
}

/**
 * Which way infill beams run in a bay: between the pair of opposite edges that carry girders.
 * With girders on both pairs (or neither) the beams run parallel to the longer side, framing
 * into the girders on the short sides (common practice; the engineer can pick either way).
 */
export function infillDirection(members: PlanMember[], bay: Bay): 'x' | 'y' {
  const onYEdges = girderAlong(members, 'y', bay.y0, bay.x0, bay.x1) && girderAlong(members, 'y', bay.y1, bay.x0, bay.x1);
  const onXEdges = girderAlong(members, 'x', bay.x0, bay.y0, bay.y1) && girderAlong(members, 'x', bay.x1, bay.y0, bay.y1);
  if (onYEdges && !onXEdges) return 'y';
  if (onXEdges && !onYEdges) return 'x';
  return bay.y1 - bay.y0 >= bay.x1 - bay.x0 ? 'y' : 'x';
}

export type InfillRequest = { direction: 'auto' | 'x' | 'y' } & ({ spacing_ft: number } | { count: number });

export type InfillResult =
  | { ok: true; direction: 'x' | 'y'; spacing_ft: number; add: PlanMember[]; removeIds: string[] }
  | { ok: false; error: string };

/** Beams parallel to `direction`, replacing infill beams already in the bay that way. */
export function infillBay(plan: Plan, levelId: string, bay: Bay, request: InfillRequest): InfillResult {
  const levelMembers = plan.members.filter((m) => m.level === levelId);
  const direction = request.direction === 'auto' ? infillDirection(levelMembers, bay) : request.direction;
  // Beams run in `direction` and are spaced across the other one.
  const across = direction === 'y' ? [bay.x0, bay.x1] : [bay.y0, bay.y1];
  const spanFrom = direction === 'y' ? bay.y0 : bay.x0;
  const spanTo = direction === 'y' ? bay.y1 : bay.x1;
  const width = across[1] - across[0];
  let divisions: number;
  if ('count' in request) {
    if (!Number.isInteger(request.count) || request.count < 1 || request.count > 100) return { ok: false, error: 'Beam count: enter a whole number from 1 to 100.' };
    divisions = request.count + 1;
  } else {
    if (!(request.spacing_ft > 0)) return { ok: false, error: 'Beam spacing: enter a spacing more than 0 ft.' };
    divisions = Math.max(1, Math.ceil(width / request.spacing_ft - 1e-6));
    if (divisions > 101) return { ok: false, error: `Beam spacing: ${request.spacing_ft} ft would put more than 100 beams in this bay.` };
  }
  if (divisions < 2) return { ok: false, error: `The bay is ${round2(width)} ft wide: a spacing of ${'spacing_ft' in request ? request.spacing_ft : '?'} ft leaves no room for a beam.` };

  const c = direction === 'y' ? 0 : 1; // coordinate that varies across the bay
  const inBayParallel = (m: PlanMember) => {
    const a = m.start[c];
    if (Math.abs(m.end[c] - a) > TOL) return false;
    if (a <= across[0] + TOL || a >= across[1] - TOL) return false;
    const r = 1 - c;
    const lo = Math.min(m.start[r], m.end[r]);
    const hi = Math.max(m.start[r], m.end[r]);
    return lo >= spanFrom - TOL && hi <= spanTo + TOL;
  };
  const removeIds = levelMembers.filter((m) => m.kind === 'beam' && inBayParallel(m)).map((m) => m.id);

  const taken = usedIds(plan);
  const add: PlanMember[] = [];
  for (let k = 1; k < divisions; k++) {
    const at = Math.round((across[0] + (k * width) / divisions) * 1e6) / 1e6;
    const start: [number, number] = direction === 'y' ? [at, spanFrom] : [spanFrom, at];
    const end: [number, number] = direction === 'y' ? [at, spanTo] : [spanTo, at];
    add.push({ id: nextId(plan, 'b', taken), level: levelId, kind: 'beam', start, end, shape: null, maxDepth_in: null });
  }
  return { ok: true, direction, spacing_ft: width / divisions, add, removeIds };
}

/** The plan with the infill's beams in place of those it replaces. */
export function applyInfill(plan: Plan, result: Extract<InfillResult, { ok: true }>): Plan {
  const remove = new Set(result.removeIds);
  return { ...plan, members: [...plan.members.filter((m) => !remove.has(m.id)), ...result.add] };
}

function round2(v: number): number {
  return Math.round(v * 100) / 100;
}
