/**
 * AISC 360-16 E1: available compressive strength φc Pn (LRFD) or Pn/Ωc (ASD), φc = 0.90,
 * Ωc = 1.67, with Pn the lowest of the applicable limit states. For a doubly symmetric rolled
 * W-shape as a pinned gravity column (Lc = K L, K = 1.0) that is flexural buckling about
 * either axis: E3 when no element is slender per Table B4.1a, E7 (effective area) when one is.
 *
 * Torsional buckling (E4) is not checked: for doubly symmetric W-shapes with Lcz ≤ Lcy it does
 * not govern over weak-axis flexural buckling (AISC 360-16 Commentary E4; W-shapes rolled for
 * columns). The engine only designs columns with the same length about every axis here.
 */
import { listWShapes, type WShape } from '../../../../catalog/w-shapes.catalog';
import { E_KSI } from '../../../units/units.constants';
import { availableStrength, type DesignMethod } from '../resistance-factors';
import { lambdaRCompressionCase1, lambdaRCompressionCase5 } from '../chapter-b/b4';
import { criticalStressE3, type E3CriticalStress } from './e3';
import { effectiveWidthE7_1, type E7ElementWidth } from './e7';
import { eqE3_1, eqE3_2, eqE3_3, eqE3_4, slendernessLimitE3 } from './e3.equations';
import { eqE7_1, eqE7_3, eqE7_5, TABLE_E7_1 } from './e7.equations';

/** AISC 360-16 E1: resistance and safety factors for compression. */
export const PHI_C = 0.9;
export const OMEGA_C = 1.67;

/** Per-shape constants for compression at one Fy (Table B4.1a cases 1 and 5). */
export interface CompressionConstants {
  shape: WShape;
  label: string;
  weightPlf: number;
  agIn2: number;
  rxIn: number;
  ryIn: number;
  fyKsi: number;
  eKsi: number;
  /** Flange outstand b = bf/2 and its λ = bf/2tf (Table B4.1a case 1). */
  flangeBIn: number;
  tfIn: number;
  lambdaFlange: number;
  lambdaRFlange: number;
  /** Web h = (h/tw)·tw and its λ = h/tw (Table B4.1a case 5). */
  webHIn: number;
  twIn: number;
  lambdaWeb: number;
  lambdaRWeb: number;
  slenderFlange: boolean;
  slenderWeb: boolean;
}

export function computeCompressionConstants(shape: WShape, fyKsi: number, eKsi = E_KSI): CompressionConstants {
  const lambdaRFlange = lambdaRCompressionCase1(eKsi, fyKsi);
  const lambdaRWeb = lambdaRCompressionCase5(eKsi, fyKsi);
  return {
    shape, label: shape.label, weightPlf: shape.W_plf, agIn2: shape.A_in2, rxIn: shape.rx_in, ryIn: shape.ry_in, fyKsi, eKsi,
    flangeBIn: shape.bf_in / 2, tfIn: shape.tf_in, lambdaFlange: shape.bf_2tf, lambdaRFlange,
    webHIn: shape.h_tw * shape.tw_in, twIn: shape.tw_in, lambdaWeb: shape.h_tw, lambdaRWeb,
    slenderFlange: shape.bf_2tf > lambdaRFlange, slenderWeb: shape.h_tw > lambdaRWeb,
  };
}

export type CompressionAxis = 'x' | 'y';

export interface AxisCompression extends E3CriticalStress {
  axis: CompressionAxis;
  lcIn: number;
  rIn: number;
  /** Area the stress acts on: Ag (E3) or Ae (E7). */
  areaIn2: number;
  pnKip: number;
  /** Effective widths (E7 only): the web and each of the four flange outstands. */
  web: E7ElementWidth | null;
  flange: E7ElementWidth | null;
}

export interface CompressionStrength {
  /** The section "E3" (no slender element) or "E7" (slender web or flange per Table B4.1a). */
  section: 'E3' | 'E7';
  clause: string;
  equation: string;
  limitState: string;
  governingAxis: CompressionAxis;
  x: AxisCompression;
  y: AxisCompression;
  pnKip: number;
  /** φc Pn (LRFD) or Pn/Ωc (ASD). */
  pcKip: number;
  phi: number;
  omega: number;
}

/** Ae at Fcr without building records (hot path): the same arithmetic as axisStrength's E7 branch. */
function effectiveAreaIn2(k: CompressionConstants, fcrKsi: number): number {
  const lost = (bIn: number, lambda: number, lambdaR: number, c: { c1: number; c2: number }) =>
    lambda <= lambdaR * Math.sqrt(k.fyKsi / fcrKsi) ? 0 : bIn - Math.min(bIn, eqE7_3(bIn, c.c1, eqE7_5(c.c2, lambdaR, lambda, k.fyKsi), fcrKsi));
  return k.agIn2 - lost(k.webHIn, k.lambdaWeb, k.lambdaRWeb, TABLE_E7_1.stiffened) * k.twIn - 4 * lost(k.flangeBIn, k.lambdaFlange, k.lambdaRFlange, TABLE_E7_1.other) * k.tfIn;
}

