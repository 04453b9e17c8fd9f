import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { compositePlasticFlexure, concreteBlock, lowerBoundInertia, type CompositeConcrete, type CompositeSteel } from '../../../shared/engine/design/aisc360/chapter-i/i3';
import { concreteModulusKsi, effectiveWidthI3_1a, eqC_I3_1 } from '../../../shared/engine/design/aisc360/chapter-i/i3.equations';
import { eqI8_1, rgRpI8_2a, spacingLimitsI8_2d, studAreaIn2 } from '../../../shared/engine/design/aisc360/chapter-i/i8.equations';
import { camberIn, camberText } from '../../../shared/engine/design/serviceability/camber.serviceability';
import { slabWeight } from '../../../shared/engine/loads/slab-weight.loads';
import { getWShape } from '../../../shared/catalog/w-shapes.catalog';

// W21X50, AISC Shapes Database v15.0: A = 14.7 in², d = 20.8, bf = 6.53, tf = 0.535, tw = 0.38, Ix = 984, Zx = 110.
const w21x50 = getWShape('W21X50');
const steel: CompositeSteel = { asIn2: w21x50.A_in2, dIn: w21x50.d_in, bfIn: w21x50.bf_in, tfIn: w21x50.tf_in, twIn: w21x50.tw_in, ixIn4: w21x50.Ix_in4, zxIn3: w21x50.Zx_in3, fyKsi: 50 };
// 3 in deck ribs perpendicular, 4.5 in concrete above, f'c = 4 ksi, b = 90 in: Ac = 90 × 4.5 = 405 in².
const slab: CompositeConcrete = { bIn: 90, acIn2: 405, fcKsi: 4, slabTopToSteelIn: 7.5, compressibleDepthIn: 4.5 };

