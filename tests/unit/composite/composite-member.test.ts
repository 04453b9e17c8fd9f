import { describe, expect, it } from 'vitest';
import { designMember, candidateShapes, shapeConstantsFor, type MemberDesignInput } from '../../../shared/engine/index';
import { compositeSetup, evaluateComposite, fewestStuds } from '../../../shared/engine/sizing/composite-design';
import { parseMemberInput } from '../../../shared/schemas/member.schema';

// An invented interior beam of our own: 30 ft span, beams at 7.5 ft, 3 in deck + 3.25 in lightweight topping.
const slab = { ribHeight_in: 3, toppingThickness_in: 3.25, ribAvgWidth_in: 6, ribSpacing_in: 12, concreteWeight_pcf: 115, fc_ksi: 3, deckWeight_psf: 2 };
const wet = 0.0475 * 7.5 * 1; // 47.5 psf × 7.5 ft = 0.356 klf
function input(extra: Partial<MemberDesignInput> = {}, comp: Record<string, unknown> = {}): MemberDesignInput {
  return {
    span_ft: 30,
    loads: [
      { case: 'D', kind: 'uniform', w_klf: wet },
      { case: 'D', kind: 'uniform', w_klf: 0.015 * 7.5 },
      { case: 'L', kind: 'uniform', w_klf: 0.065 * 7.5 },
    ],
    bracing: 'continuous', method: 'LRFD', Fy_ksi: 50, deflectionLimits: { live: 360, total: 240 }, includeSelfWeight: true,
    composite: {
      slab, effectiveWidth_in: 90, deckOrientation: 'perpendicular', studsPerRib: 1, studs: null, shored: false,
      constructionLoads: [{ case: 'D', kind: 'uniform', w_klf: wet }, { case: 'L', kind: 'uniform', w_klf: 0.02 * 7.5 }],
      ...comp,
    } as MemberDesignInput['composite'],
    ...extra,
  };
}

