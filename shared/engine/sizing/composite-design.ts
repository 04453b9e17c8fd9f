/**
 * Composite beam design (AISC 360-16 Chapter I; design-basis §6, §6a): a simple-span W-shape
 * with steel headed stud anchors under a concrete slab on fluted deck.
 *
 * - Final stage: positive flexure of the composite section from the plastic stress distribution
 *   (I3.2a) with partial composite action (C = min(0.85 f'c Ac, Fy As, ΣQn), I3.2d), checked at
 *   every critical section with the studs between that section and the nearer support (studs
 *   uniformly spaced, so a concentrated load from a beam framing in gets the studs between it and
 *   each support); shear on the steel alone (G2.1); live and superimposed deflection on the
 *   lower-bound moment of inertia (Commentary Eq. C-I3-1).
 * - Construction stage (unshored): the bare steel carries wet concrete, deck, self weight and
 *   the construction live load (LRFD 1.2D + 1.6Lc, ASD D + Lc, common practice), braced by the
 *   deck where its ribs cross the beam; the pre-composite dead-load deflection sets the camber
 *   (common practice, camber.serviceability.ts). Shored: all loads on the composite section,
 *   no construction check on the steel and no camber.
 * - Selection: the lightest shape counting each stud as a steel-equivalent weight (a project
 *   setting, common practice about 10 lb), then the fewest studs, then the shallower shape;
 *   a locked shape designs studs only; a locked stud count is checked.
 */
import { compositePlasticFlexure, lowerBoundInertia, type CompositeConcrete, type CompositeFlexure, type CompositeSteel } from '../design/aisc360/chapter-i/i3';
import { concreteModulusKsi } from '../design/aisc360/chapter-i/i3.equations';
import { eqI8_1, rgRpI8_2a, spacingLimitsI8_2d, studAreaIn2 } from '../design/aisc360/chapter-i/i8.equations';
import { nominalFlexure, shapeConstantsFor, type WShapeConstants } from '../design/aisc360/w-shape-constants';
import { CAMBER_BASIS, camberIn } from '../design/serviceability/camber.serviceability';
import { DEFLECTION_CLAUSE, deflectionIn, deflectionLimitIn, deflectionRatio } from '../design/serviceability/deflection.serviceability';
import { deflectionEIKipFt3, toSpanLoading } from '../analysis/simple-span.analysis';
import { IN_PER_FT } from '../units/units.constants';
import { buildMemberContext, maxMomentOfCombination, refinedMax, type MemberContext } from './member-context';
import type { CheckName, CompositeMemberInput, CompositeResult, MemberCheck, MemberDesignInput, MemberDesignResult } from './member-design.types';
import { MemberInputError } from './member-input.validation';
import { buildMemberResult, describeGoverning } from './member-result.builder';
import { availableFlexure, evaluateShape, type ShapeEvaluation } from './shape-evaluation';

/**
 * Project defaults: 3/4 in. studs (the largest I3.2c allows through deck); stud Fu 65 ksi (AWS
 * D1.1 Type B headed studs, recalled from memory); at least 25 % composite and about 10 lb of
 * steel a stud (common practice, design basis §6); one stud per rib.
 */
export const COMPOSITE_DEFAULTS = {
  studDiameter_in: 0.75,
  studFu_ksi: 65,
  minPercentComposite: 0.25,
  studsPerRib: 1,
  studEquivalentWeight_lb: 10,
} as const;

export const COMPOSITE_STANDARDS_NOTE =
  'AISC 360-16 Chapter I (I3.1a, I3.2a, I3.2d, I8.1, I8.2a, I8.2d) and Commentary Eq. C-I3-1; construction stage, minimum composite and camber by common practice.';

