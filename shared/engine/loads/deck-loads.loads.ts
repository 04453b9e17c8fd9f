/**
 * Area loads of each deck onto the members that carry it (design-basis §1–2): zone
 * pressures times the tributary strip width, as stepped or trapezoidal line loads per
 * load case. Zones change between decks, so a member under two decks gets a stepped load.
 */
import type { Plan, PlanDeck, PlanZone } from '../../schemas/plan.schema';
import { planProblem, type PlanProblem } from '../../schemas/plan-problem.schema';
import { SUPPORT_TOLERANCE_FT, type FramingMember, type FramingTopology } from '../geometry/framing-topology.geometry';
import { deckOverlapProblems } from '../geometry/polygon-overlap.geometry';
import { computeDeckTributary, toDeckFrame, type DeckSupporter, type DeckTributaryResult } from './deck-tributary.loads';
import type { AreaLoad, LoadCase, TakedownLoad } from '../takedown/member-load.takedown';

/** ASCE 7-16 §4.7.3: live loads over 100 psf are not reduced. */
export const MAX_REDUCIBLE_LIVE_PSF = 100;

/** Position along a member that runs across a deck's span, from v in the deck frame. */
export interface MemberAxisInDeck {
  vStart_ft: number;
  sign: 1 | -1;
  span_ft: number;
}

export interface DeckContext {
  deck: PlanDeck;
  zone: PlanZone;
  roof: boolean;
  supporters: DeckSupporter[];
  axes: Map<string, MemberAxisInDeck>;
  tributary: DeckTributaryResult;
}

/** Which pressures of a zone go to which case, and whether §4.7 may reduce them. */
export interface ZonePressure {
  case: LoadCase;
  psf: number;
  reducible: boolean;
  label: string;
}

/**
 * Zone pressures by case. Live is reducible where the zone says so, it is ≤ 100 psf
 * (§4.7.3) and the level is not a roof (roof levels: conservative, no §4.7 reduction).
 * Partitions are live, never reduced (design-basis §1).
 */
export function zonePressures(zone: PlanZone, roof: boolean): ZonePressure[] {
  const out: ZonePressure[] = [];
  const dead = zone.dead_psf + zone.superimposedDead_psf;
  if (dead !== 0) out.push({ case: 'D', psf: dead, reducible: false, label: `dead ${zone.dead_psf} + superimposed ${zone.superimposedDead_psf} psf` });
  if (zone.live_psf !== 0) {
    const reducible = zone.liveReducible && zone.live_psf <= MAX_REDUCIBLE_LIVE_PSF && !roof;
    out.push({ case: 'L', psf: zone.live_psf, reducible, label: `live ${zone.live_psf} psf${reducible ? '' : ', not reducible'}` });
  }
  if (zone.partition_psf !== 0) out.push({ case: 'L', psf: zone.partition_psf, reducible: false, label: `partitions ${zone.partition_psf} psf, not reducible` });
  if (zone.roofLive_psf !== 0) out.push({ case: 'Lr', psf: zone.roofLive_psf, reducible: false, label: `roof live ${zone.roofLive_psf} psf` });
  if (zone.snow_psf !== 0) out.push({ case: 'S', psf: zone.snow_psf, reducible: false, label: `snow ${zone.snow_psf} psf` });
  return out;
}

/** True when the member runs across the deck span (constant u within the tolerance). */
export function runsAcrossSpan(fm: FramingMember, span: 'x' | 'y'): boolean {
  const a = toDeckFrame(fm.start, span);
  const b = toDeckFrame(fm.end, span);
  return Math.abs(a[0] - b[0]) <= SUPPORT_TOLERANCE_FT;
}

export function runsAlongSpan(fm: FramingMember, span: 'x' | 'y'): boolean {
  const a = toDeckFrame(fm.start, span);
  const b = toDeckFrame(fm.end, span);
  return Math.abs(a[1] - b[1]) <= SUPPORT_TOLERANCE_FT;
}