/** Nominal strength about one axis: Fcr by E3, on Ag (E3-1) or on Ae (E7-1). */
function axisStrength(k: CompressionConstants, axis: CompressionAxis, lcIn: number): AxisCompression {
  const rIn = axis === 'x' ? k.rxIn : k.ryIn;
  const e3 = criticalStressE3(lcIn, rIn, k.eKsi, k.fyKsi);
  if (!k.slenderFlange && !k.slenderWeb) {
    // Written out (not spread from e3): a spread literal here was the slowest line of column design.
    return { slenderness: e3.slenderness, limit: e3.limit, feKsi: e3.feKsi, fcrKsi: e3.fcrKsi, equation: e3.equation, axis, lcIn, rIn, areaIn2: k.agIn2, pnKip: eqE3_1(e3.fcrKsi, k.agIn2), web: null, flange: null };
  }
  const web = effectiveWidthE7_1(k.webHIn, k.lambdaWeb, k.lambdaRWeb, k.fyKsi, e3.fcrKsi, TABLE_E7_1.stiffened);
  const flange = effectiveWidthE7_1(k.flangeBIn, k.lambdaFlange, k.lambdaRFlange, k.fyKsi, e3.fcrKsi, TABLE_E7_1.other);
  // Ae = Ag less the ineffective web depth and the ineffective part of the four flange outstands.
  const aeIn2 = k.agIn2 - (web.bIn - web.beIn) * k.twIn - 4 * (flange.bIn - flange.beIn) * k.tfIn;
  return { slenderness: e3.slenderness, limit: e3.limit, feKsi: e3.feKsi, fcrKsi: e3.fcrKsi, equation: e3.equation, axis, lcIn, rIn, areaIn2: aeIn2, pnKip: eqE7_1(e3.fcrKsi, aeIn2), web, flange };
}

/**
 * Available axial strength of a W-shape with effective lengths Lcx, Lcy (in): the lower of the
 * two axes governs (the weak axis unless the strong-axis length is the longer one).
 */
export function compressionStrengthE1(k: CompressionConstants, lcxIn: number, lcyIn: number, method: DesignMethod): CompressionStrength {
  const x = axisStrength(k, 'x', lcxIn);
  const y = axisStrength(k, 'y', lcyIn);
  // Ties go to the weak axis (the usual report).
  const gov = x.pnKip < y.pnKip ? x : y;
  const section = k.slenderFlange || k.slenderWeb ? 'E7' : 'E3';
  const slenderPart = k.slenderWeb && k.slenderFlange ? 'web and flanges' : k.slenderWeb ? 'web' : 'flanges';
  return {
    section,
    clause: section === 'E3' ? 'AISC 360-16 E3' : 'AISC 360-16 E7',
    equation: section === 'E3' ? `Eq. E3-1 with ${gov.equation}` : `Eq. E7-1 with ${gov.equation}`,
    limitState: section === 'E3'
      ? `flexural buckling about the ${gov.axis}-axis`
      : `flexural buckling about the ${gov.axis}-axis, slender ${slenderPart} (effective area)`,
    governingAxis: gov.axis,
    x, y,
    pnKip: gov.pnKip,
    pcKip: availableStrength(method, gov.pnKip, PHI_C, OMEGA_C),
    phi: PHI_C,
    omega: OMEGA_C,
  };
}

/**
 * Available strength only (hot path of tier selection), same value as compressionStrengthE1(k, lc, lc, method).pcKip.
 * With one length about both axes the axis of the smaller r governs: Fcr falls as Lc/r rises
 * (E3-2, E3-3), and Fcr·Ae rises with Fcr (E7-2, E7-3), so only that axis is evaluated.
 */
export function availableCompressionKip(k: CompressionConstants, lcIn: number, method: DesignMethod): number {
  const rIn = k.ryIn <= k.rxIn ? k.ryIn : k.rxIn;
  const slenderness = lcIn / rIn;
  let fcr: number;
  if (!(lcIn > 0)) fcr = k.fyKsi;
  else {
    const fe = eqE3_4(k.eKsi, lcIn, rIn);
    fcr = slenderness <= slendernessLimitE3(k.eKsi, k.fyKsi) ? eqE3_2(k.fyKsi, fe) : eqE3_3(fe);
  }
  const pn = !k.slenderFlange && !k.slenderWeb ? eqE3_1(fcr, k.agIn2) : eqE7_1(fcr, effectiveAreaIn2(k, fcr));
  return availableStrength(method, pn, PHI_C, OMEGA_C);
}

const cache = new Map<number, Map<string, CompressionConstants>>();

/** Compression constants of a catalog shape at Fy by label (case-insensitive), undefined if unknown. */
export function compressionConstantsFor(label: string, fyKsi: number): CompressionConstants | undefined {
  let byLabel = cache.get(fyKsi);
  if (!byLabel) {
    byLabel = new Map(listWShapes().map((s) => [s.label.toUpperCase(), computeCompressionConstants(s, fyKsi)]));
    if (cache.size >= 16) cache.clear();
    cache.set(fyKsi, byLabel);
  }
  return byLabel.get(label.replace(/\s+/g, '').toUpperCase());
}