/** Everything about the member that does not depend on the shape. */
export interface CompositeSetup {
  input: MemberDesignInput;
  c: CompositeMemberInput;
  ctx: MemberContext;
  ctxC: MemberContext | null;
  spanIn: number;
  studDiameterIn: number;
  studsPerRib: number;
  concrete: CompositeConcrete;
  ecKsi: number;
  qn: ReturnType<typeof eqI8_1>;
  rgRp: ReturnType<typeof rgRpI8_2a>;
  spacing: { minIn: number; maxIn: number };
  /** Most studs that fit (ribs × studs per rib, or 6d spacing), even. */
  maxStuds: number;
  /** Fewest studs for the maximum spacing of I8.2d, even. */
  minStudsSpacing: number;
  minPercent: number;
  studWeightLb: number;
  shored: boolean;
  camber: boolean;
  /** EI·y (kip·ft³) at the deflection stations of the pre-composite dead loads without self weight. */
  preEI: number[];
  totalIncludes: 'deadAndLive' | 'superimposedDeadAndLive';
  notes: string[];
}

export interface CompositeEvaluation {
  k: WShapeConstants;
  studs: number;
  ev: ShapeEvaluation;
  evC: ShapeEvaluation | null;
  flex: CompositeFlexure;
  /** Governing section: combination, location, demand and capacity. */
  mrKipFt: number;
  mcKipFt: number;
  mnKipFt: number;
  atFt: number;
  combo: number;
  studsToSection: number;
  ratioFlexure: number;
  ratioConstruction: number;
  ratioStuds: number;
  minStuds: number;
  ilbIn4: number;
  yEnaIn: number;
  deflLiveIn: number;
  deflTotalIn: number;
  deflTotalAtFt: number;
  deflPreIn: number;
  ratioLive: number | null;
  ratioTotal: number | null;
  camberIn: number;
  ratio: number;
  governing: CheckName;
  passes: boolean;
  equivalentWeightLb: number;
}

const even = (n: number) => 2 * Math.ceil(n / 2 - 1e-9);
const evenDown = (n: number) => 2 * Math.floor(n / 2 + 1e-9);

function problem(field: string, message: string): never {
  throw new MemberInputError(`composite.${field}: ${message}`, [`composite.${field}: ${message}`]);
}

/** Checks the composite part of the input; bad values name the field. */
export function assertValidCompositeInput(c: CompositeMemberInput): void {
  const s = c.slab;
  if (!s || typeof s !== 'object') problem('slab', 'required (rib height, topping, rib width and spacing, concrete weight, f\'c, deck weight)');
  for (const key of ['ribHeight_in', 'toppingThickness_in', 'ribAvgWidth_in', 'ribSpacing_in', 'concreteWeight_pcf', 'fc_ksi'] as const) {
    if (!(typeof s[key] === 'number' && Number.isFinite(s[key]) && s[key] > 0)) problem(`slab.${key}`, 'must be a positive number');
  }
  if (!(typeof s.deckWeight_psf === 'number' && s.deckWeight_psf >= 0)) problem('slab.deckWeight_psf', 'must be a number ≥ 0');
  if (s.ribAvgWidth_in > s.ribSpacing_in) problem('slab.ribAvgWidth_in', 'must not exceed ribSpacing_in');
  if (!(typeof c.effectiveWidth_in === 'number' && c.effectiveWidth_in > 0)) problem('effectiveWidth_in', 'must be a positive number');
  if (c.deckOrientation !== 'perpendicular' && c.deckOrientation !== 'parallel') problem('deckOrientation', 'must be "perpendicular" or "parallel"');
  if (c.studs != null && !(Number.isInteger(c.studs) && c.studs >= 0)) problem('studs', 'must be a whole number ≥ 0 or null');
  if (c.studsPerRib != null && !(Number.isInteger(c.studsPerRib) && c.studsPerRib >= 1 && c.studsPerRib <= 3)) problem('studsPerRib', 'must be 1, 2 or 3');
  if (!Array.isArray(c.constructionLoads)) problem('constructionLoads', 'must be a list of loads (as in "loads")');
  if (c.minPercentComposite != null && !(c.minPercentComposite >= 0 && c.minPercentComposite <= 1)) problem('minPercentComposite', 'must be between 0 and 1');
  if (c.studDiameter_in != null && !(c.studDiameter_in > 0 && c.studDiameter_in <= 1)) problem('studDiameter_in', 'must be between 0 and 1 in');
}

