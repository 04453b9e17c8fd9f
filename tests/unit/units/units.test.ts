import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  FT_M, KIP_KN, LB_KG, LBF_N, SI_FACTORS, STANDARD_GRAVITY_M_S2,
  formatQuantity, formatValue, fromDisplay, parseQuantity, toDisplay, unitLabel, type QuantityKind,
} from '../../../src/lib/units';

const KINDS = Object.keys(SI_FACTORS) as QuantityKind[];

/** Relative agreement to n significant digits (NIST SP 811 prints 7). */
function agreesTo(actual: number, printed: number, digits = 7): boolean {
  return Math.abs(actual - printed) <= 0.5 * 10 ** (Math.floor(Math.log10(Math.abs(printed))) - digits + 1);
}

describe('conversion factors', () => {
  it('when derived from the exact definitions, then lbf is 0.45359237 kg × 9.80665 m/s²', () => {
    // NIST SP 811 (2008) B.9: pound (avoirdupois) = 0.453 592 37 kg exactly; g_n = 9.806 65 m/s² exactly.
    expect(LBF_N).toBeCloseTo(LB_KG * STANDARD_GRAVITY_M_S2, 14);
    expect(FT_M).toBe(0.3048); // NIST SP 811 B.8: foot = 3.048 E-01 m (exact)
  });

  it('when compared with NIST SP 811 Appendix B.8 printed factors, then each agrees to the 7 printed digits', () => {
    expect(agreesTo(KIP_KN * 1000, 4.448222e3)).toBe(true); // kip (1000 lbf) = 4.448 222 E+03 N
    expect(agreesTo(SI_FACTORS.pressure_psf * 1000, 4.788026e1)).toBe(true); // lbf/ft² = 4.788 026 E+01 Pa
    expect(agreesTo(SI_FACTORS.stress_ksi * 1e6, 6.894757e6)).toBe(true); // kip/in² = 6.894 757 E+06 Pa
    expect(agreesTo(SI_FACTORS.moment_kipft, 1.355818)).toBe(true); // lbf·ft = 1.355 818 N·m, so kip·ft = 1.355 818 kN·m
    expect(agreesTo(SI_FACTORS.lineLoad_klf, 1.459390e1)).toBe(true); // lbf/ft = 1.459 390 E+01 N/m, so kip/ft = 14.593 90 kN/m
    expect(agreesTo(SI_FACTORS.weight_plf, 1.488164)).toBe(true); // lb/ft = 1.488 164 kg/m
    expect(SI_FACTORS.area_ft2).toBeCloseTo(0.09290304, 15); // ft² = 9.290 304 E-02 m² (exact)
    expect(SI_FACTORS.length_in).toBe(25.4); // inch = 2.54 E-02 m (exact)
    expect(SI_FACTORS.area_in2).toBeCloseTo(645.16, 10); // in² = 6.4516 E-04 m² (exact)
    expect(SI_FACTORS.inertia_in4).toBeCloseTo(0.4162314256, 12); // in⁴ = 4.162 314 E-07 m⁴ (exact: 25.4⁴ = 416 231.4256 mm⁴)
  });

  it('when a factor is wrong by one digit in the 7th place, then the comparison helper notices', () => {
    expect(agreesTo(4.448232e3, 4.448222e3)).toBe(false);
  });
});

describe('known values', () => {
  it('when 50 ksi is shown in SI, then it is 344.7 MPa (ASTM A992/A992M Grade 50 [345], recalled from memory)', () => {
    expect(formatQuantity('stress_ksi', 50, 'SI')).toBe('344.7 MPa');
    expect(formatQuantity('stress_ksi', 36, 'SI')).toBe('248.2 MPa'); // A36 [250] metric grade, recalled from memory
  });

  it('when ASCE 7-16 Table 4.3-1 live loads are shown in SI, then they match its kN/m² values (recalled from memory)', () => {
    expect(formatValue('pressure_psf', 50, 'SI')).toBe('2.39'); // offices 50 psf (2.40 kN/m² as printed, rounded up there)
    expect(formatValue('pressure_psf', 100, 'SI')).toBe('4.79'); // lobbies 100 psf (4.79 kN/m²)
    expect(formatValue('pressure_psf', 125, 'SI')).toBe('5.99'); // light storage 125 psf (6.00 kN/m²)
  });

  it('when W18X50 weight is shown in SI, then it is 74.4 kg/m (AISC metric designation W460X74, recalled from memory)', () => {
    expect(formatQuantity('weight_plf', 50, 'SI')).toBe('74.4 kg/m');
  });

  it('when lengths are converted, then 30 ft is 9.144 m and 21 in is 533.4 mm exactly', () => {
    expect(toDisplay('length_ft', 30, 'SI')).toBeCloseTo(9.144, 12); // 30 × 0.3048, exact
    expect(toDisplay('length_in', 21, 'SI')).toBeCloseTo(533.4, 12); // 21 × 25.4, exact
    expect(formatQuantity('length_ft', 30, 'SI')).toBe('9.144 m');
  });

  it('when forces and moments are converted, then 10 kip is 44.48 kN and 100 kip·ft is 135.58 kN·m', () => {
    expect(formatQuantity('force_kip', 10, 'SI', { digits: 2 })).toBe('44.48 kN'); // 10 × 4.448 222
    expect(formatQuantity('moment_kipft', 100, 'SI', { digits: 2 })).toBe('135.58 kN·m'); // 100 × 1.355 818
    expect(formatQuantity('lineLoad_klf', 1, 'SI', { digits: 3 })).toBe('14.594 kN/m'); // 1 × 14.593 90
  });

  it('when US is chosen, then values are printed as they are, with the US unit', () => {
    expect(formatQuantity('moment_kipft', 325.835, 'US')).toBe('325.8 kip·ft');
    expect(formatQuantity('length_in', 0.6075, 'US')).toBe('0.61 in');
    expect(formatQuantity('weight_plf', 48, 'US')).toBe('48 lb/ft');
    expect(unitLabel('pressure_psf', 'US')).toBe('psf');
    expect(unitLabel('lineLoad_klf', 'SI')).toBe('kN/m');
  });

  it('when a value rounds to zero from below, then it prints without a minus sign', () => {
    expect(formatValue('force_kip', -0.01, 'US')).toBe('0.0');
    expect(formatValue('force_kip', -1.25, 'US')).toBe('-1.3');
    expect(formatValue('force_kip', -1.25, 'US', { absolute: true })).toBe('1.3');
    expect(formatValue('force_kip', Number.NaN, 'US')).toBe('—');
  });
});

