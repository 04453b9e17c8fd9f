import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { designScheme, memberDeflectionLimits } from '../../../shared/engine/index';
import { parsePlanFile, type Plan } from '../../../shared/schemas/plan.schema';

// Issue 16 item 14: per-member bracing and deflection limits (members[].bracing,
// members[].Lb_override_ft, members[].deflectionLimits) as the scheme design uses them.

const base = (): Plan => parsePlanFile(JSON.parse(readFileSync(resolve(__dirname, '../../fixtures/plans/two-bay.plan.json'), 'utf8'))).plan!;
const withB2 = (plan: Plan, settings: Partial<Plan['members'][number]>): Plan => ({ ...plan, members: plan.members.map((m) => (m.id === 'b2' ? { ...m, ...settings } : m)) });
const limitOf = (r: ReturnType<typeof designScheme>, id: string, check: string) => r.members.find((m) => m.id === id)!.design!.checks.find((c) => c.name === check)!.limit_n;

describe('per-member deflection limits', () => {
  it('when a member sets live only, then live is its own and total follows the design basis', () => {
    const used = memberDeflectionLimits({ deflectionLimits: { live: 360, total: 240 } }, { deflectionLimits: { live: 600, total: null } });
    expect(used).toEqual({ live: 600, total: 240, source: { live: 'member', total: 'basis' } });
    expect(memberDeflectionLimits({ deflectionLimits: { live: 360, total: null } }, {})).toEqual({ live: 360, total: null, source: { live: 'basis', total: 'basis' } });
  });

  it('when b2 is re-designed after its limit is set (reusing the previous design), then only b2 takes span/600', () => {
    const plan = base();
    const first = designScheme(plan);
    const next = designScheme(withB2(plan, { deflectionLimits: { live: 600 } }), { previous: first });
    expect(limitOf(next, 'b2', 'deflectionLive')).toBe(600);
    expect(limitOf(next, 'b3', 'deflectionLive')).toBe(360); // design basis (IBC Table 1604.3 floor default)
    expect(limitOf(next, 'b2', 'deflectionTotal')).toBe(240);
    // And back: clearing it returns the basis limit (the memo never hands back the span/600 design).
    const cleared = designScheme(plan, { previous: next });
    expect(limitOf(cleared, 'b2', 'deflectionLive')).toBe(360);
    expect(cleared.members.find((m) => m.id === 'b2')!.shape).toBe(first.members.find((m) => m.id === 'b2')!.shape);
  });

  it('when b2 is braced at its third points, then its governing Lb is 12 ft (36 ft / 3) and its neighbours keep Lb 0 (deck)', () => {
    const r = designScheme(withB2(base(), { bracing: { points_ft: [12, 24] } }));
    expect(r.members.find((m) => m.id === 'b2')!.Lb_ft).toBe(12);
    expect(r.members.find((m) => m.id === 'b3')!.Lb_ft).toBe(0);
  });

  it('property: a stricter live limit on a member never gives it a lighter shape (selection picks the lightest passing)', () => {
    const plan = base();
    const weightAt = (n: number) => designScheme(withB2(plan, { deflectionLimits: { live: n } })).members.find((m) => m.id === 'b2')!.weight_plf;
    fc.assert(
      fc.property(fc.integer({ min: 200, max: 1200 }), fc.integer({ min: 0, max: 800 }), (n, extra) => weightAt(n + extra) >= weightAt(n)),
      { numRuns: 12, seed: 16014 },
    );
  });
});