export function compositeSetup(input: MemberDesignInput): CompositeSetup {
  const c = input.composite!;
  assertValidCompositeInput(c);
  const s = c.slab;
  const notes: string[] = [];
  const L = input.span_ft;
  const spanIn = L * IN_PER_FT;
  const shored = c.shored ?? false;
  const totalIncludes = input.totalDeflectionIncludes ?? 'deadAndLive';
  // The bare-steel context of the final loads (flexure demand, shear, live deflection EI).
  const ctx = buildMemberContext({ ...input, composite: null, preCompositeDead: null, totalDeflectionIncludes: 'deadAndLive' });
  const orientation = c.deckOrientation;
  const constructionBracing = c.constructionBracing ?? (orientation === 'perpendicular' ? 'continuous' : input.bracing === 'continuous' ? 'none' : input.bracing);
  const ctxC = shored
    ? null
    : buildMemberContext({
      span_ft: L, loads: c.constructionLoads, bracing: constructionBracing, method: input.method, Fy_ksi: input.Fy_ksi,
      deflectionLimits: { live: null, total: null }, includeSelfWeight: input.includeSelfWeight, Lb_override_ft: null,
    });
  const ecKsi = concreteModulusKsi(s.concreteWeight_pcf, s.fc_ksi);
  const b = c.effectiveWidth_in;
  // I3.2c: with ribs perpendicular only the concrete above the deck counts; parallel ribs count by their average width.
  const acIn2 = orientation === 'perpendicular'
    ? b * s.toppingThickness_in
    : b * s.toppingThickness_in + b * (s.ribAvgWidth_in / s.ribSpacing_in) * s.ribHeight_in;
  const concrete: CompositeConcrete = {
    bIn: b, acIn2, fcKsi: s.fc_ksi, slabTopToSteelIn: s.ribHeight_in + s.toppingThickness_in,
    compressibleDepthIn: orientation === 'perpendicular' ? s.toppingThickness_in : s.toppingThickness_in + s.ribHeight_in,
    // Parallel ribs: a block deeper than the topping continues at the ribs' own width (i3.ts concreteBlock).
    ...(orientation !== 'perpendicular' ? { ribs: { toppingIn: s.toppingThickness_in, widthFraction: s.ribAvgWidth_in / s.ribSpacing_in } } : {}),
  };
  if (orientation === 'parallel') {
    notes.push('Ribs parallel: concrete below the top of the deck counted by the average rib width (AISC 360-16 I3.2c).');
  }
  if (s.ribHeight_in > 3) notes.push(`Rib height ${s.ribHeight_in} in exceeds 3 in (AISC 360-16 I3.2c(1)); outside the rules of I3.2c.`);
  if (s.toppingThickness_in < 2) notes.push(`Topping ${s.toppingThickness_in} in is less than 2 in (AISC 360-16 I3.2c(1)).`);
  const studDiameterIn = c.studDiameter_in ?? COMPOSITE_DEFAULTS.studDiameter_in;
  const studsPerRib = orientation === 'perpendicular' ? c.studsPerRib ?? COMPOSITE_DEFAULTS.studsPerRib : 1;
  const rgRp = rgRpI8_2a(orientation, studsPerRib, s.ribAvgWidth_in, s.ribHeight_in, c.emidHt_in ?? null);
  const qn = eqI8_1(studAreaIn2(studDiameterIn), s.fc_ksi, ecKsi, rgRp.rg, rgRp.rp, c.studFu_ksi ?? COMPOSITE_DEFAULTS.studFu_ksi);
  const spacing = spacingLimitsI8_2d(studDiameterIn, s.ribHeight_in + s.toppingThickness_in);
  let maxStuds: number;
  let minStudsSpacing: number;
  if (orientation === 'perpendicular') {
    const ribs = Math.floor(spanIn / s.ribSpacing_in + 1e-9);
    maxStuds = evenDown(ribs * studsPerRib);
    // Studs no farther apart than the maximum: at least one rib in every maxIn (ribs at their spacing).
    const everyNthRib = Math.max(1, Math.floor(spacing.maxIn / s.ribSpacing_in + 1e-9));
    minStudsSpacing = even(Math.ceil(ribs / everyNthRib));
  } else {
    maxStuds = evenDown(Math.floor(spanIn / spacing.minIn + 1e-9));
    minStudsSpacing = even(Math.ceil(spanIn / spacing.maxIn - 1e-9));
  }
  const pre = c.constructionLoads.filter((l) => l.case === 'D');
  const preS = toSpanLoading(L, pre);
  const preEI = ctx.deflX.map((x) => deflectionEIKipFt3(preS, x));
  return {
    input, c, ctx, ctxC, spanIn, studDiameterIn, studsPerRib, concrete, ecKsi, qn, rgRp, spacing, maxStuds, minStudsSpacing,
    minPercent: c.minPercentComposite ?? COMPOSITE_DEFAULTS.minPercentComposite,
    studWeightLb: c.studEquivalentWeight_lb ?? COMPOSITE_DEFAULTS.studEquivalentWeight_lb,
    shored, camber: c.camber ?? true, preEI, totalIncludes, notes,
  };
}

