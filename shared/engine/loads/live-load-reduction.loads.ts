/**
 * Live load reduction, ASCE 7-16 §4.7.2 (Eq. 4.7-1) with KLL from Table 4.7-1.
 * Limits: L ≥ 0.50 L0 for members supporting one floor, L ≥ 0.40 L0 for two or more (§4.7.2).
 * Not applied (callers pass non-reducible load separately): live > 100 psf (§4.7.3, the 20 %
 * allowance for two or more floors is not taken — conservative), garages (§4.7.4),
 * assembly (§4.7.5), partitions, and roof live (§4.8.2 not applied — conservative).
 */

/** §4.7.2: reduction applies only where KLL·AT ≥ 400 ft². */
export const LLR_MIN_INFLUENCE_AREA_FT2 = 400;

/** ASCE 7-16 Table 4.7-1, live load element factor KLL. */
export type KllElement =
  | 'interior-column'
  | 'exterior-column-without-cantilever-slab'
  | 'edge-column-with-cantilever-slab'
  | 'corner-column-with-cantilever-slab'
  | 'edge-beam-without-cantilever-slab'
  | 'interior-beam'
  | 'other';

export function kllTable4_7_1(element: KllElement): number {
  switch (element) {
    case 'interior-column':
    case 'exterior-column-without-cantilever-slab':
      return 4;
    case 'edge-column-with-cantilever-slab':
      return 3;
    case 'corner-column-with-cantilever-slab':
    case 'edge-beam-without-cantilever-slab':
    case 'interior-beam':
      return 2;
    case 'other':
      return 1;
  }
}

/** ASCE 7-16 Eq. 4.7-1 as a factor on L0: 0.25 + 15/sqrt(KLL·AT), before limits. */
export function eq4_7_1Factor(kll: number, atFt2: number): number {
  return 0.25 + 15 / Math.sqrt(kll * atFt2);
}

/** Reduction factor L/L0 for a member with influence area KLL·AT supporting `floors` floors. */
export function liveLoadReductionFactor(kll: number, atFt2: number, floors: number): number {
  if (!(atFt2 > 0) || kll * atFt2 < LLR_MIN_INFLUENCE_AREA_FT2) return 1;
  const limit = floors >= 2 ? 0.4 : 0.5;
  return Math.min(1, Math.max(limit, eq4_7_1Factor(kll, atFt2)));
}
