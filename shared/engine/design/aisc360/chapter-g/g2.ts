import { eqG2_1, eqG2_2, eqG2_3, eqG2_4, KV_UNSTIFFENED } from './g2.equations';

export type G2ShearCase = 'G2.1(a)' | 'G2.1(b)';

export interface G2ShearStrength {
  case: G2ShearCase;
  /** Equation that set Cv1: "Eq. G2-2", "Eq. G2-3" or "Eq. G2-4". */
  cv1Equation: 'Eq. G2-2' | 'Eq. G2-3' | 'Eq. G2-4';
  awIn2: number;
  hTw: number;
  /** 2.24 sqrt(E/Fy), the G2.1(a) limit. */
  hTwLimitA: number;
  kv: number | null;
  cv1: number;
  vnKip: number;
  phiV: number;
  omegaV: number;
}

/**
 * AISC 360-16 G2.1, shear strength of a rolled I-shape web without stiffeners (strong axis).
 * (a) h/tw ≤ 2.24 sqrt(E/Fy): φv = 1.00, Ωv = 1.50, Cv1 = 1.0.
 * (b) otherwise φv = 0.90, Ωv = 1.67, kv = 5.34, Cv1 by Eq. G2-3 / G2-4.
 */
export function shearStrengthG2_1(dIn: number, twIn: number, hTw: number, fyKsi: number, eKsi: number): G2ShearStrength {
  const awIn2 = dIn * twIn;
  const hTwLimitA = 2.24 * Math.sqrt(eKsi / fyKsi);
  if (hTw <= hTwLimitA) {
    const cv1 = eqG2_2();
    return { case: 'G2.1(a)', cv1Equation: 'Eq. G2-2', awIn2, hTw, hTwLimitA, kv: null, cv1, vnKip: eqG2_1(fyKsi, awIn2, cv1), phiV: 1.0, omegaV: 1.5 };
  }
  const kv = KV_UNSTIFFENED;
  const inelasticLimit = 1.1 * Math.sqrt((kv * eKsi) / fyKsi);
  const compact = hTw <= inelasticLimit;
  const cv1 = compact ? eqG2_3() : eqG2_4(kv, eKsi, fyKsi, hTw);
  return {
    case: 'G2.1(b)', cv1Equation: compact ? 'Eq. G2-3' : 'Eq. G2-4',
    awIn2, hTw, hTwLimitA, kv, cv1, vnKip: eqG2_1(fyKsi, awIn2, cv1), phiV: 0.9, omegaV: 1.67,
  };
}
