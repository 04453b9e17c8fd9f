import { describe, expect, it } from 'vitest';
import { designScheme } from '../../../shared/engine/scheme/design-scheme.scheme';
import { columnInputProblems } from '../../../shared/schemas/plan-columns';
import { singleBay, zone } from '../takedown/plan-builder';

const base = () => singleBay(30, 30, 12, ['L2', 'L3', 'L4', 'L5'], zone('z', { dead_psf: 80, live_psf: 100 }));

describe('locked tier sizes (columns[].tierShapes)', () => {
  it('when the upper tier of a column is locked, then that tier keeps the size and is checked, and the lower tier is still sized', () => {
    const plan = base();
    plan.columns[0].tierShapes = [{ level: 'L5', shape: 'W14X120' }];
    const c = designScheme(plan).columns.find((x) => x.id === plan.columns[0].id)!;
    const upper = c.tiers.find((t) => t.tier === 2)!;
    const lower = c.tiers.find((t) => t.tier === 1)!;
    expect(upper).toMatchObject({ shape: 'W14X120', locked: true, passes: true });
    expect(lower.locked).toBe(false);
    // A locked tier does not bind the tiers below it: the lower tier is the lightest passing shape (design-basis §8).
    expect(lower.shape).toBe(designScheme(base()).columns[0].tiers.find((t) => t.tier === 1)!.shape);
    expect(c.levels.filter((l) => l.tier === 2).every((l) => l.shape === 'W14X120')).toBe(true);
  });

  it('when a locked tier size is over Lc/r 200 but strong enough, then it passes and the scheme warns naming the column, tier and Lc/r', () => {
    // Light floor (5 psf dead, 5 psf live) so W10X12 carries the top tier; 14 ft storeys: Lc/r = 168/0.785 = 214
    // (ry, AISC Shapes Database v15.0) over the 200 of the AISC 360-16 E2 User Note.
    const plan = singleBay(30, 30, 12, ['L2', 'L3', 'L4', 'L5'], zone('z', { dead_psf: 5, live_psf: 5 }));
    const id = plan.columns[0].id;
    plan.columns[0].tierShapes = [{ level: 'L5', shape: 'W10X12' }];
    const r = designScheme(plan);
    const upper = r.columns.find((x) => x.id === id)!.tiers.find((t) => t.tier === 2)!;
    expect(upper).toMatchObject({ shape: 'W10X12', locked: true, passes: true });
    const warnings = r.problems.filter((p) => p.code === 'column-slender');
    expect(warnings).toHaveLength(1);
    expect(warnings[0]).toMatchObject({ severity: 'warning', elementId: id });
    expect(warnings[0].message).toContain(`Column ${id}: tier 2`);
    expect(warnings[0].message).toContain('locked size W10X12 has Lc/r = 214');
    // Unlocked, the same tier is sized within the limit and nothing is said.
    const free = designScheme(singleBay(30, 30, 12, ['L2', 'L3', 'L4', 'L5'], zone('z', { dead_psf: 5, live_psf: 5 })));
    expect(free.columns[0].tiers.find((t) => t.tier === 2)!.shape).toBe('W10X17'); // 168/0.845 = 198.8
    expect(free.problems.filter((p) => p.code === 'column-slender')).toHaveLength(0);
  });

  it('when a tier lock names a level the column does not reach or a shape that is not a W-shape, then the problem names the column and field', () => {
    const plan = base();
    const id = plan.columns[1].id;
    plan.columns[1].tierShapes = [{ level: 'L9', shape: 'W14X90' }, { level: 'L2', shape: 'HSS8X8' }];
    const problems = columnInputProblems(plan);
    expect(problems.map((p) => p.code)).toEqual(['column-tier-unreached', 'column-shape-not-w']);
    expect(problems[0].message).toContain(`columns[1] (id ${id}).tierShapes[0].level`);
    expect(problems[1].message).toContain(`columns[1] (id ${id}).tierShapes[1].shape`);
    expect(problems.every((p) => p.elementId === id)).toBe(true);
  });
});
