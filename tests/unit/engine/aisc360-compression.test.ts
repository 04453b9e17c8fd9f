import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { eqE3_1, eqE3_2, eqE3_3, eqE3_4, slendernessLimitE3 } from '../../../shared/engine/design/aisc360/chapter-e/e3.equations';
import { eqE7_3, eqE7_4, eqE7_5, TABLE_E7_1 } from '../../../shared/engine/design/aisc360/chapter-e/e7.equations';
import { compressionConstantsFor, compressionStrengthE1, availableCompressionKip, PHI_C, OMEGA_C } from '../../../shared/engine/design/aisc360/chapter-e/e1';
import { columnCandidates } from '../../../shared/engine/sizing/column-design';
import { listWShapes } from '../../../shared/catalog/w-shapes.catalog';

const E = 29000; // AISC 360-16 (E = 29,000 ksi)
const FY = 50; // ASTM A992, common practice
const k = (label: string) => compressionConstantsFor(label, FY)!;
const both = (label: string, lcFt: number, method: 'LRFD' | 'ASD' = 'LRFD') => compressionStrengthE1(k(label), lcFt * 12, lcFt * 12, method);

describe('AISC 360-16 E3 equations, one function per equation', () => {
  it('when the equations are evaluated by hand, then each matches (Eq. E3-1 to E3-4)', () => {
    // Eq. E3-4 worked by hand: π² × 29000 / (100)² = 9.8696 × 2.9 = 28.622 ksi
    expect(eqE3_4(E, 100, 1)).toBeCloseTo(28.622, 3);
    // Eq. E3-2 worked by hand: 0.658^(50/28.622) × 50 = 0.658^1.7469 × 50 = 0.4813 × 50 = 24.07 ksi
    expect(eqE3_2(FY, 28.622)).toBeCloseTo(24.07, 2);
    // Eq. E3-3 worked by hand: 0.877 × 20 = 17.54 ksi
    expect(eqE3_3(20)).toBeCloseTo(17.54, 6);
    // Eq. E3-1: 20 ksi × 10 in² = 200 kip
    expect(eqE3_1(20, 10)).toBe(200);
    // AISC 360-16 E3: 4.71 sqrt(29000/50) = 113.4
    expect(slendernessLimitE3(E, FY)).toBeCloseTo(113.43, 2);
  });

  it('when φc and Ωc are read, then they are 0.90 and 1.67 (AISC 360-16 E1)', () => {
    expect(PHI_C).toBe(0.9); // AISC 360-16 E1
    expect(OMEGA_C).toBe(1.67); // AISC 360-16 E1
  });
});

describe('published checks', () => {
  it('when W14X132 is checked at Lc = 30 ft about both axes, then φcPn = 893 kip and Pn/Ωc = 594 kip', () => {
    // AISC Design Examples (companion to the 15th ed. Manual), Example E.1A: W14X132, Lc = 30 ft,
    // φcPn = 893 kip, Pn/Ωc = 594 kip (recalled from memory)
    const lrfd = both('W14X132', 30);
    expect(lrfd.pcKip).toBeCloseTo(893, 0);
    expect(lrfd.governingAxis).toBe('y');
    expect(lrfd.y.equation).toBe('Eq. E3-2');
    expect(both('W14X132', 30, 'ASD').pcKip).toBeCloseTo(594, 0);
    // Example E.1A intermediates: Lc/ry = 95.7, Fe = 31.2 ksi, Fcr = 25.6 ksi (recalled from memory)
    expect(lrfd.y.slenderness).toBeCloseTo(95.7, 1);
    expect(lrfd.y.feKsi).toBeCloseTo(31.2, 1);
    expect(lrfd.y.fcrKsi).toBeCloseTo(25.6, 1);
  });

  it('when nonslender W-shapes are read at Lc = 0, then φcPn matches the printed values', () => {
    // AISC Manual 15th ed. Table 4-1a, Fy = 50 ksi, Lc = 0 row (φc Fy Ag, printed to 3 figures) (recalled from memory)
    expect(both('W14X132', 0).pcKip).toBeCloseTo(1750, -1);
    expect(both('W14X90', 0).pcKip).toBeCloseTo(1190, -1);
    expect(both('W12X65', 0).pcKip).toBeCloseTo(860, -1);
    expect(both('W10X33', 0).pcKip).toBeCloseTo(437, 0);
    // AISC Manual 15th ed. Table 4-1a, W14X132 at Lc = 30 ft: 893 (recalled from memory; as Example E.1A)
    expect(both('W14X132', 30).pcKip).toBeCloseTo(893, 0);
  });
});

