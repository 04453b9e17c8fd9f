import { describe, expect, it } from 'vitest';
import { fieldText } from '../../../src/features/editor/components/field-text';
import { measureText } from '../../../src/features/editor/canvas/draw-overlay';
import { lengthText, lineLoadText, pointLoadText } from '../../../src/features/editor/canvas/plan-theme';
import { scaleBar } from '../../../src/features/editor/canvas/view-transform';
import { offsetsFromSpacings, parseGridSpacings } from '../../../src/features/editor/tools/grid-spacings.parser';

// Conversion factors: 1 ft = 0.3048 m exact; 1 kip = 4.4482216 kN; 1 klf = 14.593903 kN/m;
// 1 psf = 0.04788026 kPa (NIST SP 811 Appendix B).

describe('grid from spacings in SI', () => {
  it('when SI is shown and "3@9.144" is typed, then three bays of exactly 30 ft are laid out (lines 30 ft apart)', () => {
    const r = parseGridSpacings('3@9.144', 'SI'); // 9.144 m / 0.3048 m/ft = 30 ft exact
    expect(r).toEqual({ ok: true, spacings_ft: [30, 30, 30] });
    expect(offsetsFromSpacings(r.ok ? r.spacings_ft : [], 0)).toEqual([0, 30, 60, 90]);
  });

  it('when SI is shown, then plain numbers are metres, "m" is accepted and a written "ft" is honoured', () => {
    expect(parseGridSpacings('2@10.9728 m, 8.5344', 'SI')).toEqual({ ok: true, spacings_ft: [36, 36, 28] }); // 10.9728 m = 36 ft, 8.5344 m = 28 ft
    expect(parseGridSpacings("30 ft, 25'", 'SI')).toEqual({ ok: true, spacings_ft: [30, 25] });
  });

  it('when US is shown, then "9.144 m" is still read as metres and plain numbers stay feet', () => {
    expect(parseGridSpacings('9.144 m, 30', 'US')).toEqual({ ok: true, spacings_ft: [30, 30] });
  });

  it('when an SI spacing is bad or too long, then the error speaks metres', () => {
    expect(parseGridSpacings('0', 'SI')).toEqual({ ok: false, error: '“0”: a spacing must be more than 0 m.' });
    // 200 ft = 60.96 m is the longest spacing allowed.
    expect(parseGridSpacings('61', 'SI')).toEqual({ ok: false, error: '“61”: 61 m is more than 60.96 m between grid lines.' });
    expect(parseGridSpacings('3@nine', 'SI')).toMatchObject({ ok: false, error: expect.stringContaining('count@metres (3@9.144)') });
    expect(parseGridSpacings('3mm', 'SI')).toMatchObject({ ok: false, error: expect.stringContaining('“3mm” is not a spacing') });
  });
});

describe('plan labels in the reader units', () => {
  it('when lengths are written, then US reads feet-and-inches and SI reads metres to the millimetre', () => {
    expect(lengthText(30, 'US')).toBe(`30'-0"`);
    expect(lengthText(28.5, 'US')).toBe(`28'-6"`);
    expect(lengthText(30, 'SI')).toBe('9.144 m'); // 30 × 0.3048
    expect(lengthText(28.5, 'SI')).toBe('8.687 m'); // 28.5 × 0.3048 = 8.6868
  });

  it('when a measure is read out, then the length and its Δx, Δy are in the chosen units', () => {
    // 3-4-5 triangle scaled ×6: 18 ft and 24 ft legs, 30 ft long (closed form).
    expect(measureText([0, 0], [18, 24], 'US', true)).toBe(`30'-0"  (Δx 18'-0", Δy 24'-0")`);
    expect(measureText([0, 0], [18, 24], 'SI', true)).toBe('9.144 m  (Δx 5.486 m, Δy 7.315 m)'); // 18 × 0.3048 = 5.4864, 24 × 0.3048 = 7.3152
  });

  it('when loads are labelled, then kip become kN and klf become kN/m', () => {
    expect(pointLoadText(5, 2.5, 'US')).toBe('5D + 2.5L k');
    expect(pointLoadText(5, 2.5, 'SI')).toBe('22.24D + 11.12L kN'); // 5 × 4.448222 = 22.241; 2.5 × 4.448222 = 11.121
    expect(lineLoadText(0.5, 0.25, 'US')).toBe('0.5D + 0.25L klf');
    expect(lineLoadText(0.5, 0.25, 'SI')).toBe('7.3D + 3.65L kN/m'); // 0.5 × 14.5939 = 7.297; 0.25 × 14.5939 = 3.648
  });

  it('when the scale bar is drawn in SI, then it is a round number of metres and as wide as that length on screen', () => {
    const us = scaleBar(8, 'US'); // 8 px/ft: 120 px ≈ 15 ft; the first of 10, 20, 50 ft at least 0.7 × 15 = 10.5 ft is 20 ft
    expect(us).toMatchObject({ length: 20, px: 160, text: '20 ft · 8.0 px/ft' });
    const si = scaleBar(8, 'SI'); // 8 px/ft = 26.25 px/m; 120 px ≈ 4.57 m → 5 m
    expect(si.length).toBe(5);
    expect(si.px).toBeCloseTo((5 / 0.3048) * 8, 9);
    expect(si.text).toBe('5 m · 26 px/m');
  });

  it('when a field starts in SI, then it shows the conversion to four decimals; US shows the stored number', () => {
    expect(fieldText('force_kip', 5, 'US')).toBe('5');
    expect(fieldText('force_kip', 5, 'SI')).toBe('22.2411'); // 5 × 4.4482216
    expect(fieldText('pressure_psf', 50, 'SI')).toBe('2.394'); // 50 × 0.04788026 = 2.394013
    expect(fieldText('length_ft', 10, 'SI')).toBe('3.048');
  });
});
