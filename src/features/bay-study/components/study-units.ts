/**
 * The Trial framings panel's figures in the reader's units. The study arrives in US units
 * (ft, in, lb, lb/ft² of floor, ksi); with SI shown, spacings read in m (to the centimetre),
 * depths in mm (whole), steel per floor area in kg/m² (to 0.1), scheme steel in tonnes
 * (1000 kg, to 0.01) and Fy in MPa (whole). Money stays in dollars.
 *
 * Factors: NIST SP 811 (2008) Appendix B, from exact definitions (src/lib/units.ts):
 * 1 ft = 0.3048 m, 1 in = 25.4 mm, 1 lb = 0.45359237 kg, so 1 lb/ft² = 4.882428 kg/m²;
 * 1 ksi = 6.894757 MPa.
 */
import { FT_M, IN_MM, LB_KG, SI_FACTORS, type UnitSystem } from '../../../lib/units';

const LB_FT2_KG_M2 = LB_KG / (FT_M * FT_M);
const KSI_MPA = SI_FACTORS.stress_ksi;

const fixed = (v: number, digits: number) => {
  const t = v.toFixed(digits);
  return /^-0(\.0+)?$/.test(t) ? t.slice(1) : t;
};
/** Up to one decimal, no trailing ".0" (US feet and inches as typed: 10, 10.5). */
const short = (v: number) => String(Math.round(v * 10) / 10);

export interface StudyUnits {
  system: UnitSystem;
  lengthUnit: 'ft' | 'm';
  depthUnit: 'in' | 'mm';
  perAreaUnit: 'psf' | 'kg/m²';
  bigUnit: 'tons' | 'tonnes';
  stressUnit: 'ksi' | 'MPa';
  /** A spacing or bay dimension, ft → "10" ft or "3.05" m (number only). */
  length: (ft: number) => string;
  /** A depth, in → "18.0" in or "457" mm (number only). */
  depth: (inch: number) => string;
  /** Steel per floor area, lb/ft² → "5.42" psf or "26.5" kg/m² (number only), and its value for the chart. */
  perArea: (lbFt2: number) => string;
  perAreaValue: (lbFt2: number) => number;
  /** Scheme steel, lb → "12.34" tons or "11.19" tonnes (number only). */
  big: (lb: number) => string;
  /** Fy, ksi → "50" ksi or "345" MPa (number only). */
  stress: (ksi: number) => string;
  /** A length typed in the shown unit → ft. */
  lengthIn: (shown: number) => number;
  /** A depth typed in the shown unit → in. */
  depthIn: (shown: number) => number;
  /**
   * Fy typed in the shown unit → ksi. MPa convert down to 0.1 ksi (345 MPa → 50.0 ksi, not
   * 50.04): rounding a yield stress down is the conservative reading.
   */
  stressIn: (shown: number) => number;
  /** The defaults of the spacing range (6–15 ft by 1; 2–4.5 m by 0.5) as typed text. */
  defaultRange: { from: string; to: string; step: string };
}

export function studyUnits(system: UnitSystem): StudyUnits {
  if (system === 'SI') {
    return {
      system, lengthUnit: 'm', depthUnit: 'mm', perAreaUnit: 'kg/m²', bigUnit: 'tonnes', stressUnit: 'MPa',
      length: (ft) => fixed(ft * FT_M, 2),
      depth: (inch) => fixed(inch * IN_MM, 0),
      perArea: (v) => fixed(v * LB_FT2_KG_M2, 1),
      perAreaValue: (v) => Math.round(v * LB_FT2_KG_M2 * 10) / 10,
      big: (lb) => fixed((lb * LB_KG) / 1000, 2),
      stress: (ksi) => fixed(ksi * KSI_MPA, 0),
      lengthIn: (m) => m / FT_M,
      depthIn: (mm) => mm / IN_MM,
      stressIn: (mpa) => Math.floor((mpa / KSI_MPA) * 10 + 1e-9) / 10,
      defaultRange: { from: '2', to: '4.5', step: '0.5' },
    };
  }
  return {
    system, lengthUnit: 'ft', depthUnit: 'in', perAreaUnit: 'psf', bigUnit: 'tons', stressUnit: 'ksi',
    length: short,
    depth: (inch) => fixed(inch, 1),
    perArea: (v) => fixed(v, 2),
    perAreaValue: (v) => Math.round(v * 100) / 100,
    big: (lb) => fixed(lb / 2000, 2),
    stress: short,
    lengthIn: (ft) => ft,
    depthIn: (inch) => inch,
    stressIn: (ksi) => ksi,
    defaultRange: { from: '6', to: '15', step: '1' },
  };
}