export function steelOf(k: WShapeConstants): CompositeSteel {
  const s = k.shape;
  return { asIn2: s.A_in2, dIn: s.d_in, bfIn: s.bf_in, tfIn: s.tf_in, twIn: s.tw_in, ixIn4: s.Ix_in4, zxIn3: s.Zx_in3, fyKsi: k.fyKsi };
}

/** Fewest studs for the minimum percentage of composite (common practice), even. */
function minStudsPercent(st: CompositeSetup, steel: CompositeSteel): number {
  const full = Math.min(0.85 * st.concrete.fcKsi * st.concrete.acIn2, steel.fyKsi * steel.asIn2);
  return even(Math.ceil((2 * st.minPercent * full) / st.qn.qnKip - 1e-9) / 1);
}

/** Every check of one shape with N studs (total on the member, half each side of mid-span). */
export function evaluateComposite(st: CompositeSetup, k: WShapeConstants, studs: number, base?: { ev: ShapeEvaluation; evC: ShapeEvaluation | null }): CompositeEvaluation {
  const { ctx, input } = st;
  const method = input.method;
  const L = input.span_ft;
  const ev = base?.ev ?? evaluateShape(ctx, k, false);
  const evC = base ? base.evC : st.ctxC ? evaluateShape(st.ctxC, k, false) : null;
  const steel = steelOf(k);
  const wKlf = input.includeSelfWeight ? k.weightKlf : 0;
  const qn = st.qn.qnKip;
  // Flexure at every critical section, studs between the section and the nearer support.
  let ratioFlexure = -1, mr = 0, mc = 0, mn = 0, atFt = 0, comboIdx = 0, studsTo = 0;
  let flexAt: CompositeFlexure | null = null;
  const mnCache = new Map<number, CompositeFlexure>();
  const flexFor = (n: number) => {
    let f = mnCache.get(n);
    if (!f) mnCache.set(n, (f = compositePlasticFlexure(steel, st.concrete, n * qn)));
    return f;
  };
  const consider = (ci: number, x: number, m: number) => {
    if (m <= 0) return;
    const n = Math.floor((studs * Math.min(x, L - x)) / L + 1e-9);
    const f = flexFor(n);
    const mnKipFt = f.mnKipIn / IN_PER_FT;
    const mcKipFt = availableFlexure(method, mnKipFt);
    const r = m / mcKipFt;
    if (r > ratioFlexure) { ratioFlexure = r; mr = m; mc = mcKipFt; mn = mnKipFt; atFt = x; comboIdx = ci; studsTo = n; flexAt = f; }
  };
  for (let ci = 0; ci < ctx.combos.length; ci++) {
    const cd = ctx.combos[ci];
    const ws = cd.fD * wKlf;
    const mx = maxMomentOfCombination(ctx, cd, ws);
    consider(ci, mx.xFt, mx.mKipFt);
    for (let i = 0; i < ctx.xs.length; i++) consider(ci, ctx.xs[i], cd.m[i] + ws * ctx.m1[i]);
  }
  const half = flexFor(Math.floor(studs / 2));
  if (flexAt === null) flexAt = half;
  // Deflection on the lower-bound I with the studs of a half span (C-I3-1).
  const lb = lowerBoundInertia(steel, st.concrete, Math.floor(studs / 2) * qn, half.y2In);
  const lim = input.deflectionLimits;
  const deflLiveIn = deflectionIn(ctx.liveMaxEI, lb.ilbIn4);
  const n = ctx.deflX.length;
  const yPost: number[] = new Array(n);
  const yTot: number[] = new Array(n);
  let deflPreIn = 0;
  for (let i = 0; i < n; i++) {
    const all = ctx.deflTotalBase[i] + wKlf * ctx.deflUnit[i];
    const preEI = st.shored ? 0 : st.preEI[i] + wKlf * ctx.deflUnit[i];
    const pre = deflectionIn(preEI, k.ixIn4);
    if (pre > deflPreIn) deflPreIn = pre;
    const post = deflectionIn(all - preEI, lb.ilbIn4);
    yPost[i] = post;
    yTot[i] = st.totalIncludes === 'superimposedDeadAndLive' ? post : pre + post;
  }
  const tot = refinedMax(yTot, ctx.deflX);
  const ratioLive = deflectionRatio(deflLiveIn, L, lim.live);
  const ratioTotal = deflectionRatio(tot.value, L, lim.total);
  const ratioConstruction = evC ? Math.max(evC.flexure.ratio, evC.ratioShear) : 0;
  const minStuds = Math.max(minStudsPercent(st, steel), st.minStudsSpacing);
  const ratioStuds = Math.max(studs > 0 ? minStuds / studs : Infinity, st.maxStuds > 0 ? studs / st.maxStuds : Infinity);
  let ratio = ratioFlexure;
  let governing: CheckName = 'flexure';
  const take = (r: number | null, name: CheckName) => { if (r !== null && r > ratio) { ratio = r; governing = name; } };
  take(ev.ratioShear, 'shear');
  take(ratioLive, 'deflectionLive');
  take(ratioTotal, 'deflectionTotal');
  take(ratioConstruction, 'construction');
  // The stud count sits at its minimum in most designs (ratio 1.0): a detailing limit, so it
  // governs only when it is not met.
  take(ratioStuds > 1 + 1e-12 ? ratioStuds : null, 'studs');
  const camber = st.camber && !st.shored ? camberIn(deflPreIn) : 0;
  return {
    k, studs, ev, evC, flex: flexAt, mrKipFt: mr, mcKipFt: mc, mnKipFt: mn, atFt, combo: comboIdx, studsToSection: studsTo,
    ratioFlexure, ratioConstruction, ratioStuds, minStuds, ilbIn4: lb.ilbIn4, yEnaIn: lb.yEnaIn,
    deflLiveIn, deflTotalIn: tot.value, deflTotalAtFt: tot.at, deflPreIn, ratioLive, ratioTotal, camberIn: camber,
    ratio, governing, passes: k.webCompact && ratio <= 1 + 1e-12,
    equivalentWeightLb: k.weightPlf * L + studs * st.studWeightLb,
  };
}

