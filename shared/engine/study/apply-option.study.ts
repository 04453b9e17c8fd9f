/**
 * One framing option applied to a plan: in each bay of the region the infill beams are laid
 * out by the Infill tool's own rules (infillBay), running the option's way; the bay edges they
 * frame into carry girders (the drawn member along that edge becomes a girder, or a girder is
 * added where the edge has none); the deck over the bay spans across the new beams; the depth
 * limit goes on the region's unlocked framing; the steel grade is the design basis Fy.
 *
 * Conservative readings (also in the report text):
 * - the engine designs with one Fy per scheme, so a grade option applies to the whole scheme;
 * - a composite option sets members[].composite on the region's framing only (infill beams and
 *   the bay edges); where no deck with a slab build-up lies over a member, the engine designs it
 *   bare steel and says so, so "composite" is never assumed without a slab;
 * - beams already inside a bay (either way) are replaced by the option's beams; members that
 *   framed into them lose that support and are reported by the design as problems.
 */
import type { Plan, PlanDeck, PlanMember } from '../../schemas/plan.schema';
import type { StudyDirection } from '../../schemas/study.schema';
import { nextId, usedIds } from '../../schemas/plan-ids';
import { applyInfill, infillBay, type Bay } from '../layout/bay-infill.layout';
import { splitByRect } from '../geometry/polygon-clip.geometry';

const TOL = 0.01;

export interface StudyOptionSpec {
  direction: StudyDirection;
  spacing_ft: number | null;
  beamCount: number | null;
  depthLimit_in: number | null;
  Fy_ksi: number | null;
  /** Composite (true) or bare steel (false) for the region's framing; null = as the plan has it. */
  composite: boolean | null;
}

export type AppliedOption =
  | { ok: true; plan: Plan; beams: number; beamSpacing_ft: number }
  | { ok: false; error: string };

/** Members of the level along the bay edge of constant coordinate c = at, overlapping [from, to]. */
function membersAlongEdge(members: readonly PlanMember[], c: 0 | 1, at: number, from: number, to: number): PlanMember[] {
  const r = 1 - c;
  return members.filter((m) => {
    if (Math.abs(m.start[c] - at) > TOL || Math.abs(m.end[c] - at) > TOL) return false;
    const lo = Math.min(m.start[r], m.end[r]);
    const hi = Math.max(m.start[r], m.end[r]);
    return hi - lo > TOL && lo < to - TOL && hi > from + TOL;
  });
}

/** Beams strictly inside the bay (not on its edges), either way. */
function interiorBeams(members: readonly PlanMember[], b: Bay): PlanMember[] {
  const inside = (p: readonly [number, number]) => p[0] >= b.x0 - TOL && p[0] <= b.x1 + TOL && p[1] >= b.y0 - TOL && p[1] <= b.y1 + TOL;
  const onEdgeLine = (m: PlanMember) =>
    (Math.abs(m.start[0] - m.end[0]) <= TOL && (Math.abs(m.start[0] - b.x0) <= TOL || Math.abs(m.start[0] - b.x1) <= TOL)) ||
    (Math.abs(m.start[1] - m.end[1]) <= TOL && (Math.abs(m.start[1] - b.y0) <= TOL || Math.abs(m.start[1] - b.y1) <= TOL));
  return members.filter((m) => m.kind === 'beam' && inside(m.start) && inside(m.end) && !onEdgeLine(m));
}

/** The level's decks with the part over the bay spanning `span` (decks split at the bay edges). */
function decksWithSpan(plan: Plan, levelId: string, b: Bay, span: StudyDirection, taken: Set<string>): PlanDeck[] {
  const out: PlanDeck[] = [];
  for (const d of plan.decks) {
    if (d.level !== levelId) {
      out.push(d);
      continue;
    }
    const xs = d.polygon.map((p) => p[0]);
    const ys = d.polygon.map((p) => p[1]);
    const disjoint = Math.max(...xs) <= b.x0 + TOL || Math.min(...xs) >= b.x1 - TOL || Math.max(...ys) <= b.y0 + TOL || Math.min(...ys) >= b.y1 - TOL;
    if (disjoint) {
      out.push(d);
      continue;
    }
    const fullyInside = xs.every((x) => x >= b.x0 - TOL && x <= b.x1 + TOL) && ys.every((y) => y >= b.y0 - TOL && y <= b.y1 + TOL);
    if (fullyInside) {
      out.push(d.spanDirection === span ? d : { ...d, spanDirection: span });
      continue;
    }
    const { inside, outside } = splitByRect(d.polygon, b);
    if (!inside) {
      out.push(d);
      continue;
    }
    if (d.spanDirection === span) {
      // Already spans this way over the bay: no need to cut it.
      out.push(d);
      continue;
    }
    outside.forEach((poly, i) => out.push({ ...d, id: i === 0 ? d.id : nextId(plan, `${d.id}.`, taken), polygon: poly }));
    out.push({ ...d, id: outside.length === 0 ? d.id : nextId(plan, `${d.id}.`, taken), polygon: inside, spanDirection: span });
  }
  return out;
}

