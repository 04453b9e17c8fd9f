/**
 * AISC 360-16 Section E7, members with slender elements: effective width of a slender
 * element (E7.1) and the nominal strength on the effective area. Units: kip, in, ksi.
 */

/** Eq. E7-1: Pn = Fcr Ae (kip). */
export const eqE7_1 = (fcrKsi: number, aeIn2: number): number => fcrKsi * aeIn2;

/** Eq. E7-2 (λ ≤ λr sqrt(Fy/Fcr)): be = b, the element is fully effective (in). */
export const eqE7_2 = (bIn: number): number => bIn;

/** Eq. E7-3 (λ > λr sqrt(Fy/Fcr)): be = b (1 − c1 sqrt(Fel/Fcr)) sqrt(Fel/Fcr) (in). */
export function eqE7_3(bIn: number, c1: number, felKsi: number, fcrKsi: number): number {
  const root = Math.sqrt(felKsi / fcrKsi);
  return bIn * (1 - c1 * root) * root;
}

/** Eq. E7-4: c2 = (1 − sqrt(1 − 4 c1)) / (2 c1). */
export const eqE7_4 = (c1: number): number => (1 - Math.sqrt(1 - 4 * c1)) / (2 * c1);

/** Eq. E7-5: Fel = (c2 λr / λ)² Fy (ksi), the elastic local buckling stress. */
export const eqE7_5 = (c2: number, lambdaR: number, lambda: number, fyKsi: number): number => (c2 * (lambdaR / lambda)) ** 2 * fyKsi;

/** Table E7.1, effective width imperfection adjustment factor c1 (c2 by Eq. E7-4). */
export const TABLE_E7_1 = {
  /** Case (a): stiffened elements except walls of square and rectangular HSS (webs of I-shapes). */
  stiffened: { c1: 0.18, c2: 1.31 },
  /** Case (c): all other elements (flanges of rolled I-shapes). */
  other: { c1: 0.22, c2: 1.49 },
} as const;
