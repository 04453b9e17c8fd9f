/**
 * AISC 360-16 Eq. F1-1, lateral-torsional buckling modification factor for a segment:
 * Cb = 12.5 Mmax / (2.5 Mmax + 3 MA + 4 MB + 3 MC), absolute moments at the segment's
 * maximum and its quarter, mid and three-quarter points. Returns 1.0 for a segment with no
 * moment (Cb = 1.0 is always permitted).
 */
export function eqF1_1(mMaxAbs: number, mAAbs: number, mBAbs: number, mCAbs: number): number {
  const den = 2.5 * mMaxAbs + 3 * mAAbs + 4 * mBAbs + 3 * mCAbs;
  if (!(mMaxAbs > 0) || !(den > 0)) return 1.0;
  return (12.5 * mMaxAbs) / den;
}
