import { listWShapes, nominalDepthIn, type WShape } from '../../../catalog/w-shapes.catalog';
import { E_KSI, IN_PER_FT } from '../../units/units.constants';
import { classifyFlange, lambdaPfCase10, lambdaPwCase15, lambdaRfCase10, type FlangeClass } from './chapter-b/b4';
import { C_DOUBLY_SYMMETRIC, eqF2_1, eqF2_5, eqF2_6 } from './chapter-f/f2.equations';
import { lateralTorsionalF2_2, lateralTorsionalMnKipIn, type F2SectionConstants } from './chapter-f/f2';
import { flangeLocalBucklingF3_2 } from './chapter-f/f3';
import { shearStrengthG2_1, type G2ShearStrength } from './chapter-g/g2';

/**
 * Per-shape constants for flexure and shear at one Fy, computed once and cached
 * (AISC 360-16 F2, F3, G2.1 and Table B4.1b). Lengths carry both in and ft.
 */
export interface WShapeConstants extends F2SectionConstants {
  shape: WShape;
  label: string;
  weightPlf: number;
  weightKlf: number;
  dIn: number;
  nominalDepthIn: number;
  ixIn4: number;
  zxIn3: number;
  mpKipFt: number;
  /** 0.7 Fy Sx, kip-ft (the F2-2 end point at Lb = Lr with Cb = 1). */
  mrKipFt: number;
  lpFt: number;
  lrFt: number;
  lambdaF: number;
  lambdaPf: number;
  lambdaRf: number;
  flangeClass: FlangeClass;
  /** Mn for flange local buckling (F3), null when the flange is compact. */
  mnFlbKipIn: number | null;
  flbEquation: 'Eq. F3-1' | 'Eq. F3-2' | null;
  lambdaW: number;
  lambdaPw: number;
  /** Web compact in flexure per Table B4.1b case 15, asserted from the catalog. */
  webCompact: boolean;
  shear: G2ShearStrength;
  /** Upper bound of Mn over every Lb and Cb: min(Mp, F3 Mn). kip-ft */
  mnMaxKipFt: number;
}

export function computeWShapeConstants(shape: WShape, fyKsi: number): WShapeConstants {
  const eKsi = E_KSI;
  const mpKipIn = eqF2_1(fyKsi, shape.Zx_in3);
  const lpIn = eqF2_5(shape.ry_in, eKsi, fyKsi);
  const lrIn = eqF2_6(shape.rts_in, eKsi, fyKsi, shape.J_in4, C_DOUBLY_SYMMETRIC, shape.Sx_in3, shape.ho_in);
  const lambdaF = shape.bf_2tf;
  const lambdaPf = lambdaPfCase10(eKsi, fyKsi);
  const lambdaRf = lambdaRfCase10(eKsi, fyKsi);
  const flangeClass = classifyFlange(lambdaF, lambdaPf, lambdaRf);
  const flb = flangeLocalBucklingF3_2(flangeClass, mpKipIn, fyKsi, shape.Sx_in3, eKsi, lambdaF, lambdaPf, lambdaRf, shape.h_tw);
  const lambdaPw = lambdaPwCase15(eKsi, fyKsi);
  const mnMaxKipIn = flb.mnKipIn === null ? mpKipIn : Math.min(mpKipIn, flb.mnKipIn);
  return {
    shape, label: shape.label, weightPlf: shape.W_plf, weightKlf: shape.W_plf / 1000,
    dIn: shape.d_in, nominalDepthIn: nominalDepthIn(shape), ixIn4: shape.Ix_in4, zxIn3: shape.Zx_in3,
    fyKsi, eKsi, sxIn3: shape.Sx_in3, rtsIn: shape.rts_in, jIn4: shape.J_in4, hoIn: shape.ho_in, c: C_DOUBLY_SYMMETRIC,
    mpKipIn, mpKipFt: mpKipIn / IN_PER_FT, mrKipFt: (0.7 * fyKsi * shape.Sx_in3) / IN_PER_FT,
    lpIn, lrIn, lpFt: lpIn / IN_PER_FT, lrFt: lrIn / IN_PER_FT,
    lambdaF, lambdaPf, lambdaRf, flangeClass, mnFlbKipIn: flb.mnKipIn, flbEquation: flb.equation,
    lambdaW: shape.h_tw, lambdaPw, webCompact: shape.h_tw <= lambdaPw,
    shear: shearStrengthG2_1(shape.d_in, shape.tw_in, shape.h_tw, fyKsi, eKsi),
    mnMaxKipFt: mnMaxKipIn / IN_PER_FT,
  };
}

