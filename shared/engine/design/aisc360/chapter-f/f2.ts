import { eqF2_2, eqF2_3, eqF2_4 } from './f2.equations';

export type F2LtbRange = 'Lb<=Lp' | 'Lp<Lb<=Lr' | 'Lb>Lr';

export interface F2LateralTorsional {
  range: F2LtbRange;
  /** "Eq. F2-1" (no LTB: yielding), "Eq. F2-2" or "Eq. F2-3". */
  equation: 'Eq. F2-1' | 'Eq. F2-2' | 'Eq. F2-3';
  mnKipIn: number;
  /** Fcr by Eq. F2-4, only for Lb > Lr. */
  fcrKsi: number | null;
}

/** Section constants F2 needs; all per shape and Fy (see w-shape-constants.ts). */
export interface F2SectionConstants {
  fyKsi: number;
  eKsi: number;
  sxIn3: number;
  rtsIn: number;
  jIn4: number;
  hoIn: number;
  c: number;
  mpKipIn: number;
  lpIn: number;
  lrIn: number;
}

/**
 * AISC 360-16 F2.2, lateral-torsional buckling (yielding F2.1 caps it at Mp):
 * Lb ≤ Lp: limit state does not apply, Mn = Mp (Eq. F2-1);
 * Lp < Lb ≤ Lr: Eq. F2-2; Lb > Lr: Eq. F2-3 with Fcr by Eq. F2-4.
 */
export function lateralTorsionalF2_2(k: F2SectionConstants, lbIn: number, cb: number): F2LateralTorsional {
  if (lbIn <= k.lpIn) return { range: 'Lb<=Lp', equation: 'Eq. F2-1', mnKipIn: k.mpKipIn, fcrKsi: null };
  if (lbIn <= k.lrIn) {
    return { range: 'Lp<Lb<=Lr', equation: 'Eq. F2-2', mnKipIn: eqF2_2(cb, k.mpKipIn, k.fyKsi, k.sxIn3, lbIn, k.lpIn, k.lrIn), fcrKsi: null };
  }
  const fcrKsi = eqF2_4(cb, k.eKsi, lbIn, k.rtsIn, k.jIn4, k.c, k.sxIn3, k.hoIn);
  return { range: 'Lb>Lr', equation: 'Eq. F2-3', mnKipIn: eqF2_3(fcrKsi, k.sxIn3, k.mpKipIn), fcrKsi };
}

/** Mn of lateralTorsionalF2_2 without building the record (hot path of the selection). */
export function lateralTorsionalMnKipIn(k: F2SectionConstants, lbIn: number, cb: number): number {
  if (lbIn <= k.lpIn) return k.mpKipIn;
  if (lbIn <= k.lrIn) return eqF2_2(cb, k.mpKipIn, k.fyKsi, k.sxIn3, lbIn, k.lpIn, k.lrIn);
  return eqF2_3(eqF2_4(cb, k.eKsi, lbIn, k.rtsIn, k.jIn4, k.c, k.sxIn3, k.hoIn), k.sxIn3, k.mpKipIn);
}
