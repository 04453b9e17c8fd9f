/**
 * AISC 360-16 Section F3, doubly symmetric I-shaped members with compact webs and
 * noncompact or slender flanges: flange local buckling. Units: kip, in, ksi.
 */

/** Eq. F3-1 (noncompact flanges): Mn = Mp − (Mp − 0.7 Fy Sx)(λ − λpf)/(λrf − λpf) (kip-in). */
export function eqF3_1(
  mpKipIn: number, fyKsi: number, sxIn3: number, lambda: number, lambdaPf: number, lambdaRf: number,
): number {
  return mpKipIn - (mpKipIn - 0.7 * fyKsi * sxIn3) * ((lambda - lambdaPf) / (lambdaRf - lambdaPf));
}

/** Eq. F3-2 (slender flanges): Mn = 0.9 E kc Sx / λ² (kip-in). */
export const eqF3_2 = (eKsi: number, kc: number, sxIn3: number, lambda: number): number =>
  (0.9 * eKsi * kc * sxIn3) / (lambda * lambda);

/** kc = 4 / sqrt(h/tw), not less than 0.35 nor more than 0.76 (AISC 360-16 F3.2, Table B4.1b note). */
export const kcFromHtw = (hTw: number): number => Math.min(0.76, Math.max(0.35, 4 / Math.sqrt(hTw)));