/** Fewest studs (even) with which the shape passes, or null. Mn and I_LB never fall as ΣQn rises, so the search is a bisection. */
export function fewestStuds(st: CompositeSetup, k: WShapeConstants): CompositeEvaluation | null {
  const base = { ev: evaluateShape(st.ctx, k, false), evC: st.ctxC ? evaluateShape(st.ctxC, k, false) : null };
  if (!k.webCompact || base.ev.ratioShear > 1 || (base.evC && Math.max(base.evC.flexure.ratio, base.evC.ratioShear) > 1)) return null;
  const steel = steelOf(k);
  let lo = Math.max(minStudsPercent(st, steel), st.minStudsSpacing, 2);
  let hi = st.maxStuds;
  if (lo > hi) return null;
  const top = evaluateComposite(st, k, hi, base);
  if (!top.passes) return null;
  let best = top;
  while (lo < hi) {
    const m = lo + 2 * Math.floor((hi - lo) / 4);
    const e = evaluateComposite(st, k, m, base);
    if (e.passes) { best = e; hi = m; } else lo = m + 2;
  }
  return best;
}

/** Selection: lightest counting studs at their steel-equivalent weight, then fewest studs, then shallower. */
export function selectComposite(st: CompositeSetup, candidates: readonly WShapeConstants[]): CompositeEvaluation | null {
  let best: CompositeEvaluation | null = null;
  const L = st.input.span_ft;
  for (const k of candidates) {
    if (best && k.weightPlf * L > best.equivalentWeightLb + 1e-9) break;
    const e = fewestStuds(st, k);
    if (!e) continue;
    if (
      !best ||
      e.equivalentWeightLb < best.equivalentWeightLb - 1e-9 ||
      (Math.abs(e.equivalentWeightLb - best.equivalentWeightLb) <= 1e-9 && (e.studs < best.studs || (e.studs === best.studs && k.dIn < best.k.dIn)))
    ) best = e;
  }
  return best;
}

