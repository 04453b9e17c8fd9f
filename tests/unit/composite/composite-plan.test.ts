import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { parsePlanFile, type Plan } from '../../../shared/schemas/plan.schema';
import { designScheme } from '../../../shared/engine/scheme/design-scheme.scheme';

// The two-bay fixture (an invented scheme of our own) with a slab build-up on its deck.
const slab = { ribHeight_in: 3, toppingThickness_in: 3.25, ribAvgWidth_in: 6, ribSpacing_in: 12, concreteWeight_pcf: 115, fc_ksi: 3, deckWeight_psf: 2 };
function plan(composite: boolean): Plan {
  const doc = JSON.parse(readFileSync(new URL('../../fixtures/plans/two-bay.plan.json', import.meta.url), 'utf8'));
  doc.version = 2;
  doc.designBasis.composite = { enabled: composite };
  for (const d of doc.decks) d.slab = slab;
  return parsePlanFile(doc).plan!;
}

describe('composite design of a plan', () => {
  it('when the plan is composite, then every member is composite with studs, the steel is lighter than bare and equilibrium holds', () => {
    const c = designScheme(plan(true));
    const bare = designScheme(plan(false));
    expect(c.members.every((m) => m.passes)).toBe(true);
    expect(c.members.every((m) => (m.studs ?? 0) > 0 && m.percentComposite! >= 0.25)).toBe(true);
    expect(c.totals.steelWeight_lb).toBeLessThan(bare.totals.steelWeight_lb);
    for (const r of [c, bare]) for (const k of ['D', 'L'] as const) expect(r.equilibrium[k].reactions_kip).toBeCloseTo(r.equilibrium[k].applied_kip, 6);
    // slab 47.5 psf from the build-up replaces the zone's dead_psf in both (calc-interface.md "Additions")
    expect(c.equilibrium.D.applied_kip - c.members.reduce((s, m) => s + (m.weight_plf * m.span_ft) / 1000, 0)).toBeCloseTo(
      bare.equilibrium.D.applied_kip - bare.members.reduce((s, m) => s + (m.weight_plf * m.span_ft) / 1000, 0), 6);
  });

  it('when the effective width is taken from the framing, then interior beams get span/8 each side and the edge beam stops at the slab edge', () => {
    const c = designScheme(plan(true));
    const b2 = c.members.find((m) => m.id === 'b2')!.design!.composite!;
    const b1 = c.members.find((m) => m.id === 'b1')!.design!.composite!;
    expect(b2.effectiveWidth_in).toBeCloseTo(108, 6); // 36 ft span: 54 in per side < 60 in (half of 10 ft), AISC 360-16 I3.1a
    expect(b1.effectiveWidth_in).toBeCloseTo(54, 1); // on the slab edge: 54 + 0
    expect(b2.deckOrientation).toBe('perpendicular');
    const girder = c.members.find((m) => m.kind === 'girder')!.design!.composite!;
    expect(girder.deckOrientation).toBe('parallel');
    expect(girder.construction.Lb_ft).toBeGreaterThan(0); // parallel deck does not brace the bare girder
  });

  it('when one member is marked non-composite, then it stays bare steel and says why', () => {
    const p = plan(true);
    p.members.find((m) => m.id === 'b4')!.composite = false;
    const c = designScheme(p);
    const b4 = c.members.find((m) => m.id === 'b4')!;
    expect(b4.studs).toBeNull();
    expect(b4.design!.composite).toBeUndefined();
    expect(b4.compositeNote).toBe('non-composite by the engineer');
  });

  it('when a girder carries beams, then its stud check runs at the beam points with the studs between each load and its support', () => {
    const c = designScheme(plan(true));
    const g = c.members.find((m) => m.kind === 'girder')!;
    const comp = g.design!.composite!;
    expect(comp.studsToCriticalSection).toBe(Math.floor((comp.studs * Math.min(comp.criticalSection_ft, g.span_ft - comp.criticalSection_ft)) / g.span_ft + 1e-9));
  });
});
