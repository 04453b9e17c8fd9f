import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { twoBayPlan } from '../../editor/plan-fixture';
import { designScheme } from '../../../../shared/engine/scheme/design-scheme.scheme';
import { applyStudyOption, type StudyOptionSpec } from '../../../../shared/engine/study/apply-option.study';
import { runStudy, schemeStudyFigures, studyOptionSpecs } from '../../../../shared/engine/study/run-study.study';
import { regionBays } from '../../../../shared/engine/study/study-region.study';
import { parseStudySpec, MAX_STUDY_OPTIONS, type StudySpec } from '../../../../shared/schemas/study.schema';
import type { Plan } from '../../../../shared/schemas/plan.schema';
import { columnTonnageRows, computeTonnage } from '../../../../shared/tonnage/tonnage';
import { polygonAreaFt2 } from '../../../../shared/engine/geometry/polygon.geometry';
import { splitByRect } from '../../../../shared/engine/geometry/polygon-clip.geometry';

const WEST_BAY: [number, number][] = [[0, 0], [30, 0], [30, 36], [0, 36]];

/** The two-bay fixture (an invented scheme of our own) with a slab build-up on its decks, composite design off. */
function slabPlan(): Plan {
  const plan = twoBayPlan();
  const slab = { ribHeight_in: 3, toppingThickness_in: 3.25, ribAvgWidth_in: 6, ribSpacing_in: 12, concreteWeight_pcf: 115, fc_ksi: 3, deckWeight_psf: 2 };
  return { ...plan, decks: plan.decks.map((d) => ({ ...d, slab })) };
}
const PRICES = { steel_usd_per_ton: 4200, connection_usd_each: 350 }; // invented example prices

function spec(over: Record<string, unknown> = {}): StudySpec {
  const r = parseStudySpec({ region: { level: 'L2', polygon: WEST_BAY }, spacing_ft: { from: 6, to: 15, step: 1 }, directions: ['x', 'y'], unitPrices: PRICES, ...over });
  if (!r.spec) throw new Error(r.problems.join('; '));
  return r.spec;
}