/** The full result of one composite evaluation: the bare-steel result with the composite checks in place of flexure and deflection. */
export function buildCompositeResult(st: CompositeSetup, e: CompositeEvaluation, locked: boolean): MemberDesignResult {
  const { input, ctx, c } = st;
  const k = e.k;
  const result = buildMemberResult(ctx, evaluateShape(ctx, k, true), locked);
  const lrfd = input.method === 'LRFD';
  const factor = lrfd ? { phi: 0.9 } : { omega: 1.67 };
  const f = e.flex;
  const comboName = ctx.combos[e.combo]?.combo.name ?? '';
  const flexure: MemberCheck = {
    name: 'flexure', clause: 'AISC 360-16 I3.2a', equation: 'plastic stress distribution, C = min(0.85 f′c Ac, Fy As, ΣQn) (I3.2d)',
    combination: comboName, demand: e.mrKipFt, capacity: e.mcKipFt, ratio: e.ratioFlexure, unit: 'kip-ft',
    limitState: `composite plastic moment, PNA in the ${f.pna}`, method: input.method, ...factor,
    from_ft: 0, to_ft: input.span_ft, Lb_ft: 0, Cb: 1, Mp_kipft: k.mpKipFt, Mn_kipft: e.mnKipFt, at_ft: e.atFt,
  };
  const spanFt = input.span_ft;
  const lim = input.deflectionLimits;
  const checks: MemberCheck[] = [flexure, result.checks.find((x) => x.name === 'shear')!];
  if (lim.live != null) {
    checks.push({
      name: 'deflectionLive', clause: `${DEFLECTION_CLAUSE}; I_LB by AISC 360-16 Commentary Eq. C-I3-1`, equation: `Δ ≤ L/${lim.live}`,
      combination: ctx.liveCase ?? 'L', demand: e.deflLiveIn, capacity: deflectionLimitIn(spanFt, lim.live), ratio: e.ratioLive!,
      unit: 'in', limit_n: lim.live, loadCase: ctx.liveCase ?? 'none', Ix_in4: e.ilbIn4, at_ft: ctx.liveMaxAtFt,
    });
  }
  if (lim.total != null) {
    const what = st.totalIncludes === 'superimposedDeadAndLive'
      ? 'superimposed dead + live on I_LB (the camber takes out the pre-composite dead load)'
      : st.shored ? 'all loads on I_LB (shored)' : 'pre-composite dead on the bare steel + superimposed dead + live on I_LB; no credit for camber';
    checks.push({
      name: 'deflectionTotal', clause: `${DEFLECTION_CLAUSE}; I_LB by AISC 360-16 Commentary Eq. C-I3-1`, equation: `Δ ≤ L/${lim.total}`,
      combination: what, demand: e.deflTotalIn, capacity: deflectionLimitIn(spanFt, lim.total), ratio: e.ratioTotal!,
      unit: 'in', limit_n: lim.total, loadCase: what, Ix_in4: e.ilbIn4, at_ft: e.deflTotalAtFt,
    });
  }
  let construction: CompositeResult['construction'];
  if (e.evC && st.ctxC) {
    const fc = e.evC.flexure;
    const seg = st.ctxC.segments[fc.segment];
    const nf = nominalFlexure(k, seg.lbFt, fc.cb);
    construction = {
      Mr_kipft: fc.mrKipFt, Mc_kipft: fc.mcKipFt, ratio: e.ratioConstruction, deflection_in: e.deflPreIn, Lb_ft: seg.lbFt, Cb: fc.cb,
      combination: st.ctxC.combos[fc.combo].combo.name, clause: nf.clause, shearRatio: e.evC.ratioShear,
    };
    checks.push({
      name: 'construction', clause: nf.clause, equation: `${nf.equation} on the bare steel, wet concrete + deck + self weight + construction live (common practice)`,
      combination: construction.combination, demand: fc.mrKipFt, capacity: fc.mcKipFt, ratio: e.ratioConstruction, unit: 'kip-ft',
      limitState: nf.limitState, method: input.method, ...factor, Lb_ft: seg.lbFt, Cb: fc.cb, Mn_kipft: fc.mnKipFt, Mp_kipft: k.mpKipFt,
    });
  } else {
    construction = { Mr_kipft: 0, Mc_kipft: 0, ratio: 0, deflection_in: 0, Lb_ft: 0, Cb: 1, combination: 'shored', clause: 'shored: not checked on the bare steel', shearRatio: 0 };
  }
  checks.push({
    name: 'studs', clause: 'AISC 360-16 I8.2d; minimum composite by common practice', equation: `N ≥ max(${Math.round(st.minPercent * 100)} % composite, spacing ≤ ${st.spacing.maxIn.toFixed(1)} in); N ≤ ${st.maxStuds} that fit`,
    combination: '-', demand: e.minStuds, capacity: e.studs, ratio: e.ratioStuds, unit: 'count',
  });
  const steel = steelOf(k);
  const full = Math.min(f.cConcreteKip, f.cSteelKip);
  const half = Math.floor(e.studs / 2);
  const composite: CompositeResult = {
    studs: e.studs,
    percentComposite: full > 0 ? Math.min(1, (half * st.qn.qnKip) / full) : 0,
    Qn_kip: st.qn.qnKip,
    sumQn_kip: half * st.qn.qnKip,
    Y2_in: f.y2In,
    PNA: f.pna,
    Mn_kipft: e.mnKipFt,
    Mc_kipft: e.mcKipFt,
    Ilb_in4: e.ilbIn4,
    deflectionLive_in: e.deflLiveIn,
    construction,
    camber_in: e.camberIn,
    effectiveWidth_in: c.effectiveWidth_in,
    deckOrientation: c.deckOrientation,
    studsPerRib: st.studsPerRib,
    studDiameter_in: st.studDiameterIn,
    Ec_ksi: st.ecKsi,
    Ac_in2: st.concrete.acIn2,
    a_in: f.aIn,
    slabDepth_in: st.concrete.slabTopToSteelIn,
    C_kip: f.cKip,
    Cconcrete_kip: f.cConcreteKip,
    Csteel_kip: f.cSteelKip,
    Cgoverns: f.governsC,
    PNA_depth_in: f.ypIn,
    Rg: st.rgRp.rg,
    Rp: st.rgRp.rp,
    RgRpBasis: st.rgRp.basis,
    QnConcrete_kip: st.qn.concreteKip,
    QnAnchor_kip: st.qn.steelKip,
    minStuds: e.minStuds,
    maxStuds: st.maxStuds,
    spacing_in: e.studs > 0 ? st.spanIn / e.studs : 0,
    spacingLimits_in: { min: st.spacing.minIn, max: st.spacing.maxIn },
    minPercentComposite: st.minPercent,
    Yena_in: e.yEnaIn,
    shored: st.shored,
    camberBasis: st.shored ? 'shored: no camber' : st.camber ? CAMBER_BASIS : 'camber turned off in the design basis',
    preCompositeDeflection_in: e.deflPreIn,
    deflectionTotal_in: e.deflTotalIn,
    totalDeflectionIncludes: st.totalIncludes,
    criticalSection_ft: e.atFt,
    studsToCriticalSection: e.studsToSection,
    equivalentWeight_lb: e.equivalentWeightLb,
    notes: [...st.notes, ...(c.effectiveWidthBasis ? [c.effectiveWidthBasis] : [])],
  };
  void steel;
  result.passes = e.passes;
  result.governing = e.governing;
  result.ratio = e.ratio;
  result.Mr_kipft = e.mrKipFt;
  result.Mc_kipft = e.mcKipFt;
  result.Mn_kipft = e.mnKipFt;
  result.Lb_ft = 0;
  result.Cb = 1;
  result.deflectionLive_in = e.deflLiveIn;
  result.deflectionTotal_in = e.deflTotalIn;
  result.ratios = { flexure: e.ratioFlexure, shear: e.ev.ratioShear, deflectionLive: e.ratioLive, deflectionTotal: e.ratioTotal };
  result.checks = checks;
  result.segments = [{ from_ft: 0, to_ft: spanFt, Lb_ft: 0, Cb: 1, combination: comboName, Mr_kipft: e.mrKipFt, Mc_kipft: e.mcKipFt, Mn_kipft: e.mnKipFt, ratio: e.ratioFlexure }];
  result.governingCombination = comboName;
  result.composite = composite;
  result.standards = [...result.standards, COMPOSITE_STANDARDS_NOTE];
  return result;
}

