/**
 * Composite design of a whole plan (design-basis §6, §6a): which members are composite, the
 * deck and slab over each, its orientation, the effective width from the actual framing
 * (AISC 360-16 I3.1a), and the construction-stage loads from a takedown of the wet slab.
 *
 * The construction stage is a second takedown of the same framing with each deck carrying
 * only its wet concrete and deck (the slab build-up, or the zone's dead_psf where a deck has
 * none) as D and the construction live load as L (not reduced). Point and line loads are left
 * out (walls, equipment and finishes come after the concrete has hardened). A girder's
 * construction loads therefore include the beams' wet reactions, with the beams' self weight.
 */
import type { Plan, PlanDeck, PlanMember, PlanZone } from '../../schemas/plan.schema';
import { effectiveWidthI3_1a } from '../design/aisc360/chapter-i/i3.equations';
import { pointInPolygon, polygonBox, type Point } from '../geometry/polygon.geometry';
import type { FramingMember, FramingTopology } from '../geometry/framing-topology.geometry';
import { slabWeight } from '../loads/slab-weight.loads';
import type { Bracing, CompositeMemberInput } from '../sizing/member-design.types';
import { IN_PER_FT } from '../units/units.constants';

export interface MemberCompositeSite {
  deck: PlanDeck;
  orientation: 'perpendicular' | 'parallel';
  effectiveWidth_in: number;
  basis: string;
}

export type MemberCompositeStatus =
  | { composite: true; site: MemberCompositeSite }
  | { composite: false; reason: string };

/** Whether the plan designs anything composite, or asks total deflection without the pre-composite dead load. */
export function planNeedsWetStage(plan: Plan): boolean {
  const c = plan.designBasis.composite;
  return (
    !!(c?.enabled || plan.members.some((m) => m.composite === true)) || plan.designBasis.totalDeflectionIncludes === 'superimposedDeadAndLive'
  );
}

/** Member follows the design basis unless it says composite true/false. */
export function memberWantsComposite(plan: Plan, m: PlanMember): boolean {
  if (m.composite === true) return true;
  if (m.composite === false) return false;
  return plan.designBasis.composite?.enabled ?? false;
}

/** A polygon with its bounding box, widened past pointInPolygon's edge tolerance (1e-9 ft). */
interface Region<T> { item: T; polygon: readonly Point[]; x0: number; y0: number; x1: number; y1: number }
const BOX_MARGIN_FT = 1e-6;

function regionOf<T>(item: T, polygon: readonly Point[]): Region<T> {
  const [x0, y0, x1, y1] = polygonBox(polygon);
  return { item, polygon, x0: x0 - BOX_MARGIN_FT, y0: y0 - BOX_MARGIN_FT, x1: x1 + BOX_MARGIN_FT, y1: y1 + BOX_MARGIN_FT };
}

/** A point outside the widened box is outside the polygon and off its edges, so the box only skips work. */
const within = <T>(r: Region<T>, p: Point): boolean => p[0] >= r.x0 && p[0] <= r.x1 && p[1] >= r.y0 && p[1] <= r.y1 && pointInPolygon(p, r.polygon);

/**
 * The decks with a slab build-up and the openings of each level, in file order, each with its
 * box: what the slab tests below read, gathered once per plan instead of filtering every deck
 * and opening of the plan at each of a member's sample points.
 */
class SlabIndex {
  private readonly slabDecks = new Map<string, Region<PlanDeck>[]>();
  private readonly openings = new Map<string, Region<null>[]>();

  constructor(plan: Plan) {
    for (const d of plan.decks) {
      if (d.polygon.length < 3 || !d.slab) continue;
      let list = this.slabDecks.get(d.level);
      if (!list) this.slabDecks.set(d.level, (list = []));
      list.push(regionOf(d, d.polygon));
    }
    for (const o of plan.openings) {
      if (o.polygon.length < 3) continue;
      let list = this.openings.get(o.level);
      if (!list) this.openings.set(o.level, (list = []));
      list.push(regionOf(null, o.polygon));
    }
  }

