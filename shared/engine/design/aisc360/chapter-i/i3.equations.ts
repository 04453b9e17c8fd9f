/**
 * AISC 360-16 Section I3 (flexure of composite beams) and its Commentary, one function per
 * published rule. Units: in, in², in⁴, ksi, kip, kip-in (converted at the callers).
 */

/** Ec = wc^1.5 √f'c, ksi, with wc in pcf and f'c in ksi (AISC 360-16 Chapter I, I2.1b). */
export const concreteModulusKsi = (wcPcf: number, fcKsi: number): number => Math.pow(wcPcf, 1.5) * Math.sqrt(fcKsi);

/**
 * AISC 360-16 I3.1a: the effective width of the concrete slab each side of the beam centreline
 * is the least of one-eighth of the span, one-half the distance to the centreline of the adjacent
 * beam, and the distance to the edge of the slab. Returns the total of both sides (in).
 */
export function effectiveWidthI3_1a(spanIn: number, sides: readonly { toNextBeamIn: number | null; toEdgeIn: number | null }[]): { bIn: number; perSideIn: number[]; governs: string[] } {
  const perSideIn: number[] = [];
  const governs: string[] = [];
  for (const s of sides) {
    const options: [number, string][] = [[spanIn / 8, 'span/8']];
    if (s.toNextBeamIn !== null) options.push([s.toNextBeamIn / 2, 'half the distance to the next beam']);
    if (s.toEdgeIn !== null) options.push([s.toEdgeIn, 'distance to the slab edge']);
    let best = options[0];
    for (const o of options) if (o[0] < best[0]) best = o;
    perSideIn.push(Math.max(0, best[0]));
    governs.push(best[1]);
  }
  return { bIn: perSideIn.reduce((a, b) => a + b, 0), perSideIn, governs };
}

/**
 * AISC 360-16 Commentary Eq. C-I3-2: Y_ENA = [As d3 + (ΣQn/Fy)(2 d3 + d1)] / [As + ΣQn/Fy]
 * (in, measured from the bottom of the steel section).
 */
export function eqC_I3_2(asIn2: number, d3In: number, d1In: number, sumQnKip: number, fyKsi: number): number {
  const q = sumQnKip / fyKsi;
  return (asIn2 * d3In + q * (2 * d3In + d1In)) / (asIn2 + q);
}

/**
 * AISC 360-16 Commentary Eq. C-I3-1, the lower-bound moment of inertia:
 * I_LB = Is + As (Y_ENA − d3)² + (ΣQn/Fy)(2 d3 + d1 − Y_ENA)²  (in⁴).
 * d1: concrete compression force to the top of steel; d3: steel tension resultant (full section
 * in tension) to the top of steel, d/2 for a doubly symmetric shape.
 */
export function eqC_I3_1(isIn4: number, asIn2: number, d3In: number, d1In: number, sumQnKip: number, fyKsi: number): { ilbIn4: number; yEnaIn: number } {
  const yEnaIn = eqC_I3_2(asIn2, d3In, d1In, sumQnKip, fyKsi);
  const q = sumQnKip / fyKsi;
  const ilbIn4 = isIn4 + asIn2 * (yEnaIn - d3In) ** 2 + q * (2 * d3In + d1In - yEnaIn) ** 2;
  return { ilbIn4, yEnaIn };
}