describe('round trips', () => {
  it('when any value is shown and read back in either system, then the internal value is recovered to 1e-12', () => {
    fc.assert(
      fc.property(fc.constantFrom(...KINDS), fc.constantFrom('US' as const, 'SI' as const), fc.double({ min: -1e6, max: 1e6, noNaN: true }), (kind, system, v) => {
        const back = fromDisplay(kind, toDisplay(kind, v, system), system);
        expect(Math.abs(back - v)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(v)));
      }),
    );
  });

  it('when a formatted value is parsed again, then it is within half a printed digit of the original', () => {
    fc.assert(
      fc.property(fc.constantFrom(...KINDS), fc.constantFrom('US' as const, 'SI' as const), fc.double({ min: 0, max: 1e5, noNaN: true }), (kind, system, v) => {
        const text = formatQuantity(kind, v, system, { digits: 6 });
        const parsed = parseQuantity(kind, text, system);
        expect(parsed.ok).toBe(true);
        if (parsed.ok) expect(Math.abs(toDisplay(kind, parsed.value, system) - toDisplay(kind, v, system))).toBeLessThanOrEqual(0.5e-6 + 1e-9);
      }),
    );
  });
});

describe('parseQuantity', () => {
  it('when a plain number is typed, then it is read in the chosen system', () => {
    expect(parseQuantity('length_in', '533.4', 'SI')).toEqual({ ok: true, value: expect.closeTo(21, 12) });
    expect(parseQuantity('length_in', '21', 'US')).toEqual({ ok: true, value: 21 });
  });

  it('when a unit of either system is written, then that unit is honoured', () => {
    const r = parseQuantity('length_in', '21 in', 'SI');
    expect(r).toEqual({ ok: true, value: 21 });
    expect(parseQuantity('force_kip', '44.482216152605 kN', 'US')).toEqual({ ok: true, value: expect.closeTo(10, 12) });
    expect(parseQuantity('moment_kipft', '12 kip-ft', 'SI')).toEqual({ ok: true, value: 12 });
  });

  it("when feet and inches are typed for a length in feet, then 12'-6\" is 12.5 ft", () => {
    expect(parseQuantity('length_ft', `12'-6"`, 'US')).toEqual({ ok: true, value: 12.5 });
    expect(parseQuantity('length_ft', `12' 3"`, 'US')).toEqual({ ok: true, value: 12.25 });
    expect(parseQuantity('length_ft', `7'`, 'US')).toEqual({ ok: true, value: 7 });
    expect(parseQuantity('length_ft', `12'-13"`, 'US')).toMatchObject({ ok: false, error: expect.stringContaining('Inches') });
  });

  it('when the text is not a number, names a foreign unit or uses a comma, then the error says what is expected', () => {
    expect(parseQuantity('force_kip', '', 'SI')).toEqual({ ok: false, error: 'Enter a value in kN' });
    expect(parseQuantity('force_kip', 'abc', 'US')).toEqual({ ok: false, error: 'Enter a number in kip' });
    expect(parseQuantity('length_in', 'abc', 'US')).toEqual({ ok: false, error: 'Enter a number in inches' });
    expect(parseQuantity('length_in', '', 'US')).toEqual({ ok: false, error: 'Enter a value in inches' });
    expect(parseQuantity('force_kip', '12 psf', 'US')).toMatchObject({ ok: false, error: expect.stringContaining('use kip or kN') });
    expect(parseQuantity('pressure_psf', '2,4', 'SI')).toMatchObject({ ok: false, error: expect.stringContaining('point for decimals') });
    expect(parseQuantity('force_kip', '1.2.3', 'US')).toMatchObject({ ok: false });
  });
});
