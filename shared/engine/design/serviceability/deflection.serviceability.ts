import { E_KSI, IN3_PER_FT3, IN_PER_FT } from '../../units/units.constants';

/**
 * Serviceability: deflection under unfactored loads against span/n (limits from IBC Table
 * 1604.3 as project defaults). Live = each transient case alone (L, Lr or S; the largest is
 * reported), total = all cases together (calc-interface.md), self weight included as D.
 */

/** Deflection in inches from EI·y in kip·ft³ (E = 29,000 ksi). */
export function deflectionIn(eiKipFt3: number, ixIn4: number): number {
  return (eiKipFt3 * IN3_PER_FT3) / (E_KSI * ixIn4);
}

/** Allowable deflection span/n in inches. */
export function deflectionLimitIn(spanFt: number, n: number): number {
  return (spanFt * IN_PER_FT) / n;
}

/** Demand over allowable; null when the limit is not checked. */
export function deflectionRatio(deflIn: number, spanFt: number, n: number | null): number | null {
  return n == null ? null : deflIn / deflectionLimitIn(spanFt, n);
}

export const DEFLECTION_CLAUSE = 'IBC Table 1604.3 (serviceability)';