type Box = [number, number, number, number];
function polygonBox(poly: readonly (readonly [number, number])[]): Box {
  const xs = poly.map((p) => p[0]);
  const ys = poly.map((p) => p[1]);
  return [Math.min(...xs), Math.min(...ys), Math.max(...xs), Math.max(...ys)];
}

/** The member's box meets the deck's box grown by padFt (negative: strictly inside by that much). */
function touchesBox(box: Box, fm: FramingMember, padFt: number): boolean {
  return (
    Math.max(fm.start[0], fm.end[0]) >= box[0] - padFt &&
    Math.min(fm.start[0], fm.end[0]) <= box[2] + padFt &&
    Math.max(fm.start[1], fm.end[1]) >= box[1] - padFt &&
    Math.min(fm.start[1], fm.end[1]) <= box[3] + padFt
  );
}

/** Tributary strips of every deck, with the members that carry each. */
export function buildDeckContexts(plan: Plan, topology: FramingTopology): { decks: DeckContext[]; problems: PlanProblem[] } {
  const problems: PlanProblem[] = [];
  const zones = new Map(plan.zones.map((z) => [z.id, z]));
  const roofLevels = new Set(plan.levels.filter((l) => l.roof).map((l) => l.id));
  const membersByLevel = new Map<string, FramingMember[]>();
  for (const fm of topology.members.values()) {
    let list = membersByLevel.get(fm.level);
    if (!list) membersByLevel.set(fm.level, (list = []));
    list.push(fm);
  }
  const decks: DeckContext[] = [];
  plan.decks.forEach((deck, i) => {
    const zone = zones.get(deck.zone);
    if (!zone || deck.polygon.length < 3) return; // reported by the repair step
    const supporters: DeckSupporter[] = [];
    const axes = new Map<string, MemberAxisInDeck>();
    const box = polygonBox(deck.polygon);
    // Deck frame coordinates read in place (as toDeckFrame gives them), no array per member and deck.
    const iu = deck.spanDirection === 'x' ? 0 : 1;
    const iv = 1 - iu;
    for (const fm of membersByLevel.get(deck.level) ?? []) {
      if (!touchesBox(box, fm, SUPPORT_TOLERANCE_FT)) continue;
      const au = fm.start[iu], av = fm.start[iv], bu = fm.end[iu], bv = fm.end[iv];
      if (Math.abs(au - bu) <= SUPPORT_TOLERANCE_FT) {
        supporters.push({ id: fm.id, u_ft: (au + bu) / 2, vMin_ft: Math.min(av, bv), vMax_ft: Math.max(av, bv) });
        axes.set(fm.id, { vStart_ft: av, sign: bv >= av ? 1 : -1, span_ft: fm.span_ft });
      } else if (!(Math.abs(av - bv) <= SUPPORT_TOLERANCE_FT) && touchesBox(box, fm, -SUPPORT_TOLERANCE_FT)) {
        problems.push(
          planProblem('warning', 'member-skew-to-deck', `Member ${fm.id}: at an angle to the span of deck ${deck.id}; it takes no load from that deck (only members square across the span carry deck)`, {
            elementId: fm.id,
          }),
        );
      }
    }
    const openings = plan.openings.filter((o) => o.level === deck.level && o.polygon.length >= 3).map((o) => o.polygon);
    const tributary = computeDeckTributary(deck.polygon, deck.spanDirection, supporters, openings);
    const lost = tributary.unsupported.reduce((s, u) => s + u.area_ft2, 0);
    if (lost > 1e-6) {
      const at = tributary.unsupported[0].at;
      problems.push(
        planProblem('error', 'deck-unsupported', `Deck ${deck.id}: ${lost.toFixed(1)} ft² has no member across its span to bear on (near (${at[0].toFixed(1)}, ${at[1].toFixed(1)}))`, {
          elementId: deck.id,
          path: `decks[${i}]`,
        }),
      );
    }
    decks.push({ deck, zone, roof: roofLevels.has(deck.level), supporters, axes, tributary });
  });
  problems.push(...deckOverlapProblems(plan));
  return { decks, problems };
}

