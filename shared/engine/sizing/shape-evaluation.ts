import { eqF1_1 } from '../design/aisc360/chapter-f/f1';
import { OMEGA_B, PHI_B } from '../design/aisc360/resistance-factors';
import { nominalFlexureKipFt, type WShapeConstants } from '../design/aisc360/w-shape-constants';
import { deflectionIn, deflectionRatio } from '../design/serviceability/deflection.serviceability';
import { IN_PER_FT } from '../units/units.constants';
import { maxMomentOfCombination, refinedMax, type MemberContext } from './member-context';
import type { CheckName } from './member-design.types';

export interface SegmentOutcome {
  segment: number;
  combo: number;
  mrKipFt: number;
  mcKipFt: number;
  mnKipFt: number;
  cb: number;
  ratio: number;
  mA: number;
  mB: number;
  mC: number;
}

/** The numbers of one shape's check for one member; built on the hot path, so plain numbers. */
export interface ShapeEvaluation {
  k: WShapeConstants;
  permitted: boolean;
  flexure: SegmentOutcome;
  /** Governing outcome of every segment (detail only). */
  segments: SegmentOutcome[] | null;
  shearCombo: number;
  vrKip: number;
  vcKip: number;
  ratioShear: number;
  deflLiveIn: number;
  deflTotalIn: number;
  deflTotalAtFt: number;
  ratioLive: number | null;
  ratioTotal: number | null;
  ratio: number;
  governing: CheckName;
  passes: boolean;
  /** Max moment of the governing flexure combination and its location. */
  mMaxKipFt: number;
  mMaxAtFt: number;
}

let scratch: number[] = [];

/** Available strength Mc from Mn: φb Mn (LRFD) or Mn/Ωb (ASD), AISC 360-16 F1. */
export const availableFlexure = (method: 'LRFD' | 'ASD', mnKipFt: number): number =>
  method === 'LRFD' ? PHI_B * mnKipFt : mnKipFt / OMEGA_B;

export const availableShear = (method: 'LRFD' | 'ASD', k: WShapeConstants): number =>
  method === 'LRFD' ? k.shear.phiV * k.shear.vnKip : k.shear.vnKip / k.shear.omegaV;

export { deflectionIn } from '../design/serviceability/deflection.serviceability';

/** Lower-bound test: false only when the shape cannot pass (a necessary condition fails). */
export function mayPass(ctx: MemberContext, k: WShapeConstants): boolean {
  const slack = 1 + 1e-9;
  const w = ctx.includeSelfWeight ? k.weightKlf : 0;
  // Moment with self weight at the no-self-weight maximum: a lower bound of the true maximum,
  // and Mn never exceeds min(Mp, F3 Mn).
  let mLow = 0;
  let vMax = 0;
  for (const c of ctx.combos) {
    const m = c.mMaxNoSwKipFt + c.fD * w * c.m1AtMaxNoSw;
    if (m > mLow) mLow = m;
    const v = (c.rStartKip > c.rEndKip ? c.rStartKip : c.rEndKip) + (c.fD * w * ctx.spanFt) / 2;
    if (v > vMax) vMax = v;
  }
  if (mLow > slack * availableFlexure(ctx.method, k.mnMaxKipFt)) return false;
  if (vMax > slack * availableShear(ctx.method, k)) return false;
  const lim = ctx.input.deflectionLimits;
  const spanIn = ctx.spanFt * IN_PER_FT;
  if (lim.live != null && deflectionIn(ctx.liveMaxEI, k.ixIn4) > (slack * spanIn) / lim.live) return false;
  const yLow = ctx.totalMaxNoSwEI + (ctx.totalExcludesPreComposite ? 0 : w) * ctx.deflUnitAtTotalMax;
  if (lim.total != null && deflectionIn(yLow, k.ixIn4) > (slack * spanIn) / lim.total) return false;
  return true;
}

/**
 * Every check for one shape on one member: flexure per segment and combination (AISC 360-16
 * F2/F3 with Cb by Eq. F1-1), shear (G2.1), live and total deflection. Self weight of the shape
 * is included as a full uniform D load when asked.
 */
