import { OMEGA_B, PHI_B } from '../design/aisc360/resistance-factors';
import { nominalFlexure } from '../design/aisc360/w-shape-constants';
import { DEFLECTION_CLAUSE, deflectionLimitIn } from '../design/serviceability/deflection.serviceability';
import { IN_PER_FT } from '../units/units.constants';
import type { MemberContext } from './member-context';
import type { CaseReactions, MemberCheck, MemberDesignResult, MemberSegment } from './member-design.types';
import type { ShapeEvaluation } from './shape-evaluation';

export const STANDARDS = ['AISC 360-16', 'ASCE 7-16'];
export const CAUTION =
  'Results must be checked by a licensed professional engineer; local building codes govern.';

const CHECK_LABEL: Record<string, string> = {
  flexure: 'flexure', shear: 'shear', deflectionLive: 'live-load deflection', deflectionTotal: 'total-load deflection',
  construction: 'construction-stage flexure (bare steel)', studs: 'stud count and spacing',
};

/** "flexure (AISC 360-16 F2.2, 1.2D+1.6L)": the governing check of a built result, in words. */
export function describeGoverning(result: Pick<MemberDesignResult, 'checks' | 'governing'>): string {
  const chk = result.checks.find((c) => c.name === result.governing);
  const where = chk ? ` (${chk.clause}, ${chk.combination})` : '';
  return `${CHECK_LABEL[result.governing]}${where}`;
}

/** Builds the full result, with every check's working, from one shape's evaluation. */
export function buildMemberResult(ctx: MemberContext, ev: ShapeEvaluation, locked: boolean): MemberDesignResult {
  const k = ev.k;
  const method = ctx.method;
  const lrfd = method === 'LRFD';
  const factor = lrfd ? { phi: PHI_B } : { omega: OMEGA_B };
  const wKlf = ctx.includeSelfWeight ? k.weightKlf : 0;
  const f = ev.flexure;
  const seg = ctx.segments[f.segment];
  const fc = ctx.combos[f.combo];
  const nf = nominalFlexure(k, seg.lbFt, f.cb);

  const flexure: MemberCheck = {
    name: 'flexure', clause: nf.clause, equation: nf.equation, combination: fc.combo.name,
    demand: f.mrKipFt, capacity: f.mcKipFt, ratio: f.ratio, unit: 'kip-ft', limitState: nf.limitState, method, ...factor,
    from_ft: seg.aFt, to_ft: seg.bFt,
    lambda_f: k.lambdaF, lambda_pf: k.lambdaPf, lambda_rf: k.lambdaRf, flangeClass: k.flangeClass,
    lambda_w: k.lambdaW, lambda_pw: k.lambdaPw,
    Lp_ft: k.lpFt, Lr_ft: k.lrFt, Lb_ft: seg.lbFt, Cb: f.cb, Mp_kipft: k.mpKipFt, Mn_kipft: f.mnKipFt,
    Mn_FLB_kipft: k.mnFlbKipIn === null ? null : k.mnFlbKipIn / IN_PER_FT, Fcr_ksi: nf.fcrKsi,
    MA_kipft: f.mA, MB_kipft: f.mB, MC_kipft: f.mC,
  };
  const sh = k.shear;
  const shear: MemberCheck = {
    name: 'shear', clause: `AISC 360-16 ${sh.case}`, equation: `Eq. G2-1, Cv1 by ${sh.cv1Equation}`,
    combination: ctx.combos[ev.shearCombo].combo.name, demand: ev.vrKip, capacity: ev.vcKip, ratio: ev.ratioShear,
    unit: 'kip', limitState: 'shear yielding', method, ...(lrfd ? { phi: sh.phiV } : { omega: sh.omegaV }),
    shearCase: sh.case, Aw_in2: sh.awIn2, h_tw: sh.hTw, h_tw_limit: sh.hTwLimitA, kv: sh.kv, Cv1: sh.cv1, Vn_kip: sh.vnKip,
  };
  const checks: MemberCheck[] = [flexure, shear];
  const lim = ctx.input.deflectionLimits;
  if (lim.live != null) {
    checks.push({
      name: 'deflectionLive', clause: DEFLECTION_CLAUSE, equation: `Δ ≤ L/${lim.live}`,
      combination: ctx.liveCase ?? 'L', demand: ev.deflLiveIn, capacity: deflectionLimitIn(ctx.spanFt, lim.live), ratio: ev.ratioLive!,
      unit: 'in', limit_n: lim.live, loadCase: ctx.liveCase ?? 'none', Ix_in4: k.ixIn4, at_ft: ctx.liveMaxAtFt,
    });
  }
  if (lim.total != null) {
    const name = ctx.totalExcludesPreComposite ? ['superimposed D', ...ctx.casesPresent.filter((c) => c !== 'D')].join('+') : ctx.casesPresent.join('+');
    checks.push({
      name: 'deflectionTotal', clause: DEFLECTION_CLAUSE, equation: `Δ ≤ L/${lim.total}`,
      combination: name, demand: ev.deflTotalIn, capacity: deflectionLimitIn(ctx.spanFt, lim.total), ratio: ev.ratioTotal!,
      unit: 'in', limit_n: lim.total, loadCase: name, Ix_in4: k.ixIn4, at_ft: ev.deflTotalAtFt,
    });
  }

  const segments: MemberSegment[] = (ev.segments ?? [f]).map((o) => {
    const s = ctx.segments[o.segment];
    return {
      from_ft: s.aFt, to_ft: s.bFt, Lb_ft: s.lbFt, Cb: o.cb, combination: ctx.combos[o.combo].combo.name,
      Mr_kipft: o.mrKipFt, Mc_kipft: o.mcKipFt, Mn_kipft: o.mnKipFt, ratio: o.ratio,
    };
  });

  const react = (end: 'startKip' | 'endKip'): CaseReactions => ({
    D_kip: ctx.caseReactions.D[end] + (wKlf * ctx.spanFt) / 2,
    L_kip: ctx.caseReactions.L[end],
    Lr_kip: ctx.caseReactions.Lr[end],
    S_kip: ctx.caseReactions.S[end],
  });

  return {
    shape: k.label, weight_plf: k.weightPlf, passes: ev.passes, governing: ev.governing, ratio: ev.ratio,
    Mr_kipft: f.mrKipFt, Mc_kipft: f.mcKipFt, Vr_kip: ev.vrKip, Vc_kip: ev.vcKip,
    Mp_kipft: k.mpKipFt, Mn_kipft: f.mnKipFt, Lp_ft: k.lpFt, Lr_ft: k.lrFt, Lb_ft: seg.lbFt, Cb: f.cb,
    deflectionLive_in: ev.deflLiveIn, deflectionTotal_in: ev.deflTotalIn,
    ratios: { flexure: f.ratio, shear: ev.ratioShear, deflectionLive: ev.ratioLive, deflectionTotal: ev.ratioTotal },
    reactions: { start: react('startKip'), end: react('endKip') },
    checks, segments, failure: null, locked,
    method, Fy_ksi: ctx.fyKsi, span_ft: ctx.spanFt, governingCombination: fc.combo.name,
    combinations: ctx.combos.map((c) => ({ name: c.combo.name, clause: c.combo.clause })),
    selfWeight_klf: wKlf, maxMoment: { M_kipft: ev.mMaxKipFt, x_ft: ev.mMaxAtFt },
    standards: STANDARDS, caution: CAUTION,
  };
}