export type FlexureLimitState = 'yielding' | 'lateral-torsional buckling' | 'flange local buckling';

export interface NominalFlexure {
  mnKipFt: number;
  limitState: FlexureLimitState;
  equation: string;
  /** Section of AISC 360-16 the governing limit state comes from. */
  clause: string;
  fcrKsi: number | null;
}

/**
 * Nominal flexural strength about the major axis for an unbraced length and Cb:
 * the lowest of yielding (F2.1), LTB (F2.2) and, for noncompact/slender flanges, FLB (F3.2).
 */
export function nominalFlexure(k: WShapeConstants, lbFt: number, cb: number): NominalFlexure {
  const ltb = lateralTorsionalF2_2(k, lbFt * IN_PER_FT, cb);
  let mnKipIn = k.mpKipIn;
  let out: NominalFlexure = { mnKipFt: 0, limitState: 'yielding', equation: 'Eq. F2-1', clause: 'AISC 360-16 F2.1', fcrKsi: null };
  if (ltb.mnKipIn < mnKipIn) {
    mnKipIn = ltb.mnKipIn;
    out = { mnKipFt: 0, limitState: 'lateral-torsional buckling', equation: ltb.equation, clause: 'AISC 360-16 F2.2', fcrKsi: ltb.fcrKsi };
  }
  if (k.mnFlbKipIn !== null && k.mnFlbKipIn < mnKipIn) {
    mnKipIn = k.mnFlbKipIn;
    out = { mnKipFt: 0, limitState: 'flange local buckling', equation: k.flbEquation ?? 'Eq. F3-1', clause: 'AISC 360-16 F3.2', fcrKsi: null };
  }
  out.mnKipFt = mnKipIn / IN_PER_FT;
  return out;
}

/** Same value as nominalFlexure(...).mnKipFt without building the record (hot path). */
export function nominalFlexureKipFt(k: WShapeConstants, lbFt: number, cb: number): number {
  const mnKipIn = Math.min(lateralTorsionalMnKipIn(k, lbFt * IN_PER_FT, cb), k.mpKipIn);
  return (k.mnFlbKipIn !== null && k.mnFlbKipIn < mnKipIn ? k.mnFlbKipIn : mnKipIn) / IN_PER_FT;
}

interface FyCache {
  all: WShapeConstants[];
  byLabel: Map<string, WShapeConstants>;
  /** Sorted by weight, then actual depth, then label: the selection order. */
  byWeight: WShapeConstants[];
}
const cache = new Map<number, FyCache>();

function forFy(fyKsi: number): FyCache {
  let c = cache.get(fyKsi);
  if (!c) {
    const all = listWShapes().map((s) => computeWShapeConstants(s, fyKsi));
    const byWeight = [...all].sort((a, b) => a.weightPlf - b.weightPlf || a.dIn - b.dIn || (a.label < b.label ? -1 : a.label > b.label ? 1 : 0));
    c = { all, byLabel: new Map(all.map((k) => [k.label.toUpperCase(), k])), byWeight };
    if (cache.size >= 16) cache.clear(); // a handful of steel grades in practice
    cache.set(fyKsi, c);
  }
  return c;
}

/** Constants of every catalog shape at Fy, sorted lightest first (ties: shallower first). */
export function shapeConstantsByWeight(fyKsi: number): readonly WShapeConstants[] {
  return forFy(fyKsi).byWeight;
}

/** Constants of one shape at Fy by label (case-insensitive), undefined if unknown. */
export function shapeConstantsFor(label: string, fyKsi: number): WShapeConstants | undefined {
  return forFy(fyKsi).byLabel.get(label.replace(/\s+/g, '').toUpperCase());
}
