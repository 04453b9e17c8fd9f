import type { FlangeClass } from '../chapter-b/b4';
import { eqF3_1, eqF3_2, kcFromHtw } from './f3.equations';

export interface FlangeLocalBuckling {
  /** null when the flange is compact (F3 does not apply; F2 governs). */
  mnKipIn: number | null;
  equation: 'Eq. F3-1' | 'Eq. F3-2' | null;
  kc: number | null;
}

/**
 * AISC 360-16 F3.2, compression flange local buckling: Eq. F3-1 for noncompact flanges,
 * Eq. F3-2 for slender flanges. Compact flanges: limit state does not apply.
 */
export function flangeLocalBucklingF3_2(
  flangeClass: FlangeClass, mpKipIn: number, fyKsi: number, sxIn3: number, eKsi: number,
  lambdaF: number, lambdaPf: number, lambdaRf: number, hTw: number,
): FlangeLocalBuckling {
  if (flangeClass === 'compact') return { mnKipIn: null, equation: null, kc: null };
  if (flangeClass === 'noncompact') {
    return { mnKipIn: eqF3_1(mpKipIn, fyKsi, sxIn3, lambdaF, lambdaPf, lambdaRf), equation: 'Eq. F3-1', kc: null };
  }
  const kc = kcFromHtw(hTw);
  return { mnKipIn: eqF3_2(eKsi, kc, sxIn3, lambdaF), equation: 'Eq. F3-2', kc };
}
