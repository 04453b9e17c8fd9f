/**
 * AISC 360-16 Table B4.1b, width-to-thickness limits for members in flexure.
 * Case 10: flanges of rolled I-shapes; case 15: webs of doubly symmetric I-shapes.
 */
export type FlangeClass = 'compact' | 'noncompact' | 'slender';

/** Table B4.1b case 10: λpf = 0.38 sqrt(E/Fy). */
export const lambdaPfCase10 = (eKsi: number, fyKsi: number): number => 0.38 * Math.sqrt(eKsi / fyKsi);
/** Table B4.1b case 10: λrf = 1.0 sqrt(E/Fy). */
export const lambdaRfCase10 = (eKsi: number, fyKsi: number): number => 1.0 * Math.sqrt(eKsi / fyKsi);
/** Table B4.1b case 15: λpw = 3.76 sqrt(E/Fy). */
export const lambdaPwCase15 = (eKsi: number, fyKsi: number): number => 3.76 * Math.sqrt(eKsi / fyKsi);

export function classifyFlange(lambdaF: number, lambdaPf: number, lambdaRf: number): FlangeClass {
  if (lambdaF <= lambdaPf) return 'compact';
  if (lambdaF <= lambdaRf) return 'noncompact';
  return 'slender';
}

/**
 * AISC 360-16 Table B4.1a, width-to-thickness limits for members in axial compression.
 * Case 1: flanges of rolled I-shapes, λr = 0.56 sqrt(E/Fy) with λ = b/t = bf/2tf.
 * Case 5: webs of doubly symmetric I-shapes, λr = 1.49 sqrt(E/Fy) with λ = h/tw.
 */
export const lambdaRCompressionCase1 = (eKsi: number, fyKsi: number): number => 0.56 * Math.sqrt(eKsi / fyKsi);
export const lambdaRCompressionCase5 = (eKsi: number, fyKsi: number): number => 1.49 * Math.sqrt(eKsi / fyKsi);