/** Composite design of a simple span: locked shape → studs designed (or a locked count checked); else selection. */
export function designCompositeMember(input: MemberDesignInput, candidates: () => readonly WShapeConstants[]): MemberDesignResult {
  const st = compositeSetup(input);
  const lockedStuds = input.composite!.studs ?? null;
  const fixed = (k: WShapeConstants, locked: boolean): MemberDesignResult => {
    const e = lockedStuds !== null ? evaluateComposite(st, k, lockedStuds) : fewestStuds(st, k) ?? evaluateComposite(st, k, Math.max(2, st.maxStuds));
    const result = buildCompositeResult(st, e, locked);
    if (!result.passes) {
      result.failure = `${locked ? 'Locked shape ' : ''}${k.label} with ${e.studs} studs does not pass: ratio ${result.ratio.toFixed(3)}, ${describeGoverning(result)}.`;
    }
    return result;
  };
  if (input.shape) return fixed(shapeConstantsFor(input.shape, input.Fy_ksi)!, true);
  const list = candidates();
  if (lockedStuds !== null) {
    // A locked stud count on a shape the engine selects: the lightest shape that passes with it.
    for (const k of list) {
      if (!k.webCompact) continue;
      const e = evaluateComposite(st, k, lockedStuds);
      if (e.passes) return buildCompositeResult(st, e, false);
    }
  } else {
    const chosen = selectComposite(st, list);
    if (chosen) return buildCompositeResult(st, chosen, false);
  }
  // Nothing passes: the candidate with the lowest ratio at the most studs that fit.
  let best: CompositeEvaluation | null = null;
  for (const k of list) {
    if (!k.webCompact) continue;
    const e = evaluateComposite(st, k, lockedStuds ?? Math.max(2, st.maxStuds));
    if (!best || e.ratio < best.ratio) best = e;
  }
  if (!best) throw new MemberInputError('no permitted shape', [`Fy_ksi: no candidate W-shape has a compact web at ${input.Fy_ksi} ksi`]);
  const result = buildCompositeResult(st, best, false);
  result.passes = false;
  result.failure = `No W-shape passes composite. Best ratio reached: ${result.ratio.toFixed(3)} with ${result.shape} and ${best.studs} studs, governed by ${describeGoverning(result)}.`;
  return result;
}