const withDepthLimit = (m: PlanMember, limit: number | null): PlanMember =>
  limit === null || m.shape !== null ? m : { ...m, maxDepth_in: m.maxDepth_in === null ? limit : Math.min(m.maxDepth_in, limit) };

/** The plan with the option applied to every bay of the region on the level. */
export function applyStudyOption(plan: Plan, levelId: string, bays: readonly Bay[], option: StudyOptionSpec): AppliedOption {
  let p: Plan = option.Fy_ksi === null ? plan : { ...plan, designBasis: { ...plan.designBasis, Fy_ksi: option.Fy_ksi } };
  const d = option.direction;
  // Beams running in y frame into the edges of constant y (girders running in x), and the other way.
  const c: 0 | 1 = d === 'y' ? 1 : 0;
  const deckSpan: StudyDirection = d === 'y' ? 'x' : 'y';
  let beams = 0;
  let beamSpacing_ft = 0;
  const regionIds = new Set<string>();
  for (const b of bays) {
    // 1. Clear the bay of its infill beams, then lay out the option's by the Infill tool's rules.
    const clear = new Set(interiorBeams(p.members.filter((m) => m.level === levelId), b).map((m) => m.id));
    p = { ...p, members: p.members.filter((m) => !clear.has(m.id)) };
    const request = option.beamCount !== null ? { direction: d, count: option.beamCount } : { direction: d, spacing_ft: option.spacing_ft ?? 0 };
    const infill = infillBay(p, levelId, b, request);
    if (!infill.ok) return { ok: false, error: `Bay ${fmt(b.x0)}–${fmt(b.x1)} ft × ${fmt(b.y0)}–${fmt(b.y1)} ft: ${infill.error}` };
    p = applyInfill(p, infill);
    beams += infill.add.length;
    beamSpacing_ft = Math.max(beamSpacing_ft, infill.spacing_ft);
    for (const m of infill.add) regionIds.add(m.id);
    const taken = usedIds(p);

    // 2. Girders on the two edges the beams frame into.
    const level = p.members.filter((m) => m.level === levelId);
    const [from, to] = c === 1 ? [b.x0, b.x1] : [b.y0, b.y1];
    const added: PlanMember[] = [];
    const toGirder = new Set<string>();
    for (const at of c === 1 ? [b.y0, b.y1] : [b.x0, b.x1]) {
      const along = membersAlongEdge(level, c, at, from, to);
      if (along.length === 0) {
        const start: [number, number] = c === 1 ? [from, at] : [at, from];
        const end: [number, number] = c === 1 ? [to, at] : [at, to];
        added.push({ id: nextId(p, 'g', taken), level: levelId, kind: 'girder', start, end, shape: null, maxDepth_in: null });
      } else for (const m of along) toGirder.add(m.id);
    }
    for (const at of c === 1 ? [b.x0, b.x1] : [b.y0, b.y1]) for (const m of membersAlongEdge(level, (1 - c) as 0 | 1, at, c === 1 ? b.y0 : b.x0, c === 1 ? b.y1 : b.x1)) regionIds.add(m.id);
    for (const m of added) regionIds.add(m.id);
    for (const id of toGirder) regionIds.add(id);
    p = { ...p, members: [...p.members.map((m) => (toGirder.has(m.id) && m.kind !== 'girder' ? { ...m, kind: 'girder' as const } : m)), ...added] };

    // 3. The deck over the bay spans across the beams (as the Plan's Deck tool lays it over a bay).
    p = { ...p, decks: decksWithSpan(p, levelId, b, deckSpan, taken) };
  }
  // 4. The depth limit on the region's unlocked framing (infill beams and the bay edges).
  if (option.depthLimit_in !== null) p = { ...p, members: p.members.map((m) => (regionIds.has(m.id) ? withDepthLimit(m, option.depthLimit_in) : m)) };
  // 5. Composite on or off for the region's framing (locked sizes too: composite is a design choice, not a size).
  const composite = option.composite ?? null;
  if (composite !== null) p = { ...p, members: p.members.map((m) => (regionIds.has(m.id) ? { ...m, composite } : m)) };
  return { ok: true, plan: p, beams, beamSpacing_ft };
}

function fmt(v: number): string {
  return String(Math.round(v * 100) / 100);
}