describe('bay study request', () => {
  it('when the step is 0, then the problem names spacing_ft.step', () => {
    const r = parseStudySpec({ region: { level: 'L2', polygon: WEST_BAY }, spacing_ft: { from: 6, to: 15, step: 0 } });
    expect(r.spec).toBeNull();
    expect(r.problems).toEqual(['spacing_ft.step: must be more than 0 ft (got 0)']);
  });

  it('when the spacing is negative or from is past to, then each problem names its field', () => {
    expect(parseStudySpec({ region: { level: 'L2', polygon: WEST_BAY }, spacing_ft: { from: -6, to: 15, step: 1 } }).problems).toEqual(['spacing_ft.from: must be more than 0 ft (got -6)']);
    expect(parseStudySpec({ region: { level: 'L2', polygon: WEST_BAY }, spacing_ft: { from: 15, to: 6, step: 1 } }).problems).toEqual(['spacing_ft.from: must not be more than to (15 > 6)']);
  });

  it(`when the ranges multiply to thousands of options, then it is refused above ${MAX_STUDY_OPTIONS}, naming the count`, () => {
    const r = parseStudySpec({ region: { level: 'L2', polygon: WEST_BAY }, spacing_ft: { from: 6, to: 15, step: 0.1 }, directions: ['x', 'y'], depthLimits_in: [null, 18, 21, 24], Fy_ksi: [50, 65] });
    expect(r.spec).toBeNull();
    expect(r.problems[0]).toMatch(/^spacing_ft: 91 spacings × 2 directions × 4 depth limits × 2 grades = 1456 options; at most 200/);
    expect(parseStudySpec({ region: { level: 'L2', polygon: WEST_BAY }, spacing_ft: { from: 1, to: 5000, step: 1 } }).problems[0]).toMatch(/^spacing_ft.step: 1 to 5000 by 1 gives 5000 values/);
  });

  it('when the region is not a rectangle along x and y, or names no level, then the field is named', () => {
    expect(parseStudySpec({ region: { level: 'L2', polygon: [[0, 0], [30, 5], [30, 36], [0, 36]] }, spacing_ft: { from: 6, to: 8, step: 1 } }).problems).toEqual([
      'region.polygon: must be a rectangle of 4 corners with sides along x and y',
    ]);
    expect(() => runStudy(twoBayPlan(), spec({ region: { level: 'L9', polygon: WEST_BAY } }))).toThrow(/region.level: the plan has no level "L9"/);
  });

  it('when composite is asked both ways, then it doubles the options and a value that is not true/false/null names composite.N', () => {
    const both = spec({ spacing_ft: { from: 8, to: 10, step: 1 }, composite: [true, false] });
    expect(both.composite).toEqual([true, false]);
    expect(studyOptionSpecs(both).map((o) => o.composite)).toEqual([true, false, true, false, true, false, true, false, true, false, true, false]);
    expect(spec().composite).toEqual([null]);
    const bad = parseStudySpec({ region: { level: 'L2', polygon: WEST_BAY }, spacing_ft: { from: 6, to: 8, step: 1 }, composite: ['yes'] });
    expect(bad.spec).toBeNull();
    expect(bad.problems[0]).toMatch(/^composite\.0: true \(composite\), false \(bare steel\) or null/);
    const many = parseStudySpec({ region: { level: 'L2', polygon: WEST_BAY }, spacing_ft: { from: 6, to: 15, step: 0.5 }, directions: ['x', 'y'], depthLimits_in: [null, 18], Fy_ksi: [50, 65], composite: [true, false] });
    expect(many.problems[0]).toMatch(/^spacing_ft: 19 spacings × 2 directions × 2 depth limits × 2 grades × 2 composite choices = 304 options; at most 200/);
  });

  it('when a spacing and a count are both given (or neither), then it asks for one', () => {
    expect(parseStudySpec({ region: { level: 'L2', wholeLevel: true } }).problems[0]).toMatch(/^spacing_ft: give a beam spacing range/);
  });
});

describe('bay study layout', () => {
  it('when the west bay (30 ft × 36 ft) is laid out running x at 10 ft, then 3 beams at 9 ft span 30 ft, the column-line members become girders and only that bay’s deck spans y', () => {
    const plan = twoBayPlan();
    const { bays } = regionBays(plan, { level: 'L2', polygon: WEST_BAY });
    expect(bays).toEqual([{ x0: 0, x1: 30, y0: 0, y1: 36 }]);
    const r = applyStudyOption(plan, 'L2', bays, { direction: 'x', spacing_ft: 10, beamCount: null, depthLimit_in: 18, Fy_ksi: null, composite: null });
    if (!r.ok) throw new Error(r.error);
    // ceil(36 / 10) = 4 divisions of 9 ft: the Infill tool's rule (equal spacing not more than asked).
    expect(r.beams).toBe(3);
    expect(r.beamSpacing_ft).toBe(9);
    const beams = r.plan.members.filter((m) => m.kind === 'beam' && m.start[1] === m.end[1]);
    expect(beams.map((m) => [m.start, m.end])).toEqual([[[0, 9], [30, 9]], [[0, 18], [30, 18]], [[0, 27], [30, 27]]]);
    expect(beams.every((m) => m.maxDepth_in === 18)).toBe(true);
    // The old beams inside the bay (b2, b3) are gone; b1 and b4 on grid lines 1 and 2 carry the new beams.
    expect(r.plan.members.filter((m) => m.start[0] === m.end[0] && m.start[0] > 0 && m.start[0] < 30)).toEqual([]);
    expect(r.plan.members.filter((m) => m.id === 'b1' || m.id === 'b4').map((m) => m.kind)).toEqual(['girder', 'girder']);
    // The east bay keeps its framing and its deck span.
    expect(r.plan.members.find((m) => m.id === 'b5')?.kind).toBe('beam');
    const decks = r.plan.decks.map((d) => ({ span: d.spanDirection, area: polygonAreaFt2(d.polygon) }));
    expect(decks).toEqual([{ span: 'x', area: 30 * 36 }, { span: 'y', area: 30 * 36 }]);
  });

  it('when a polygon is split by a rectangle, then the pieces add up to its area (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: -20, max: 20 }), fc.integer({ min: -20, max: 20 }), fc.integer({ min: 1, max: 40 }), fc.integer({ min: 1, max: 40 }), (x, y, w, h) => {
        const poly: [number, number][] = [[0, 0], [50, 0], [50, 10], [25, 30], [0, 30]];
        const { inside, outside } = splitByRect(poly, { x0: x, x1: x + w, y0: y, y1: y + h });
        const sum = (inside ? polygonAreaFt2(inside) : 0) + outside.reduce((s, p) => s + polygonAreaFt2(p), 0);
        expect(sum).toBeCloseTo(polygonAreaFt2(poly), 6);
      }),
      { numRuns: 200 },
    );
  });
});

