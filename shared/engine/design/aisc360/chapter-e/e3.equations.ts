/**
 * AISC 360-16 Section E3, flexural buckling of members without slender elements: one function
 * per numbered equation. Units: kip, in, ksi.
 */

/** Eq. E3-1: Pn = Fcr Ag (kip). */
export const eqE3_1 = (fcrKsi: number, agIn2: number): number => fcrKsi * agIn2;

/** Eq. E3-2 (Lc/r ≤ 4.71 sqrt(E/Fy), i.e. Fy/Fe ≤ 2.25): Fcr = 0.658^(Fy/Fe) Fy (ksi). */
export const eqE3_2 = (fyKsi: number, feKsi: number): number => 0.658 ** (fyKsi / feKsi) * fyKsi;

/** Eq. E3-3 (Lc/r > 4.71 sqrt(E/Fy), i.e. Fy/Fe > 2.25): Fcr = 0.877 Fe (ksi). */
export const eqE3_3 = (feKsi: number): number => 0.877 * feKsi;

/** Eq. E3-4: Fe = π² E / (Lc/r)² (ksi); an infinite Fe for Lc = 0 (no buckling). */
export const eqE3_4 = (eKsi: number, lcIn: number, rIn: number): number => (Math.PI ** 2 * eKsi) / (lcIn / rIn) ** 2;

/** The E3 slenderness limit between Eq. E3-2 and Eq. E3-3: 4.71 sqrt(E/Fy). */
export const slendernessLimitE3 = (eKsi: number, fyKsi: number): number => 4.71 * Math.sqrt(eKsi / fyKsi);