describe('AISC 360-16 Chapter I equations', () => {
  it('when Ec is computed, then it is wc^1.5 √f\'c', () => {
    expect(concreteModulusKsi(145, 4)).toBeCloseTo(3492.06, 1); // 145^1.5 × √4, worked by hand
    expect(concreteModulusKsi(115, 3)).toBeCloseTo(2136.03, 1); // 115^1.5 × √3, worked by hand
  });

  it('when Qn is computed by Eq. I8-1, then each Rg/Rp case of I8.2a gives its value for a 3/4 in stud', () => {
    const asa = studAreaIn2(0.75);
    expect(asa).toBeCloseTo(0.4418, 4); // π (0.75)² / 4
    const ec = concreteModulusKsi(145, 4);
    const perp1 = rgRpI8_2a('perpendicular', 1, 6, 3);
    expect([perp1.rg, perp1.rp]).toEqual([1.0, 0.6]); // AISC 360-16 I8.2a, weak position (conservative)
    // 1.0 × 0.6 × 0.4418 × 65 = 17.2 kip; AISC Manual 15th ed. Table 3-21 weak position, 1 stud per rib: 17.2 (recalled from memory)
    expect(eqI8_1(asa, 4, ec, perp1.rg, perp1.rp, 65).qnKip).toBeCloseTo(17.23, 2);
    expect(eqI8_1(asa, 4, ec, perp1.rg, perp1.rp, 65).governs).toBe('anchor');
    const perp2 = rgRpI8_2a('perpendicular', 2, 6, 3);
    expect(perp2.rg).toBe(0.85); // AISC 360-16 I8.2a, two studs per rib
    expect(eqI8_1(asa, 4, ec, perp2.rg, perp2.rp, 65).qnKip).toBeCloseTo(14.65, 2); // 0.85 × 0.6 × 0.4418 × 65; Table 3-21: 14.6 (recalled from memory)
    const perp3 = rgRpI8_2a('perpendicular', 3, 6, 3);
    expect(eqI8_1(asa, 4, ec, perp3.rg, perp3.rp, 65).qnKip).toBeCloseTo(12.06, 2); // 0.7 × 0.6 × 0.4418 × 65
    const strong = rgRpI8_2a('perpendicular', 1, 6, 3, 2.2);
    expect(strong.rp).toBe(0.75); // AISC 360-16 I8.2a, emid-ht ≥ 2 in
    const par = rgRpI8_2a('parallel', 1, 6, 3);
    expect([par.rg, par.rp]).toEqual([1.0, 0.75]); // wr/hr = 2 ≥ 1.5
    expect(eqI8_1(asa, 4, ec, par.rg, par.rp, 65).qnKip).toBeCloseTo(21.54, 2); // 0.75 × 0.4418 × 65; Table 3-21: 21.5 (recalled from memory)
    const parNarrow = rgRpI8_2a('parallel', 1, 4, 3);
    expect(parNarrow.rg).toBe(0.85); // wr/hr = 1.33 < 1.5
    // Solid slab, lightweight 110 pcf, f'c = 3 ksi: concrete governs, 0.5 × 0.4418 × √(3 × 1998.2) = 17.10 kip
    const none = rgRpI8_2a('none', 1, 0, 1);
    const q = eqI8_1(asa, 3, concreteModulusKsi(110, 3), none.rg, none.rp, 65);
    expect(q.governs).toBe('concrete');
    expect(q.qnKip).toBeCloseTo(17.10, 2);
  });

  it('when the spacing limits of I8.2d are asked, then 6d and min(8 t, 36 in)', () => {
    expect(spacingLimitsI8_2d(0.75, 7.5)).toEqual({ minIn: 4.5, maxIn: 36 }); // 6 × 0.75; min(60, 36)
    expect(spacingLimitsI8_2d(0.75, 4)).toEqual({ minIn: 4.5, maxIn: 32 }); // 8 × 4
  });

  it('when the effective width is taken by I3.1a, then each side is the least of span/8, half the beam spacing and the edge distance', () => {
    // 30 ft span (360 in), beams at 10 ft: span/8 = 45 in < 60 in each side
    expect(effectiveWidthI3_1a(360, [{ toNextBeamIn: 120, toEdgeIn: null }, { toNextBeamIn: 120, toEdgeIn: null }]).bIn).toBe(90);
    // edge beam with 6 in of slab beyond the centreline
    const edge = effectiveWidthI3_1a(360, [{ toNextBeamIn: 120, toEdgeIn: null }, { toNextBeamIn: null, toEdgeIn: 6 }]);
    expect(edge.bIn).toBe(51);
    expect(edge.governs).toEqual(['span/8', 'distance to the slab edge']);
    // beams at 6 ft: 36 in each side governs over 45 in
    expect(effectiveWidthI3_1a(360, [{ toNextBeamIn: 72, toEdgeIn: null }, { toNextBeamIn: 72, toEdgeIn: null }]).bIn).toBe(72);
  });

  it('when ΣQn ≥ Fy As, then the PNA is in the slab and Mn = Fy As (d/2 + Y2)', () => {
    const r = compositePlasticFlexure(steel, slab, 800);
    expect(r.pna).toBe('slab');
    expect(r.cKip).toBe(735); // Fy As = 50 × 14.7 < 0.85 × 4 × 405 = 1377
    expect(r.aIn).toBeCloseTo(2.402, 3); // 735 / (0.85 × 4 × 90)
    expect(r.y2In).toBeCloseTo(6.299, 3); // 7.5 − a/2
    expect(r.mnKipIn / 12).toBeCloseTo(1022.81, 1); // 735 × (10.4 + 6.299) / 12, AISC 360-16 I3.2a worked by hand
    expect(r.percentComposite).toBe(1);
  });

  it('when 0 < Fy As − ΣQn ≤ 2 Fy bf tf, then the PNA is in the top flange', () => {
    const r = compositePlasticFlexure(steel, slab, 600);
    expect(r.pna).toBe('flange');
    expect(r.cSteelCompKip).toBeCloseTo(67.5, 6); // (735 − 600) / 2
    expect(r.ypIn).toBeCloseTo(0.2067, 4); // 67.5 / (50 × 6.53)
    expect(r.y2In).toBeCloseTo(6.5196, 4); // 7.5 − (600 / 306) / 2
    expect(r.mnKipIn / 12).toBeCloseTo(961.82, 1); // forces × arms about the top of steel, worked by hand
    expect(r.percentComposite).toBeCloseTo(600 / 735, 6);
  });

  it('when ΣQn is small, then the PNA is in the web', () => {
    const r = compositePlasticFlexure(steel, slab, 300);
    expect(r.pna).toBe('web');
    expect(r.ypIn).toBeCloseTo(2.7888, 4); // tf + (217.5 − 174.7) / (50 × 0.38)
    expect(r.mnKipIn / 12).toBeCloseTo(792.60, 1); // worked by hand
  });

  it('when ΣQn is zero, then Mn is the steel alone, Fy Zx', () => {
    expect(compositePlasticFlexure(steel, slab, 0).mnKipIn / 12).toBeCloseTo(458.33, 2); // 50 × 110 / 12, AISC 360-16 Eq. F2-1
  });

  it('when the lower-bound I is computed by Commentary Eq. C-I3-1, then it matches the hand value', () => {
    const r = eqC_I3_1(984, 14.7, 10.4, 6.5196, 600, 50);
    expect(r.yEnaIn).toBeCloseTo(18.004, 3); // (14.7 × 10.4 + 12 × (20.8 + 6.5196)) / 26.7, Eq. C-I3-2
    expect(r.ilbIn4).toBeCloseTo(2875.3, 1); // 984 + 14.7 (18.004 − 10.4)² + 12 (27.320 − 18.004)²
    // ΣQn above full composite is capped at Fy As = 735 kip
    expect(lowerBoundInertia(steel, slab, 2000, 6.299).ilbIn4).toBeCloseTo(3033.6, 1);
  });

  it('when camber is rounded, then 80 % rounded down to 1/4 in, none below 3/4 in', () => {
    // design-basis §6, common practice
    expect(camberIn(1.2)).toBe(0.75); // 0.96 → 3/4
    expect(camberIn(0.9)).toBe(0); // 0.72 < 3/4 → none
    expect(camberIn(0.9375)).toBe(0.75); // exactly 3/4
    expect(camberIn(1.6)).toBe(1.25); // 1.28 → 1-1/4
    expect(camberIn(2)).toBe(1.5); // 1.6 → 1-1/2
    expect(camberText(0.75)).toBe('3/4"');
    expect(camberText(1.25)).toBe('1-1/4"');
    expect(camberText(1)).toBe('1"');
  });

  it('when a slab weight is computed from the build-up, then topping + ribs share × unit weight + deck', () => {
    // 115 pcf × (3.25 + 3 × 6/12) in / 12 = 45.5 psf, + 2 psf deck = 47.5 psf (plain geometry)
    const w = slabWeight({ ribHeight_in: 3, toppingThickness_in: 3.25, ribAvgWidth_in: 6, ribSpacing_in: 12, concreteWeight_pcf: 115, fc_ksi: 3, deckWeight_psf: 2 });
    expect(w.concrete_psf).toBeCloseTo(45.52, 2);
    expect(w.total_psf).toBeCloseTo(47.52, 2);
  });
});