describe('bay study results', () => {
  const plan = twoBayPlan();
  const result = runStudy(plan, spec());

  it('when 10 spacings × 2 directions are tried, then 20 options come back in order with the contract fields', () => {
    expect(result.options).toHaveLength(20);
    expect(result.options.map((o) => o.id).slice(0, 2)).toEqual(['x-s6-dany-f50', 'x-s7-dany-f50']);
    for (const f of ['direction', 'spacing_ft', 'steelWeight_lb', 'steel_psf', 'pieces', 'maxDepth_in', 'cost', 'passes', 'lightest', 'cheapest', 'shallowest']) {
      expect(result.options[0], f).toHaveProperty(f);
    }
    expect(result.caution).toMatch(/licensed engineer/);
  });

  it('when the drawn framing (beams running y at 10 ft) is one of the options, then that option weighs what the scheme weighs now', () => {
    const same = result.options.find((o) => o.id === 'y-s10-dany-f50')!;
    expect(same.beams).toBe(2);
    expect(same.scheme.steelWeight_lb).toBeCloseTo(result.current.steelWeight_lb, 9);
  });

  it('when the lightest option is marked, then no passing option is lighter and it passes', () => {
    const marked = result.options.filter((o) => o.lightest);
    expect(marked.length).toBeGreaterThan(0);
    for (const m of marked) {
      expect(m.passes).toBe(true);
      for (const o of result.options.filter((x) => x.passes)) expect(o.scheme.steelWeight_lb).toBeGreaterThanOrEqual(m.scheme.steelWeight_lb);
    }
    const cheapest = result.options.filter((o) => o.cheapest);
    for (const m of cheapest) for (const o of result.options.filter((x) => x.passes)) expect(o.scheme.cost!).toBeGreaterThanOrEqual(m.scheme.cost!);
    const shallowest = result.options.filter((o) => o.shallowest);
    for (const m of shallowest) for (const o of result.options.filter((x) => x.passes)) expect(o.maxDepth_in!).toBeGreaterThanOrEqual(m.maxDepth_in!);
  });

  it('when cost is estimated, then it is tons × price per ton + connections × price each (two per member)', () => {
    const o = result.options[0];
    // shared/tonnage/cost.ts: short ton of 2,000 lb (common practice), 2 connections per member (common practice)
    // Two per beam or girder; column pieces (one per tier) carry none here.
    expect(o.scheme.connections % 2).toBe(0);
    expect(o.scheme.connections).toBeGreaterThan(0);
    expect(o.scheme.connections).toBeLessThan(2 * o.scheme.pieces);
    expect(o.scheme.cost).toBeCloseTo((o.scheme.steelWeight_lb / 2000) * 4200 + o.scheme.connections * 350, 6);
  });

  it('when the same study runs twice, then the results are the same', () => {
    expect(JSON.parse(JSON.stringify(runStudy(plan, spec())))).toEqual(JSON.parse(JSON.stringify(result)));
  });

  it('when the plan’s design is passed in as the base (the screen’s warm worker), then the results are the same', () => {
    expect(JSON.parse(JSON.stringify(runStudy(plan, spec(), { base: designScheme(plan) })))).toEqual(JSON.parse(JSON.stringify(result)));
  });

  it('when any option is made a scheme and designed on its own, then its tonnage equals the option’s (property, composite on, off or as the plan has it)', () => {
    const slabbed = slabPlan();
    const { bays } = regionBays(plan, { level: 'L2', polygon: WEST_BAY });
    const arb = fc.record({
      direction: fc.constantFrom('x' as const, 'y' as const),
      spacing_ft: fc.integer({ min: 5, max: 16 }),
      depthLimit_in: fc.constantFrom(null, 16, 21, 24),
      Fy_ksi: fc.constantFrom(null, 50, 65),
      composite: fc.constantFrom(null, true, false),
    });
    fc.assert(
      fc.property(arb, (a) => {
        // Composite options on the plan with a slab build-up (without one a member stays bare steel).
        const p = a.composite === null ? plan : slabbed;
        const s = spec({ spacing_ft: { from: a.spacing_ft, to: a.spacing_ft, step: 1 }, directions: [a.direction], depthLimits_in: [a.depthLimit_in], Fy_ksi: [a.Fy_ksi], composite: [a.composite] });
        const [option] = runStudy(p, s).options;
        expect(option.composite).toBe(a.composite);
        const specOne: StudyOptionSpec = studyOptionSpecs(s)[0];
        const applied = applyStudyOption(p, 'L2', bays, specOne);
        if (!applied.ok) return;
        const fresh = designScheme(applied.plan);
        if (a.composite === true) expect(fresh.members.some((m) => (m.studs ?? 0) > 0)).toBe(true);
        if (a.composite === false) expect(fresh.members.every((m) => (m.studs ?? null) === null)).toBe(true);
        // Beams, girders and the gravity columns by tier, as the Tonnage screen counts them.
        const tonnage = computeTonnage({ ...fresh, members: [...fresh.members, ...columnTonnageRows(fresh as unknown as Record<string, unknown>)] }, applied.plan.levels).totals;
        expect(option.scheme.steelWeight_lb).toBe(tonnage.steelWeight_lb);
        expect(option.scheme.pieces).toBe(tonnage.pieces);
        expect(option.scheme).toEqual(schemeStudyFigures(applied.plan, fresh, PRICES));
      }),
      { numRuns: 12 },
    );
  }, 120000);

  it('when the west bay of a slab plan is studied composite and bare, then the composite option is lighter and both pass', () => {
    const r = runStudy(slabPlan(), spec({ spacing_ft: { from: 10, to: 10, step: 1 }, directions: ['y'], composite: [true, false] }));
    const [c, b] = r.options;
    expect([c.id, b.id]).toEqual(['y-s10-dany-f50-c', 'y-s10-dany-f50-b']);
    expect(c.passes && b.passes).toBe(true);
    // AISC 360-16 I3.2a: the composite section's plastic moment exceeds the bare steel's, so a lighter
    // W-shape carries the same bay (common practice: composite floor framing weighs less than bare).
    expect(c.steelWeight_lb).toBeLessThan(b.steelWeight_lb);
    expect(c.scheme.steelWeight_lb).toBeLessThan(b.scheme.steelWeight_lb);
    expect(c.steel_psf).toBeLessThan(b.steel_psf);
    expect(c.lightest).toBe(true);
    expect(b.lightest).toBe(false);
  });

  it('when the whole level is studied by beam count, then both bays get the count and the region is the whole deck', () => {
    const r = runStudy(plan, spec({ spacing_ft: undefined, beamCount: { from: 2, to: 3, step: 1 }, region: { level: 'L2', wholeLevel: true }, directions: ['y'] }));
    expect(r.bays).toHaveLength(2);
    expect(r.floorArea_ft2).toBe(60 * 36);
    expect(r.options.map((o) => o.beams)).toEqual([4, 6]);
  });
});
