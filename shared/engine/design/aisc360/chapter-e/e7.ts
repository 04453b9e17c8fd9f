import { eqE7_2, eqE7_3, eqE7_5 } from './e7.equations';

export interface E7ElementWidth {
  bIn: number;
  beIn: number;
  lambda: number;
  lambdaR: number;
  /** λr sqrt(Fy/Fcr): above it the element is not fully effective. */
  effectiveLimit: number;
  felKsi: number | null;
  equation: 'Eq. E7-2' | 'Eq. E7-3';
}

/**
 * AISC 360-16 E7.1, effective width of one slender element at the member's Fcr:
 * λ ≤ λr sqrt(Fy/Fcr) → be = b (Eq. E7-2); else Eq. E7-3 with Fel by Eq. E7-5.
 */
export function effectiveWidthE7_1(
  bIn: number, lambda: number, lambdaR: number, fyKsi: number, fcrKsi: number, c: { c1: number; c2: number },
): E7ElementWidth {
  const effectiveLimit = lambdaR * Math.sqrt(fyKsi / fcrKsi);
  if (lambda <= effectiveLimit) return { bIn, beIn: eqE7_2(bIn), lambda, lambdaR, effectiveLimit, felKsi: null, equation: 'Eq. E7-2' };
  const felKsi = eqE7_5(c.c2, lambdaR, lambda, fyKsi);
  return { bIn, beIn: Math.min(bIn, eqE7_3(bIn, c.c1, felKsi, fcrKsi)), lambda, lambdaR, effectiveLimit, felKsi, equation: 'Eq. E7-3' };
}
