// Display units at the edges of the client. Everything inside Baywright (engine, API, plan
// files) is US customary with the unit in the name (kip, ft, in, ksi, psf, plf, klf, kip-ft);
// this module only turns those numbers into text for the reader, and text typed by the
// reader back into them. Pure functions, no React (the hook lives in units-context.tsx).
//
// Conversion factors: NIST Special Publication 811 (2008 edition), "Guide for the Use of the
// International System of Units", Appendix B.8/B.9. Every factor below is derived from four
// exact definitions, so it carries no rounding of its own:
//   1 ft  = 0.3048 m            (exact, international foot)
//   1 in  = 25.4 mm             (exact)
//   1 lb  = 0.45359237 kg       (exact, avoirdupois pound)
//   g_n   = 9.80665 m/s²        (exact, standard acceleration of gravity)
//   1 lbf = 1 lb × g_n = 4.4482216152605 N (exact); 1 kip = 1000 lbf.
// NIST SP 811 prints these derived factors to 7 digits (tests check against them):
//   kip → 4.448 222 E+03 N; lbf/ft² → 4.788 026 E+01 Pa; kip/in² → 6.894 757 E+06 Pa;
//   lbf·ft → 1.355 818 N·m; lbf/ft → 1.459 390 E+01 N/m; lb/ft → 1.488 164 kg/m;
//   ft² → 9.290 304 E-02 m² (exact); in² → 6.4516 E-04 m² (exact).

export type UnitSystem = 'US' | 'SI';
export const UNIT_SYSTEMS: readonly UnitSystem[] = ['US', 'SI'];
export const DEFAULT_UNIT_SYSTEM: UnitSystem = 'US';

export function isUnitSystem(value: unknown): value is UnitSystem {
  return value === 'US' || value === 'SI';
}

/** Quantity kinds, named after the internal (US) unit the number carries. */
export type QuantityKind =
  | 'length_ft'
  | 'length_in'
  | 'area_ft2'
  | 'area_in2'
  | 'inertia_in4'
  | 'force_kip'
  | 'lineLoad_klf'
  | 'pressure_psf'
  | 'moment_kipft'
  | 'stress_ksi'
  | 'weight_plf';

export const CONVERSION_SOURCE = 'NIST Special Publication 811 (2008 ed.), Appendix B';

/** Exact by definition (NIST SP 811 Appendix B). */
export const FT_M = 0.3048;
export const IN_MM = 25.4;
export const LB_KG = 0.45359237;
export const STANDARD_GRAVITY_M_S2 = 9.80665;
/** lbf → N, exact: 0.45359237 kg × 9.80665 m/s². */
export const LBF_N = 4.4482216152605;
export const KIP_KN = LBF_N; // 1000 lbf → 1000 N·4.448… = 4.448… kN

/** Factor from the internal US unit to the SI display unit: si = us × factor. */
export const SI_FACTORS: Readonly<Record<QuantityKind, number>> = {
  length_ft: FT_M, // ft → m
  length_in: IN_MM, // in → mm
  area_ft2: FT_M * FT_M, // ft² → m²
  area_in2: IN_MM * IN_MM, // in² → mm²
  inertia_in4: (IN_MM * IN_MM * IN_MM * IN_MM) / 1e6, // in⁴ → 10⁶ mm⁴
  force_kip: KIP_KN, // kip → kN
  lineLoad_klf: KIP_KN / FT_M, // kip/ft → kN/m
  pressure_psf: LBF_N / (FT_M * FT_M) / 1000, // lbf/ft² → kPa
  moment_kipft: KIP_KN * FT_M, // kip·ft → kN·m
  stress_ksi: KIP_KN / ((IN_MM / 1000) * (IN_MM / 1000)) / 1000, // kip/in² → MPa (kN/m² ÷ 1000)
  weight_plf: LB_KG / FT_M, // lb/ft → kg/m (section mass per length, as SI catalogs list it)
};

interface UnitSpec {
  /** Printed unit. */
  unit: string;
  /** Decimals printed by default. */
  digits: number;
  /** Other spellings accepted when parsing (compared case-insensitively, spaces removed). */
  aliases: string[];
}

