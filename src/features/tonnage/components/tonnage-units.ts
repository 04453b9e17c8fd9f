/**
 * Tonnage figures in the reader's units. The comparison arrives in US units (lb, short tons
 * of 2000 lb, lb/ft² of floor, ft²); with SI shown, weights read in kg and tonnes (1000 kg)
 * and steel per floor area in kg/m². Money stays in dollars; the exports keep their own units.
 *
 * Factors, NIST SP 811 (2008) Appendix B, from exact definitions: 1 lb = 0.45359237 kg,
 * 1 ft = 0.3048 m, so 1 lb/ft² = 4.882428 kg/m² and 1 short ton = 907.18474 kg.
 */
import { formatEstimateUsd, type TonnageDifference } from '../../../../shared/tonnage/cost';
import { FT_M, LB_KG, type UnitSystem } from '../../../lib/units';

export const LB_PER_SHORT_TON = 2000;
export const KG_PER_SHORT_TON = LB_PER_SHORT_TON * LB_KG;
/** lb/ft² → kg/m² (mass of steel per floor area, not a pressure). */
export const LB_FT2_TO_KG_M2 = LB_KG / (FT_M * FT_M);

const one = new Intl.NumberFormat('en-US', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
const two = new Intl.NumberFormat('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 });

export interface TonnageUnits {
  /** Large weight (short tons or tonnes) from lb. */
  big: (lb: number) => number;
  bigUnit: string;
  /** Small weight (lb or kg) from lb. */
  small: (lb: number) => number;
  smallUnit: string;
  /** Steel per floor area (lb/ft² as psf, or kg/m²) from lb/ft². */
  perArea: (lbFt2: number) => number;
  perAreaUnit: string;
  perAreaFmt: Intl.NumberFormat;
  /** Floor area (ft² or m²) from ft². */
  area: (ft2: number) => number;
  areaUnit: string;
}

export function tonnageUnits(system: UnitSystem): TonnageUnits {
  if (system === 'SI') {
    return {
      big: (lb) => (lb * LB_KG) / 1000,
      bigUnit: 'tonnes',
      small: (lb) => lb * LB_KG,
      smallUnit: 'kg',
      perArea: (lbFt2) => lbFt2 * LB_FT2_TO_KG_M2,
      perAreaUnit: 'kg/m²',
      perAreaFmt: one,
      area: (ft2) => ft2 * FT_M * FT_M,
      areaUnit: 'm²',
    };
  }
  return {
    big: (lb) => lb / LB_PER_SHORT_TON,
    bigUnit: 'tons',
    small: (lb) => lb,
    smallUnit: 'lb',
    perArea: (lbFt2) => lbFt2,
    perAreaUnit: 'psf',
    perAreaFmt: two,
    area: (ft2) => ft2,
    areaUnit: 'ft²',
  };
}

function pctText(pct: number): string {
  const a = Math.abs(pct);
  return a > 0 && a < 1 ? `${a.toFixed(1)} %` : `${Math.round(a)} %`;
}

/**
 * The SI form of the sentence a manager reads ("Scheme B is 3.8 tonnes (7 %) lighter and
 * $13,900 cheaper than Scheme A."): same rules as the US sentence in shared/tonnage/cost.ts,
 * weights to 0.1 tonne, percent whole, dollars to $100.
 */
export function describeDifferenceSi(otherName: string, baseName: string, d: TonnageDifference): string {
  const tonnes = (d.steelWeight_lb * LB_KG) / 1000;
  const sameWeight = Math.abs(tonnes) < 0.05;
  const pct = d.steelWeight_pct === null ? '' : ` (${pctText(d.steelWeight_pct)})`;
  const weight = `${one.format(Math.abs(tonnes))} tonnes${pct} ${d.steelWeight_lb < 0 ? 'lighter' : 'heavier'}`;
  const roundedUsd = d.cost_usd === null ? null : Math.round(Math.abs(d.cost_usd) / 100) * 100;
  const cost = roundedUsd === null || roundedUsd === 0 ? null : `${formatEstimateUsd(roundedUsd)} ${d.cost_usd! < 0 ? 'cheaper' : 'more expensive'}`;
  const sameCost = roundedUsd === 0;
  if (sameWeight) {
    if (cost) return `${otherName} weighs about the same as ${baseName} (within 0.1 tonne) and is ${cost}.`;
    if (sameCost) return `${otherName} weighs and costs about the same as ${baseName}.`;
    return `${otherName} weighs about the same as ${baseName} (within 0.1 tonne).`;
  }
  if (cost) return `${otherName} is ${weight} and ${cost} than ${baseName}.`;
  if (sameCost) return `${otherName} is ${weight} than ${baseName} at about the same cost.`;
  return `${otherName} is ${weight} than ${baseName}.`;
}