  /** The first deck in file order with a slab build-up over p, or null. */
  slabDeckAt(level: string, p: Point): PlanDeck | null {
    for (const r of this.slabDecks.get(level) ?? []) if (within(r, p)) return r.item;
    return null;
  }

  inOpening(level: string, p: Point): boolean {
    for (const r of this.openings.get(level) ?? []) if (within(r, p)) return true;
    return false;
  }

  /** Slab at p: a deck with a slab build-up and no opening. */
  onSlab(level: string, p: Point): boolean {
    return !this.inOpening(level, p) && this.slabDeckAt(level, p) !== null;
  }
}

/** Distance from the midpoint along ±normal to the first point off the slab (no deck with a slab, or an opening), up to maxFt. */
function slabEdgeDistanceFt(slabs: SlabIndex, level: string, mid: Point, normal: Point, maxFt: number): number | null {
  const on = (t: number): boolean => slabs.onSlab(level, [mid[0] + normal[0] * t, mid[1] + normal[1] * t]);
  const step = 0.5;
  let inside = 0;
  for (let t = 0.05; t <= maxFt + step; t += step) {
    if (!on(t)) {
      // bisection between the last point on the slab and this one
      let a = inside, b = t;
      for (let i = 0; i < 20; i++) {
        const m = (a + b) / 2;
        if (on(m)) a = m; else b = m;
      }
      return a;
    }
    inside = t;
  }
  return null;
}

/** The nearest parallel member on one side whose length spans past the midpoint (ft), or null. */
function nextParallelFt(fm: FramingMember, others: readonly FramingMember[], mid: Point, normal: Point, side: 1 | -1): number | null {
  let best: number | null = null;
  const dir = fm.direction;
  for (const o of others) {
    if (o.id === fm.id) continue;
    const cross = dir[0] * o.direction[1] - dir[1] * o.direction[0];
    if (Math.abs(cross) > 0.01) continue;
    // offset of the other member's line from the midpoint, along the normal
    const off = ((o.start[0] - mid[0]) * normal[0] + (o.start[1] - mid[1]) * normal[1]) * side;
    if (off <= 0.01) continue;
    // the other member must reach the midpoint's position along the axis
    const t0 = (o.start[0] - mid[0]) * dir[0] + (o.start[1] - mid[1]) * dir[1];
    const t1 = (o.end[0] - mid[0]) * dir[0] + (o.end[1] - mid[1]) * dir[1];
    if (Math.min(t0, t1) > 1e-6 || Math.max(t0, t1) < -1e-6) continue;
    if (best === null || off < best) best = off;
  }
  return best;
}

/**
 * Composite status of every member of the plan (composite with its site, or bare with the reason).
 * A member's status is a function of the framing geometry, the decks and openings, the design
 * basis and the member's own `composite` setting; `kept` may give a member's earlier status
 * where the caller knows all of those unchanged (a re-design), and it is used as it is.
 */