const US: Readonly<Record<QuantityKind, UnitSpec>> = {
  length_ft: { unit: 'ft', digits: 2, aliases: ['ft', 'feet', 'foot', "'"] },
  length_in: { unit: 'in', digits: 2, aliases: ['in', 'inch', 'inches', '"'] },
  area_ft2: { unit: 'ft²', digits: 0, aliases: ['ft²', 'ft2', 'sqft', 'sf'] },
  area_in2: { unit: 'in²', digits: 2, aliases: ['in²', 'in2', 'sqin'] },
  inertia_in4: { unit: 'in⁴', digits: 0, aliases: ['in⁴', 'in4'] },
  force_kip: { unit: 'kip', digits: 1, aliases: ['kip', 'kips', 'k'] },
  lineLoad_klf: { unit: 'kip/ft', digits: 3, aliases: ['kip/ft', 'klf', 'k/ft', 'kips/ft'] },
  pressure_psf: { unit: 'psf', digits: 1, aliases: ['psf', 'lb/ft²', 'lb/ft2', 'lbf/ft2', 'lbf/ft²'] },
  moment_kipft: { unit: 'kip·ft', digits: 1, aliases: ['kip·ft', 'kip-ft', 'kipft', 'k-ft', 'kft', 'ft-kip', 'ft·kip'] },
  stress_ksi: { unit: 'ksi', digits: 1, aliases: ['ksi', 'kip/in²', 'kip/in2'] },
  weight_plf: { unit: 'lb/ft', digits: 0, aliases: ['lb/ft', 'plf', 'lbs/ft'] },
};

const SI: Readonly<Record<QuantityKind, UnitSpec>> = {
  length_ft: { unit: 'm', digits: 3, aliases: ['m'] },
  length_in: { unit: 'mm', digits: 1, aliases: ['mm'] },
  area_ft2: { unit: 'm²', digits: 1, aliases: ['m²', 'm2', 'sqm'] },
  area_in2: { unit: 'mm²', digits: 0, aliases: ['mm²', 'mm2'] },
  inertia_in4: { unit: '10⁶ mm⁴', digits: 1, aliases: ['10⁶mm⁴', '10^6mm4', 'e6mm4'] },
  force_kip: { unit: 'kN', digits: 1, aliases: ['kn'] },
  lineLoad_klf: { unit: 'kN/m', digits: 2, aliases: ['kn/m'] },
  pressure_psf: { unit: 'kPa', digits: 2, aliases: ['kpa', 'kn/m²', 'kn/m2'] },
  moment_kipft: { unit: 'kN·m', digits: 1, aliases: ['kn·m', 'kn-m', 'knm', 'kn.m'] },
  stress_ksi: { unit: 'MPa', digits: 1, aliases: ['mpa', 'n/mm²', 'n/mm2'] },
  weight_plf: { unit: 'kg/m', digits: 1, aliases: ['kg/m'] },
};

function spec(kind: QuantityKind, system: UnitSystem): UnitSpec {
  return (system === 'SI' ? SI : US)[kind];
}

/** The printed unit of a kind in a system, e.g. unitLabel('moment_kipft', 'SI') = "kN·m". */
export function unitLabel(kind: QuantityKind, system: UnitSystem): string {
  return spec(kind, system).unit;
}

/** Default decimals printed for a kind in a system. */
export function defaultDigits(kind: QuantityKind, system: UnitSystem): number {
  return spec(kind, system).digits;
}

/** Internal US value → the number shown in the chosen system. */
export function toDisplay(kind: QuantityKind, valueUS: number, system: UnitSystem): number {
  return system === 'SI' ? valueUS * SI_FACTORS[kind] : valueUS;
}

/** A number in the chosen system → the internal US value. */
export function fromDisplay(kind: QuantityKind, valueShown: number, system: UnitSystem): number {
  return system === 'SI' ? valueShown / SI_FACTORS[kind] : valueShown;
}

export interface FormatOptions {
  /** Decimals; default per kind and system. */
  digits?: number;
  /** Print the absolute value (for labels that already say the direction). */
  absolute?: boolean;
}

/** The number only, fixed decimals, never "-0.00". */
export function formatValue(kind: QuantityKind, valueUS: number, system: UnitSystem, options: FormatOptions = {}): string {
  if (!Number.isFinite(valueUS)) return '—';
  const digits = options.digits ?? defaultDigits(kind, system);
  let shown = toDisplay(kind, valueUS, system);
  if (options.absolute) shown = Math.abs(shown);
  const text = shown.toFixed(digits);
  return /^-0(\.0+)?$/.test(text) ? text.slice(1) : text;
}