const widthText = (w1: number, w2: number) => (Math.abs(w1 - w2) < 0.005 ? `${w1.toFixed(1)} ft` : `${w1.toFixed(1)}–${w2.toFixed(1)} ft`);

/** Constant-width strips repeat the same few widths: their load sources, one per pressure, by width. */
type SourcesByWidth = Map<number, string[]>;

function stripSources(ctx: DeckContext, pressures: readonly ZonePressure[], w1: number, w2: number, cache: SourcesByWidth): string[] {
  const cached = w1 === w2 ? cache.get(w1) : undefined;
  if (cached) return cached;
  const source = `deck ${ctx.deck.id} zone ${ctx.zone.id}, tributary ${widthText(w1, w2)}`;
  const out: string[] = [];
  for (const p of pressures) out.push(`${source}: ${p.label}`);
  if (w1 === w2) cache.set(w1, out);
  return out;
}

/** True when a line load from w1 to w2 is written as a partial uniform one (equal within rounding). */
const isUniform = (w1: number, w2: number) => Math.abs(w1 - w2) <= 1e-12 * Math.max(1, Math.abs(w1));

/** Member loads from one deck's strips: per zone pressure, a line load over each strip. */
export function deckStripLoads(ctx: DeckContext, sink: (memberId: string, load: TakedownLoad) => void, areaSink: (memberId: string, load: AreaLoad) => void): void {
  const pressures = zonePressures(ctx.zone, ctx.roof);
  const anyReducible = pressures.some((p) => p.reducible);
  const sourcesByWidth: SourcesByWidth = new Map();
  for (const strip of ctx.tributary.strips) {
    const axis = ctx.axes.get(strip.memberId)!;
    const span = axis.span_ft;
    let s1 = Math.min(span, Math.max(0, axis.sign * (strip.v1_ft - axis.vStart_ft)));
    let s2 = Math.min(span, Math.max(0, axis.sign * (strip.v2_ft - axis.vStart_ft)));
    let w1 = strip.width1_ft;
    let w2 = strip.width2_ft;
    if (s2 < s1) {
      const s = s1; s1 = s2; s2 = s;
      const w = w1; w1 = w2; w2 = w;
    }
    if (s2 - s1 <= 1e-9) continue;
    const sources = stripSources(ctx, pressures, w1, w2, sourcesByWidth);
    for (let i = 0; i < pressures.length; i++) {
      const p = pressures[i];
      const a = (w1 * p.psf) / 1000;
      const b = (w2 * p.psf) / 1000;
      let load: TakedownLoad;
      if (isUniform(a, b)) {
        load = p.reducible
          ? { kind: 'partial', w_klf: a, from_ft: s1, to_ft: s2, case: p.case, source: sources[i], reducible: true }
          : { kind: 'partial', w_klf: a, from_ft: s1, to_ft: s2, case: p.case, source: sources[i] };
      } else {
        load = p.reducible
          ? { kind: 'linear', w1_klf: a, w2_klf: b, from_ft: s1, to_ft: s2, case: p.case, source: sources[i], reducible: true }
          : { kind: 'linear', w1_klf: a, w2_klf: b, from_ft: s1, to_ft: s2, case: p.case, source: sources[i] };
      }
      sink(strip.memberId, load);
    }
    const uniformWidth = isUniform(w1, w2);
    areaSink(strip.memberId, uniformWidth ? { kind: 'partial', w_klf: w1, from_ft: s1, to_ft: s2, of: 'all' } : { kind: 'linear', w1_klf: w1, w2_klf: w2, from_ft: s1, to_ft: s2, of: 'all' });
    if (anyReducible) {
      areaSink(strip.memberId, uniformWidth ? { kind: 'partial', w_klf: w1, from_ft: s1, to_ft: s2, of: 'reducibleLive' } : { kind: 'linear', w1_klf: w1, w2_klf: w2, from_ft: s1, to_ft: s2, of: 'reducibleLive' });
    }
  }
}