describe('composite member design', () => {
  it('when a beam is designed composite, then it is lighter than bare steel and reports studs, PNA, I_LB and both stages with clauses', () => {
    const c = designMember(input());
    const bare = designMember({ ...input(), composite: null });
    expect(c.passes).toBe(true);
    expect(c.weight_plf).toBeLessThan(bare.weight_plf);
    expect(c.composite!.studs % 2).toBe(0);
    expect(c.composite!.percentComposite).toBeGreaterThanOrEqual(0.25); // common practice minimum
    expect(c.composite!.Qn_kip).toBeCloseTo(17.23, 2); // Eq. I8-1, Rg 1.0 Rp 0.6 × 0.4418 × 65
    expect(c.composite!.sumQn_kip).toBeCloseTo((c.composite!.studs / 2) * 17.23, 1);
    expect(c.checks.map((x) => x.name)).toEqual(['flexure', 'shear', 'deflectionLive', 'deflectionTotal', 'construction', 'studs']);
    expect(c.checks[0].clause).toBe('AISC 360-16 I3.2a');
    expect(c.checks[4].clause).toBe('AISC 360-16 F2.1'); // deck perpendicular braces the bare steel continuously
    expect(c.composite!.Ilb_in4).toBeGreaterThan(shapeConstantsFor(c.shape, 50)!.ixIn4);
    expect(c.Mc_kipft).toBe(c.composite!.Mc_kipft);
    expect(c.deflectionLive_in).toBe(c.composite!.deflectionLive_in);
  });

  it('when the selection is compared with brute force over every candidate, then it is the least equivalent weight, then fewest studs', () => {
    const inp = input();
    const st = compositeSetup(inp);
    let best: { w: number; studs: number; shape: string } | null = null;
    for (const k of candidateShapes(inp)) {
      const e = fewestStuds(st, k);
      if (!e) continue;
      const w = k.weightPlf * 30 + e.studs * 10; // 10 lb per stud, design-basis §6a common practice
      if (!best || w < best.w - 1e-9 || (Math.abs(w - best.w) <= 1e-9 && e.studs < best.studs)) best = { w, studs: e.studs, shape: k.label };
    }
    const c = designMember(inp);
    expect(c.shape).toBe(best!.shape);
    expect(c.composite!.studs).toBe(best!.studs);
    // the fewest studs: two fewer does not pass
    const k = shapeConstantsFor(c.shape, 50)!;
    if (c.composite!.studs - 2 >= 2) expect(evaluateComposite(st, k, c.composite!.studs - 2).passes).toBe(false);
  });

  it('when the size is locked, then only the studs are designed; when the stud count is locked, then it is checked', () => {
    const locked = designMember(input({ shape: 'W18X35' }));
    expect(locked.shape).toBe('W18X35');
    expect(locked.locked).toBe(true);
    expect(locked.passes).toBe(true);
    const few = designMember(input({ shape: 'W18X35' }, { studs: 4 }));
    expect(few.composite!.studs).toBe(4);
    expect(few.passes).toBe(false); // below 25 % composite and the 36 in maximum spacing
    expect(few.governing).toBe('studs');
    expect(few.failure).toContain('W18X35 with 4 studs');
  });

  it('when the total-deflection setting is superimposed dead + live, then the pre-composite dead load is left out of the check', () => {
    const all = designMember(input({ shape: 'W16X31' }));
    const sdl = designMember(input({ shape: 'W16X31', totalDeflectionIncludes: 'superimposedDeadAndLive' }));
    expect(sdl.composite!.deflectionTotal_in).toBeLessThan(all.composite!.deflectionTotal_in);
    // dead + live = pre-composite on Ix + the rest on I_LB; superimposed = the rest only
    expect(all.composite!.deflectionTotal_in - sdl.composite!.deflectionTotal_in).toBeCloseTo(all.composite!.preCompositeDeflection_in, 2);
    // bare steel too (issue 16 item 7): preCompositeDead names the slab load
    const bareAll = designMember({ ...input({ shape: 'W18X40' }), composite: null });
    const bareSdl = designMember({ ...input({ shape: 'W18X40' }), composite: null, totalDeflectionIncludes: 'superimposedDeadAndLive', preCompositeDead: [{ case: 'D', kind: 'uniform', w_klf: wet }] });
    // 5 w L⁴ / 384 E I for the slab 0.35625 klf plus self weight 0.040 klf on W18X40 (Ix 612): closed form, AISC Manual Part 3
    const expectedDrop = (5 * (wet + 0.04) * 30 ** 4 * 1728) / (384 * 29000 * 612);
    expect(bareAll.deflectionTotal_in - bareSdl.deflectionTotal_in).toBeCloseTo(expectedDrop, 3);
    expect(bareSdl.checks.find((x) => x.name === 'deflectionTotal')!.combination).toBe('superimposed D+L');
  });

  it('when shored, then there is no construction check and no camber', () => {
    const c = designMember(input({ shape: 'W18X35' }, { shored: true }));
    expect(c.composite!.camber_in).toBe(0);
    expect(c.composite!.construction.ratio).toBe(0);
    expect(c.checks.some((x) => x.name === 'construction')).toBe(false);
  });

  it('when a longer span is designed, then camber is 80 % of the wet deflection rounded down to 1/4 in', () => {
    const long = designMember(input({ span_ft: 40 }));
    const pre = long.composite!.preCompositeDeflection_in;
    expect(long.composite!.camber_in).toBe(Math.floor((0.8 * pre) / 0.25 + 1e-9) * 0.25 >= 0.75 ? Math.floor((0.8 * pre) / 0.25 + 1e-9) * 0.25 : 0); // design-basis §6 common practice
    expect(long.composite!.camber_in).toBeGreaterThanOrEqual(0.75);
  });

  it('when the composite input is bad, then the problem names the field', () => {
    const raw = JSON.parse(JSON.stringify(input()));
    raw.composite.deckOrientation = 'diagonal';
    raw.composite.slab.fc_ksi = -3;
    const r = parseMemberInput(raw);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.problems).toContain('composite.slab.fc_ksi: must be a number greater than 0');
      expect(r.problems).toContain('composite.deckOrientation: must be "perpendicular" or "parallel"');
    }
  });
});

describe('composite member design, deck ribs parallel to the member (AISC 360-16 I3.2c)', () => {
  it('when full composite needs more concrete than the topping holds, then the block goes into the ribs at their average width', () => {
    // W24X76 (AISC Shapes Database v15.0: A = 22.4 in²), Fy As = 1,120 kip. Ac = 90 × 3.25 + 90 × (6/12) × 3 = 427.5 in²;
    // 0.85 f'c Ac = 0.85 × 3 × 427.5 = 1,090.1 kip governs C at full composite (I3.2d). The topping holds
    // 0.85 × 3 × 90 × 3.25 = 745.9 kip; the other 344.3 kip fill the ribs, 344.3 / (0.85 × 3 × 90 × 0.5) = 3.0 in deep.
    const c = designMember(input({ shape: 'W24X76' }, { deckOrientation: 'parallel', studs: 140 }));
    const comp = c.composite!;
    expect(comp.Cgoverns).toBe('concrete');
    expect(comp.C_kip).toBeCloseTo(1090.125, 3);
    expect(comp.a_in).toBeCloseTo(6.25, 6); // 3.25 + 3.0: the whole slab depth
    expect(comp.slabDepth_in).toBe(6.25); // hr + tc
    // Centroid from the top: (745.875 × 1.625 + 344.25 × (3.25 + 1.5)) / 1,090.125 = 2.61182 in; Y2 = 6.25 − 2.61182.
    expect(comp.Y2_in).toBeCloseTo(6.25 - (745.875 * 1.625 + 344.25 * 4.75) / 1090.125, 6);
    expect(comp.Y2_in).toBeCloseTo(3.638, 3);
    // A full-width block (a = 1,090.125 / 229.5 = 4.75 in) would have given Y2 = 6.25 − 2.375 = 3.875 in: a longer lever arm.
    expect(comp.Y2_in).toBeLessThan(3.875);
  });
});
