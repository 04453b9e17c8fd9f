/**
 * AISC 360-16 Section I8: steel headed stud anchors in composite beams.
 * Units: in, in², ksi, kip.
 */

/** Asa, cross-sectional area of a stud of diameter d (in²). */
export const studAreaIn2 = (diameterIn: number): number => (Math.PI * diameterIn * diameterIn) / 4;

/** AISC 360-16 Eq. I8-1: Qn = 0.5 Asa √(f'c Ec) ≤ Rg Rp Asa Fu (kip per stud). */
export function eqI8_1(asaIn2: number, fcKsi: number, ecKsi: number, rg: number, rp: number, fuKsi: number): { qnKip: number; concreteKip: number; steelKip: number; governs: 'concrete' | 'anchor' } {
  const concreteKip = 0.5 * asaIn2 * Math.sqrt(fcKsi * ecKsi);
  const steelKip = rg * rp * asaIn2 * fuKsi;
  return concreteKip <= steelKip
    ? { qnKip: concreteKip, concreteKip, steelKip, governs: 'concrete' }
    : { qnKip: steelKip, concreteKip, steelKip, governs: 'anchor' };
}

export type DeckOrientation = 'perpendicular' | 'parallel' | 'none';

/**
 * Rg and Rp of AISC 360-16 I8.2a.
 * - No deck: Rg = 1.0, Rp = 0.75.
 * - Deck ribs parallel to the beam: Rg = 1.0 when wr/hr ≥ 1.5, else 0.85; Rp = 0.75.
 * - Deck ribs perpendicular: Rg = 1.0 (one stud per rib), 0.85 (two), 0.7 (three or more);
 *   Rp = 0.75 when emid-ht ≥ 2 in., 0.6 when emid-ht < 2 in. The engine does not know where in
 *   the rib the stud sits (strong or weak position), so it takes Rp = 0.6 for perpendicular
 *   deck unless emid-ht is given: the conservative reading.
 */
export function rgRpI8_2a(orientation: DeckOrientation, studsPerRib: number, wrIn: number, hrIn: number, emidHtIn: number | null = null): { rg: number; rp: number; basis: string } {
  if (orientation === 'none') return { rg: 1.0, rp: 0.75, basis: 'no deck: Rg = 1.0, Rp = 0.75 (AISC 360-16 I8.2a)' };
  if (orientation === 'parallel') {
    const ratio = wrIn / hrIn;
    const rg = ratio >= 1.5 ? 1.0 : 0.85;
    return { rg, rp: 0.75, basis: `deck parallel, wr/hr = ${ratio.toFixed(2)} ${ratio >= 1.5 ? '≥' : '<'} 1.5: Rg = ${rg}, Rp = 0.75 (AISC 360-16 I8.2a)` };
  }
  const n = Math.max(1, Math.floor(studsPerRib));
  const rg = n === 1 ? 1.0 : n === 2 ? 0.85 : 0.7;
  const rp = emidHtIn !== null && emidHtIn >= 2 ? 0.75 : 0.6;
  const rpText = emidHtIn === null ? 'Rp = 0.6 (stud position in the rib not known: conservative)' : `emid-ht = ${emidHtIn} in.: Rp = ${rp}`;
  return { rg, rp, basis: `deck perpendicular, ${n} stud${n === 1 ? '' : 's'} per rib: Rg = ${rg}; ${rpText} (AISC 360-16 I8.2a)` };
}

/**
 * AISC 360-16 I8.2d spacing limits along the beam: minimum 6 d (center to center), maximum the
 * lesser of 8 times the total slab thickness and 36 in. (in).
 */
export function spacingLimitsI8_2d(diameterIn: number, slabTotalIn: number): { minIn: number; maxIn: number } {
  return { minIn: 6 * diameterIn, maxIn: Math.min(8 * slabTotalIn, 36) };
}
