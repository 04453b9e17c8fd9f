import { eqE3_2, eqE3_3, eqE3_4, slendernessLimitE3 } from './e3.equations';

export interface E3CriticalStress {
  /** Lc/r about the axis considered. */
  slenderness: number;
  /** 4.71 sqrt(E/Fy). */
  limit: number;
  feKsi: number;
  fcrKsi: number;
  equation: 'Eq. E3-2' | 'Eq. E3-3';
}

/**
 * AISC 360-16 E3, critical stress for flexural buckling about one axis:
 * Fe by Eq. E3-4; Lc/r ≤ 4.71 sqrt(E/Fy) → Eq. E3-2, else Eq. E3-3. Lc = 0 gives Fcr = Fy.
 */
export function criticalStressE3(lcIn: number, rIn: number, eKsi: number, fyKsi: number): E3CriticalStress {
  const slenderness = lcIn / rIn;
  const limit = slendernessLimitE3(eKsi, fyKsi);
  const feKsi = lcIn > 0 ? eqE3_4(eKsi, lcIn, rIn) : Number.POSITIVE_INFINITY;
  if (slenderness <= limit) return { slenderness, limit, feKsi, fcrKsi: eqE3_2(fyKsi, feKsi), equation: 'Eq. E3-2' };
  return { slenderness, limit, feKsi, fcrKsi: eqE3_3(feKsi), equation: 'Eq. E3-3' };
}
