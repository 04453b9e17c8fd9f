import { describe, expect, it } from 'vitest';
import { describeLoadSource } from '../../../shared/drafting/load-source.drafting';
import { fieldText } from '../../../src/features/editor/components/field-text';
import { loadSourceText } from '../../../src/features/member-sheet/components/member-loads.component';
import { formatElevation, fromDisplay } from '../../../src/lib/units';

// Conversions: NIST SP 811 (2008) Appendix B — 1 ft = 0.3048 m, 1 psf = 47.88026 Pa,
// 1 kip/ft = 14.59390 kN/m, 1 kip = 4.448222 kN.

describe('figures a person reads follow the units choice', () => {
  it('when a deck load source is shown in SI, then the width reads metres and both pressures kPa', () => {
    const src = 'deck d3 zone office, tributary 4.2 ft: dead 50 + superimposed 15 psf';
    // 4.2 ft = 1.28 m; 50 psf = 2.39 kPa; 15 psf = 0.72 kPa
    expect(loadSourceText(src, 'SI')).toBe('deck d3 zone office, tributary 1.28 m: dead 2.39 kPa + superimposed 0.72 kPa');
    expect(loadSourceText(src, 'US')).toBe(src);
  });

  it('when a tapering width, a live pressure or a self weight is shown in SI, then each is converted', () => {
    // 4.2–5.0 ft = 1.28–1.52 m; 50 psf = 2.39 kPa
    expect(loadSourceText('deck d1 zone z1, tributary 4.2–5.0 ft: live 50 psf', 'SI')).toBe('deck d1 zone z1, tributary 1.28–1.52 m: live 2.39 kPa');
    // 40 plf = 0.040 kip/ft = 0.58 kN/m
    expect(loadSourceText('self weight 40 plf', 'SI')).toBe('self weight 0.58 kN/m');
    // Figures without a unit (a reduction factor, a share) are left alone.
    expect(describeLoadSource('beam b4 reaction (reducible live) × 0.767 (ASCE 7-16 Eq. 4.7-1)', () => 'X')).toBe('beam b4 reaction (reducible live) × 0.767 (ASCE 7-16 Eq. 4.7-1)');
  });

  it('when 20 kN is typed and the reader switches back to US, then the field shows 4.4962 kip, not 4.49617886199421', () => {
    const stored = fromDisplay('force_kip', 20, 'SI');
    expect(stored).toBeCloseTo(4.49617886199421, 12); // 20 / 4.4482216152605
    expect(fieldText('force_kip', stored, 'US')).toBe('4.4962');
    expect(fieldText('force_kip', 5, 'US')).toBe('5');
    expect(fieldText('lineLoad_klf', 0.4, 'US')).toBe('0.4');
  });

  it('when a level at 14 ft is listed, then it reads EL 4.27 m in SI and 14\'-0" in US', () => {
    expect(formatElevation(14, 'SI')).toBe('4.27 m'); // 14 × 0.3048 = 4.2672 m
    expect(formatElevation(14, 'US')).toBe(`14'-0"`);
    expect(formatElevation(14.1076, 'US')).toBe(`14'-1 1/4"`); // 0.1076 ft = 1.29 in → nearest 1/4 in
  });
});