/** Number and unit, e.g. "325.8 kip·ft" or "441.8 kN·m". */
export function formatQuantity(kind: QuantityKind, valueUS: number, system: UnitSystem, options: FormatOptions = {}): string {
  const value = formatValue(kind, valueUS, system, options);
  return value === '—' ? value : `${value} ${unitLabel(kind, system)}`;
}

export type ParseResult = { ok: true; value: number } | { ok: false; error: string };

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)$/;
const FEET_INCHES = /^([+-]?\d+(?:\.\d+)?)\s*'\s*-?\s*(?:(\d+(?:\.\d+)?)\s*(?:"|in)?)?$/i;

function normaliseUnit(text: string): string {
  return text.replace(/\s+/g, '').toLowerCase();
}

function unitSystemOf(kind: QuantityKind, unitText: string): UnitSystem | null {
  const u = normaliseUnit(unitText);
  if (US[kind].aliases.some((a) => normaliseUnit(a) === u)) return 'US';
  if (SI[kind].aliases.some((a) => normaliseUnit(a) === u) || normaliseUnit(SI[kind].unit) === u) return 'SI';
  return null;
}

/** "in kip", but "in inches" where the unit is the inch ("Enter a number in in" reads as a typo). */
function inUnit(unit: string): string {
  return unit === 'in' ? 'in inches' : `in ${unit}`;
}

/**
 * Reads what a person typed into a field of this kind and returns the internal US value.
 * Plain numbers are in the chosen system's unit; a unit written after the number (of either
 * system, e.g. "21 in" while showing SI) is honoured. US lengths in feet also accept
 * feet-and-inches: 12'-6", 12' 6", 12'. Commas are refused rather than guessed at.
 */
export function parseQuantity(kind: QuantityKind, text: string, system: UnitSystem): ParseResult {
  const shownUnit = unitLabel(kind, system);
  const raw = text.trim();
  if (raw === '') return { ok: false, error: `Enter a value ${inUnit(shownUnit)}` };
  if (raw.includes(',')) return { ok: false, error: `Use a point for decimals and no thousands separators (value in ${shownUnit})` };

  if (kind === 'length_ft') {
    const fi = FEET_INCHES.exec(raw);
    if (fi) {
      const feet = Number(fi[1]);
      const inches = fi[2] === undefined ? 0 : Number(fi[2]);
      if (inches >= 12) return { ok: false, error: 'Inches must be less than 12 in a feet-and-inches value' };
      const sign = raw.trim().startsWith('-') ? -1 : 1;
      return { ok: true, value: feet + (sign * inches) / 12 };
    }
  }

  const match = /^([+-]?(?:\d+(?:\.\d*)?|\.\d+))\s*(.*)$/.exec(raw);
  if (!match || !NUMBER.test(match[1])) return { ok: false, error: `Enter a number ${inUnit(shownUnit)}` };
  const number = Number(match[1]);
  if (!Number.isFinite(number)) return { ok: false, error: `Enter a number ${inUnit(shownUnit)}` };
  const unitText = match[2].trim();
  if (unitText === '') return { ok: true, value: fromDisplay(kind, number, system) };
  const written = unitSystemOf(kind, unitText);
  if (written === null) {
    return { ok: false, error: `"${unitText}" is not a unit for this value; use ${unitLabel(kind, 'US')} or ${unitLabel(kind, 'SI')}` };
  }
  return { ok: true, value: fromDisplay(kind, number, written) };
}

/**
 * A level elevation as drawings give it: feet and inches to the nearest 1/4 in in US
 * ("14'-0""), metres to the centimetre in SI ("4.27 m"), never the raw conversion.
 */
export function formatElevation(valueFt: number, system: UnitSystem): string {
  if (!Number.isFinite(valueFt)) return '—';
  if (system === 'SI') return formatQuantity('length_ft', valueFt, 'SI', { digits: 2 });
  const sign = valueFt < 0 ? '−' : '';
  const quarters = Math.round(Math.abs(valueFt) * 48);
  const feet = Math.floor(quarters / 48);
  const inQuarters = quarters - feet * 48;
  const inches = Math.floor(inQuarters / 4);
  const frac = ['', ' 1/4', ' 1/2', ' 3/4'][inQuarters % 4];
  return `${sign}${feet}'-${inches}${frac}"`;
}