export function compositeSites(plan: Plan, topology: FramingTopology, kept?: (fm: FramingMember) => MemberCompositeStatus | undefined): Map<string, MemberCompositeStatus> {
  const out = new Map<string, MemberCompositeStatus>();
  const slabs = new SlabIndex(plan);
  const byLevel = new Map<string, FramingMember[]>();
  for (const fm of topology.members.values()) {
    let l = byLevel.get(fm.level);
    if (!l) byLevel.set(fm.level, (l = []));
    l.push(fm);
  }
  for (const fm of topology.members.values()) {
    const m = fm.member;
    const before = kept?.(fm);
    if (before) {
      out.set(fm.id, before);
      continue;
    }
    if (!memberWantsComposite(plan, m)) {
      out.set(fm.id, { composite: false, reason: m.composite === false ? 'non-composite by the engineer' : 'composite design is off in the design basis' });
      continue;
    }
    const mid: Point = [(fm.start[0] + fm.end[0]) / 2, (fm.start[1] + fm.end[1]) / 2];
    const normal: Point = [-fm.direction[1], fm.direction[0]];
    let deck: PlanDeck | null = null;
    for (const s of [1, -1] as const) {
      const p: Point = [mid[0] + normal[0] * 0.1 * s, mid[1] + normal[1] * 0.1 * s];
      deck ??= slabs.slabDeckAt(fm.level, p);
    }
    if (!deck) {
      out.set(fm.id, { composite: false, reason: 'no deck with a slab build-up over the member: designed bare steel' });
      continue;
    }
    const alongX = Math.abs(fm.direction[0]) >= Math.abs(fm.direction[1]);
    const orientation = (deck.spanDirection === 'x') === alongX ? 'parallel' : 'perpendicular';
    const spanIn = fm.span_ft * IN_PER_FT;
    const sides = ([1, -1] as const).map((s) => {
      const dir: Point = [normal[0] * s, normal[1] * s];
      const next = nextParallelFt(fm, byLevel.get(fm.level) ?? [], mid, normal, s);
      const edge = slabEdgeDistanceFt(slabs, fm.level, mid, dir, fm.span_ft / 8);
      return { toNextBeamIn: next === null ? null : next * IN_PER_FT, toEdgeIn: edge === null ? null : edge * IN_PER_FT };
    });
    const w = effectiveWidthI3_1a(spanIn, sides);
    if (w.bIn <= 0) {
      out.set(fm.id, { composite: false, reason: 'no slab beside the member (effective width 0): designed bare steel' });
      continue;
    }
    const basis = `Effective width b = ${w.perSideIn.map((v, i) => `${v.toFixed(1)} in (${w.governs[i]})`).join(' + ')} = ${w.bIn.toFixed(1)} in (AISC 360-16 I3.1a, measured at mid-span from the framing, slab edges and openings)`;
    out.set(fm.id, { composite: true, site: { deck, orientation, effectiveWidth_in: w.bIn, basis } });
  }
  return out;
}

/** The wet-concrete plan: the same framing, each deck carrying its wet slab and deck (D) and the construction live (L). */
export function wetStagePlan(plan: Plan): Plan {
  const zones = new Map(plan.zones.map((z) => [z.id, z]));
  const constructionLive = plan.designBasis.composite?.constructionLive_psf ?? 20;
  const wetZones: PlanZone[] = [];
  const decks = plan.decks.map((d) => {
    const z = zones.get(d.zone);
    const dead = d.slab ? slabWeight(d.slab).total_psf : z?.dead_psf ?? 0;
    const id = `wet-${d.id}`;
    wetZones.push({
      id, name: `${d.id} wet concrete and construction live`, dead_psf: dead, superimposedDead_psf: 0,
      partition_psf: d.slab || z ? constructionLive : 0, live_psf: 0, liveReducible: false, roofLive_psf: 0, snow_psf: 0,
    });
    // the slab weight is in dead_psf above; no slab here so the takedown does not use it twice
    return { id: d.id, level: d.level, polygon: d.polygon, spanDirection: d.spanDirection, zone: id };
  });
  return { ...plan, zones: wetZones, decks, pointLoads: [], lineLoads: [] };
}

/** The composite part of a member's design input. */
export function compositeMemberInput(plan: Plan, site: MemberCompositeSite, constructionLoads: CompositeMemberInput['constructionLoads'], framingPoints_ft: number[], studs: number | null): CompositeMemberInput {
  const c = plan.designBasis.composite;
  const bracing: Bracing = site.orientation === 'perpendicular' ? 'continuous' : framingPoints_ft.length > 0 ? { points_ft: framingPoints_ft.slice() } : 'none';
  return {
    // A copy: results (and a later re-design reusing them) never hold the plan's own objects.
    slab: { ...site.deck.slab! },
    effectiveWidth_in: site.effectiveWidth_in,
    deckOrientation: site.orientation,
    studsPerRib: 1,
    studs,
    shored: c?.shored ?? false,
    constructionLoads,
    constructionBracing: bracing,
    studDiameter_in: c?.studDiameter_in ?? 0.75,
    studFu_ksi: c?.studFu_ksi ?? 65,
    minPercentComposite: c?.minPercentComposite ?? 0.25,
    camber: c?.camber ?? true,
    studEquivalentWeight_lb: c?.studEquivalentWeight_lb ?? 10,
    effectiveWidthBasis: site.basis,
  };
}