describe('hand-worked E3 cases either side of 4.71 sqrt(E/Fy)', () => {
  it('when W10X33 has Lc = 18 ft, then Lc/r = 111.3 ≤ 113.4 and Eq. E3-2 gives φcPn = 176.5 kip', () => {
    // Worked by hand (AISC 360-16 E3): ry = 1.94 in, Ag = 9.71 in² (AISC Shapes Database v15.0)
    // Lc/r = 216 / 1.94 = 111.34 ≤ 113.43 → Eq. E3-2
    // Fe = π² 29000 / 111.34² = 23.09 ksi (Eq. E3-4)
    // Fcr = 0.658^(50/23.09) × 50 = 0.658^2.1655 × 50 = 20.20 ksi (Eq. E3-2)
    // Pn = 20.20 × 9.71 = 196.1 kip (Eq. E3-1); φcPn = 0.90 × 196.1 = 176.5 kip; Pn/Ωc = 117.4 kip
    const r = both('W10X33', 18);
    expect(r.y.slenderness).toBeCloseTo(111.34, 2);
    expect(r.y.equation).toBe('Eq. E3-2');
    expect(r.y.feKsi).toBeCloseTo(23.09, 2);
    expect(r.y.fcrKsi).toBeCloseTo(20.2, 2);
    expect(r.pnKip).toBeCloseTo(196.1, 1);
    expect(r.pcKip).toBeCloseTo(176.5, 1);
    expect(both('W10X33', 18, 'ASD').pcKip).toBeCloseTo(117.4, 1);
    expect(r.section).toBe('E3');
  });

  it('when W10X33 has Lc = 19 ft, then Lc/r = 117.5 > 113.4 and Eq. E3-3 gives φcPn = 158.8 kip', () => {
    // Worked by hand (AISC 360-16 E3): Lc/r = 228 / 1.94 = 117.53 > 113.43 → Eq. E3-3
    // Fe = π² 29000 / 117.53² = 20.72 ksi (Eq. E3-4); Fcr = 0.877 × 20.72 = 18.17 ksi (Eq. E3-3)
    // Pn = 18.17 × 9.71 = 176.5 kip (Eq. E3-1); φcPn = 158.8 kip
    const r = both('W10X33', 19);
    expect(r.y.slenderness).toBeCloseTo(117.53, 2);
    expect(r.y.equation).toBe('Eq. E3-3');
    expect(r.y.feKsi).toBeCloseTo(20.72, 2);
    expect(r.y.fcrKsi).toBeCloseTo(18.17, 2);
    expect(r.pnKip).toBeCloseTo(176.5, 1);
    expect(r.pcKip).toBeCloseTo(158.8, 1);
  });

  it('when the strong-axis length is the longer, then the strong axis can govern (AISC 360-16 E3)', () => {
    // W14X90: rx = 6.14 in, ry = 3.70 in; Lcx = 40 ft, Lcy = 10 ft → Lcx/rx = 78.2 > Lcy/ry = 32.4
    const r = compressionStrengthE1(k('W14X90'), 480, 120, 'LRFD');
    expect(r.governingAxis).toBe('x');
    expect(r.x.slenderness).toBeCloseTo(480 / 6.14, 6);
  });
});