describe('composite flexure properties (fast-check)', () => {
  const shapes = ['W12X19', 'W14X22', 'W16X26', 'W18X35', 'W21X44', 'W24X55', 'W27X84'].map(getWShape);
  const arb = fc.record({
    shape: fc.constantFrom(...shapes),
    b: fc.double({ min: 24, max: 150, noNaN: true }),
    tc: fc.double({ min: 2, max: 5.5, noNaN: true }),
    hr: fc.constantFrom(1.5, 2, 3),
    fcKsi: fc.double({ min: 3, max: 6, noNaN: true }),
    q1: fc.double({ min: 0, max: 2500, noNaN: true }),
    q2: fc.double({ min: 0, max: 2500, noNaN: true }),
  });
  it('when ΣQn varies, then Mn is never below the bare steel Mp, never above full composite, and never falls as ΣQn rises', () => {
    fc.assert(
      fc.property(arb, ({ shape, b, tc, hr, fcKsi, q1, q2 }) => {
        const st: CompositeSteel = { asIn2: shape.A_in2, dIn: shape.d_in, bfIn: shape.bf_in, tfIn: shape.tf_in, twIn: shape.tw_in, ixIn4: shape.Ix_in4, zxIn3: shape.Zx_in3, fyKsi: 50 };
        const cc: CompositeConcrete = { bIn: b, acIn2: b * tc, fcKsi, slabTopToSteelIn: hr + tc, compressibleDepthIn: tc };
        const lo = Math.min(q1, q2), hi = Math.max(q1, q2);
        const mLo = compositePlasticFlexure(st, cc, lo).mnKipIn;
        const mHi = compositePlasticFlexure(st, cc, hi).mnKipIn;
        const full = compositePlasticFlexure(st, cc, 1e9).mnKipIn;
        const bare = 50 * shape.Zx_in3; // AISC 360-16 Eq. F2-1
        expect(mLo).toBeGreaterThanOrEqual(bare - 1e-9);
        expect(mHi).toBeGreaterThanOrEqual(mLo - 1e-9);
        expect(mHi).toBeLessThanOrEqual(full + 1e-9);
        const iLo = lowerBoundInertia(st, cc, lo, compositePlasticFlexure(st, cc, lo).y2In).ilbIn4;
        expect(iLo).toBeGreaterThanOrEqual(shape.Ix_in4 - 1e-9);
      }),
      { numRuns: 400 },
    );
  });
});

