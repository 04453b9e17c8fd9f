/**
 * Camber of a composite beam (design-basis §6, common practice, no single published source):
 * about 80 % of the pre-composite dead-load deflection (wet concrete, deck, self weight on the
 * bare steel), rounded down to 1/4 in., none below 3/4 in., none on members with moment
 * connections (every member the engine designs is simple span with shear connections).
 */
export const CAMBER_FRACTION = 0.8;
export const CAMBER_INCREMENT_IN = 0.25;
export const CAMBER_MINIMUM_IN = 0.75;
export const CAMBER_BASIS = 'common practice: 80 % of the pre-composite dead-load deflection, rounded down to 1/4 in., none below 3/4 in.';

export function camberIn(preCompositeDeadDeflectionIn: number): number {
  const raw = CAMBER_FRACTION * preCompositeDeadDeflectionIn;
  // A small tolerance so that 0.8 × 0.9375 = 0.75 (in binary, 0.7499999…) still rounds to 3/4 in.
  const rounded = Math.floor(raw / CAMBER_INCREMENT_IN + 1e-9) * CAMBER_INCREMENT_IN;
  return rounded >= CAMBER_MINIMUM_IN ? rounded : 0;
}

/** 0.75 → 3/4", 1.25 → 1-1/4" (the way camber is written on plans). */
export function camberText(inches: number): string {
  const quarters = Math.round(inches * 4);
  const whole = Math.floor(quarters / 4);
  const rest = quarters % 4;
  const frac = rest === 0 ? '' : rest === 2 ? '1/2' : `${rest}/4`;
  if (whole === 0) return `${frac}"`;
  return frac ? `${whole}-${frac}"` : `${whole}"`;
}