describe('E7: slender webs by Table B4.1a case 5', () => {
  it('when W14X22 (h/tw = 53.3 > 1.49 sqrt(E/Fy) = 35.9) has Lc = 4 ft, then the web is reduced by Eq. E7-3 and φcPn = 227.1 kip', () => {
    // Worked by hand (AISC 360-16 E7.1; Table E7.1 case (a): c1 = 0.18, c2 = 1.31):
    // W14X22: Ag = 6.49 in², ry = 1.04 in, tw = 0.230 in, h/tw = 53.3, bf/2tf = 7.46 (AISC Shapes Database v15.0)
    // Lc/r = 48/1.04 = 46.15; Fe = 134.4 ksi; Fcr = 0.658^(50/134.4) × 50 = 42.79 ksi (Eq. E3-2)
    // λr = 1.49 × 24.083 = 35.88; λr sqrt(Fy/Fcr) = 35.88 × 1.081 = 38.79 < 53.3 → Eq. E7-3
    // Fel = (1.31 × 35.88/53.3)² × 50 = 38.89 ksi (Eq. E7-5); sqrt(Fel/Fcr) = 0.9534
    // he = h (1 − 0.18 × 0.9534) × 0.9534 = 0.7898 h; h = 53.3 × 0.230 = 12.26 in → he = 9.68 in
    // Ae = 6.49 − (12.26 − 9.68) × 0.230 = 5.897 in²; Pn = 42.79 × 5.897 = 252.3 kip (Eq. E7-1); φcPn = 227.1 kip
    const r = both('W14X22', 4);
    expect(r.section).toBe('E7');
    expect(r.clause).toBe('AISC 360-16 E7');
    expect(r.y.fcrKsi).toBeCloseTo(42.79, 2);
    expect(r.y.web!.equation).toBe('Eq. E7-3');
    expect(r.y.web!.felKsi!).toBeCloseTo(38.89, 2);
    expect(r.y.web!.beIn).toBeCloseTo(9.68, 2);
    expect(r.y.flange!.equation).toBe('Eq. E7-2'); // bf/2tf = 7.46 < 0.56 sqrt(E/Fy) = 13.5 (Table B4.1a case 1)
    expect(r.y.areaIn2).toBeCloseTo(5.897, 2);
    expect(r.pnKip).toBeCloseTo(252.3, 0);
    expect(r.pcKip).toBeCloseTo(227.1, 0);
  });

  it('when the same W14X22 is long (Lc = 10 ft, Fcr = 18.85 ksi), then λ ≤ λr sqrt(Fy/Fcr) and the web is fully effective (Eq. E7-2)', () => {
    // Worked by hand: Lc/r = 115.4 > 113.4 → Eq. E3-3, Fcr = 0.877 × 21.50 = 18.85 ksi;
    // λr sqrt(Fy/Fcr) = 35.88 × 1.6285 = 58.4 ≥ 53.3 → be = h (AISC 360-16 Eq. E7-2); Pn = 18.85 × 6.49 = 122.4 kip
    const r = both('W14X22', 10);
    expect(r.y.web!.equation).toBe('Eq. E7-2');
    expect(r.y.areaIn2).toBe(6.49);
    expect(r.pnKip).toBeCloseTo(122.4, 1);
  });

  it('when c2 is worked from c1 by Eq. E7-4, then it agrees with Table E7.1 to its printed precision', () => {
    expect(eqE7_4(TABLE_E7_1.stiffened.c1)).toBeCloseTo(1.31, 2); // AISC 360-16 Table E7.1 case (a)
    expect(eqE7_4(TABLE_E7_1.other.c1)).toBeCloseTo(1.49, 2); // AISC 360-16 Table E7.1 case (c)
    // Eq. E7-3 meets Eq. E7-2 at λ = λr sqrt(Fy/Fcr): there Fel/Fcr = c2², be = b c2 (1 − c1 c2) = b (AISC 360-16 E7.1)
    const fcr = 30;
    const lambdaR = 35.88;
    const lambda = lambdaR * Math.sqrt(FY / fcr);
    const c = { c1: 0.18, c2: eqE7_4(0.18) };
    expect(eqE7_3(10, c.c1, eqE7_5(c.c2, lambdaR, lambda, FY), fcr)).toBeCloseTo(10, 9);
  });

  it('when the catalog is read, then the W14/W12/W10 shapes with slender webs at 50 ksi are the light ones (Table B4.1a case 5)', () => {
    const slender = columnCandidates(['W14', 'W12', 'W10'], FY).filter((s) => s.slenderWeb).map((s) => s.label);
    // AISC 360-16 Table B4.1a case 5 with AISC Shapes Database v15.0 h/tw: W14X43 (37.4) is slender, W14X48 (33.6) is not
    expect(slender).toContain('W14X43');
    expect(slender).not.toContain('W14X48');
    expect(slender).toContain('W10X22');
    expect(columnCandidates(['W14', 'W12', 'W10'], FY).some((s) => s.slenderFlange)).toBe(false);
  });
});

describe('properties', () => {
  const shapes = listWShapes().map((s) => s.label);
  it('when the length grows, then the available strength never rises (any W-shape, either method)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...shapes), fc.double({ min: 0, max: 60, noNaN: true }), fc.double({ min: 0, max: 60, noNaN: true }),
        fc.constantFrom('LRFD' as const, 'ASD' as const), fc.constantFrom(36, 50, 65),
        (label, a, b, method, fy) => {
          const kk = compressionConstantsFor(label, fy)!;
          const [short, long] = a <= b ? [a, b] : [b, a];
          expect(availableCompressionKip(kk, long * 12, method)).toBeLessThanOrEqual(availableCompressionKip(kk, short * 12, method) * (1 + 1e-12));
        },
      ),
      { numRuns: 400 },
    );
  });

  it('when Fcr is evaluated on both sides of the E3 limit, then it is continuous there (Eq. E3-2 = Eq. E3-3 at Fy/Fe = 2.25)', () => {
    fc.assert(
      fc.property(fc.double({ min: 30, max: 70, noNaN: true }), (fy) => {
        const fe = fy / 2.25; // Lc/r = 4.71 sqrt(E/Fy) ⇔ Fe = Fy/2.25 (AISC 360-16 E3)
        expect(eqE3_2(fy, fe)).toBeCloseTo(eqE3_3(fe), 1);
      }),
    );
  });
});