export function evaluateShape(ctx: MemberContext, k: WShapeConstants, detail: boolean): ShapeEvaluation {
  const method = ctx.method;
  const wKlf = ctx.includeSelfWeight ? k.weightKlf : 0;
  const segs = ctx.segments;
  const nSeg = segs.length;
  let best: SegmentOutcome | null = null;
  let bestMMax = 0, bestMAt = 0;
  const perSeg: (SegmentOutcome | null)[] | null = detail ? new Array(nSeg).fill(null) : null;
  let shearCombo = 0, vrKip = -1;

  for (let ci = 0; ci < ctx.combos.length; ci++) {
    const c = ctx.combos[ci];
    const ws = c.fD * wKlf;
    const mx = maxMomentOfCombination(ctx, c, ws);
    for (let s = 0; s < nSeg; s++) {
      const seg = segs[s];
      const j = 5 * s;
      const segM = c.segM, m1Seg = ctx.m1Seg;
      const ma = segM[j] + ws * m1Seg[j], mb = segM[j + 4] + ws * m1Seg[j + 4];
      // Concave M: the segment maximum is the span maximum if it lies inside, else an end.
      const mMax = mx.xFt >= seg.aFt && mx.xFt <= seg.bFt ? mx.mKipFt : ma > mb ? ma : mb;
      const mA = segM[j + 1] + ws * m1Seg[j + 1];
      const mB = segM[j + 2] + ws * m1Seg[j + 2];
      const mC = segM[j + 3] + ws * m1Seg[j + 3];
      const cb = seg.cbFixed ?? eqF1_1(mMax < 0 ? -mMax : mMax, mA < 0 ? -mA : mA, mB < 0 ? -mB : mB, mC < 0 ? -mC : mC);
      const mn = nominalFlexureKipFt(k, seg.lbFt, cb);
      const mc = availableFlexure(method, mn);
      const ratio = mMax / mc;
      if (best === null || ratio > best.ratio) {
        best = { segment: s, combo: ci, mrKipFt: mMax, mcKipFt: mc, mnKipFt: mn, cb, ratio, mA, mB, mC };
        bestMMax = mx.mKipFt; bestMAt = mx.xFt;
      }
      if (perSeg && (perSeg[s] === null || ratio > perSeg[s]!.ratio)) {
        perSeg[s] = { segment: s, combo: ci, mrKipFt: mMax, mcKipFt: mc, mnKipFt: mn, cb, ratio, mA, mB, mC };
      }
    }
    // Shear: V decreases along the span under downward loads, so |V|max is the larger reaction.
    const v = Math.max(c.rStartKip, c.rEndKip) + (ws * ctx.spanFt) / 2;
    if (v > vrKip) { vrKip = v; shearCombo = ci; }
  }
  const vcKip = availableShear(method, k);
  const ratioShear = vrKip / vcKip;

  const lim = ctx.input.deflectionLimits;
  const deflLiveIn = deflectionIn(ctx.liveMaxEI, k.ixIn4);
  let deflTotalIn: number;
  let deflTotalAtFt: number;
  const wTotalKlf = ctx.totalExcludesPreComposite ? 0 : wKlf;
  if (wTotalKlf === 0) {
    deflTotalIn = deflectionIn(ctx.totalMaxNoSwEI, k.ixIn4);
    deflTotalAtFt = refinedMax(ctx.deflTotalBase, ctx.deflX).at;
  } else {
    if (scratch.length !== ctx.deflX.length) scratch = ctx.deflX.slice();
    const y = scratch;
    for (let i = 0; i < y.length; i++) y[i] = ctx.deflTotalBase[i] + wTotalKlf * ctx.deflUnit[i];
    const mx = refinedMax(y, ctx.deflX);
    deflTotalIn = deflectionIn(mx.value, k.ixIn4);
    deflTotalAtFt = mx.at;
  }
  const ratioLive = deflectionRatio(deflLiveIn, ctx.spanFt, lim.live);
  const ratioTotal = deflectionRatio(deflTotalIn, ctx.spanFt, lim.total);

  const flexure = best!;
  let ratio = flexure.ratio;
  let governing: CheckName = 'flexure';
  if (ratioShear > ratio) { ratio = ratioShear; governing = 'shear'; }
  if (ratioLive !== null && ratioLive > ratio) { ratio = ratioLive; governing = 'deflectionLive'; }
  if (ratioTotal !== null && ratioTotal > ratio) { ratio = ratioTotal; governing = 'deflectionTotal'; }
  // A noncompact web in flexure (F4) is outside this engine: the shape is not permitted.
  const permitted = k.webCompact;
  return {
    k, permitted, flexure, segments: perSeg as SegmentOutcome[] | null, shearCombo, vrKip, vcKip, ratioShear,
    deflLiveIn, deflTotalIn, deflTotalAtFt, ratioLive, ratioTotal, ratio, governing,
    passes: permitted && ratio <= 1, mMaxKipFt: bestMMax, mMaxAtFt: bestMAt,
  };
}
