/** AISC 360-16 F1(1): flexure resistance and safety factors. */
export const PHI_B = 0.9;
export const OMEGA_B = 1.67;

export type DesignMethod = 'LRFD' | 'ASD';

/** Available strength from nominal: φRn (LRFD) or Rn/Ω (ASD), AISC 360-16 B3.1 / B3.2. */
export function availableStrength(method: DesignMethod, nominal: number, phi: number, omega: number): number {
  return method === 'LRFD' ? phi * nominal : nominal / omega;
}