describe('concrete block over parallel deck ribs (AISC 360-16 I3.2c)', () => {
  // 3 in ribs parallel to the member, 3.25 in topping, ribs 6 in wide at 12 in (wr/s = 0.5),
  // f'c = 4 ksi, b = 90 in. Full width down to tc: 0.85 × 4 × 90 × 3.25 = 994.5 kip; each inch of
  // rib depth below it carries 0.85 × 4 × 90 × 0.5 = 153 kip. Worked by hand.
  const ribbed: CompositeConcrete = {
    bIn: 90, acIn2: 90 * 3.25 + 90 * 0.5 * 3, fcKsi: 4, slabTopToSteelIn: 6.25, compressibleDepthIn: 6.25,
    ribs: { toppingIn: 3.25, widthFraction: 0.5 },
  };
  it('when C fits in the topping, then a = C / (0.85 f\'c b) as over a solid slab', () => {
    const r = concreteBlock(ribbed, 612);
    expect(r.aIn).toBeCloseTo(2.0, 6); // 612 / 306
    expect(r.y2In).toBeCloseTo(5.25, 6); // 6.25 − 2.0 / 2
  });
  it('when C is more than the topping carries, then the block goes on into the ribs at their width and its centroid is lower', () => {
    const r = concreteBlock(ribbed, 1200);
    // 1200 − 994.5 = 205.5 kip in the ribs: 205.5 / 153 = 1.34314 in below the topping.
    expect(r.aIn).toBeCloseTo(3.25 + 205.5 / 153, 6); // 4.59314 in
    // Centroid from the top: (994.5 × 1.625 + 205.5 × (3.25 + 0.67157)) / 1200 = 2.01826 in.
    expect(r.y2In).toBeCloseTo(6.25 - (994.5 * 1.625 + 205.5 * (3.25 + (205.5 / 153) / 2)) / 1200, 6);
    expect(r.y2In).toBeCloseTo(4.2317, 3);
    // A full-width block would put the centroid at 1200 / 306 / 2 = 1.9608 in from the top (Y2 = 4.2892 in): higher, so Mn too large.
    expect(r.y2In).toBeLessThan(6.25 - 1200 / 306 / 2);
  });
  it('when C varies, then the ribbed block is never shallower and its Y2 never above a full-width block (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 2, max: 5, noNaN: true }), fc.constantFrom(1.5, 2, 3), fc.double({ min: 0.3, max: 0.8, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }),
        (tc, hr, f, share) => {
          const b = 96;
          const cc: CompositeConcrete = { bIn: b, acIn2: b * tc + b * f * hr, fcKsi: 4, slabTopToSteelIn: hr + tc, compressibleDepthIn: hr + tc, ribs: { toppingIn: tc, widthFraction: f } };
          const c = share * 0.85 * 4 * cc.acIn2;
          const ribbedBlock = concreteBlock(cc, c);
          const solid = concreteBlock({ ...cc, ribs: undefined }, c);
          expect(ribbedBlock.aIn).toBeGreaterThanOrEqual(solid.aIn - 1e-9);
          expect(ribbedBlock.aIn).toBeLessThanOrEqual(hr + tc + 1e-9);
          expect(ribbedBlock.y2In).toBeLessThanOrEqual(solid.y2In + 1e-9);
          expect(ribbedBlock.y2In).toBeGreaterThanOrEqual(-1e-9);
        },
      ),
      { numRuns: 300 },
    );
  });
});
