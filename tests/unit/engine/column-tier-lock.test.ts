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
