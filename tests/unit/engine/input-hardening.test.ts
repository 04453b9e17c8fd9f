import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { runMemberCommand } from '../../../server/cli/member.command';
import { runPlanCommand } from '../../../server/cli/plan.command';
import { designMember, designScheme } from '../../../shared/engine/index';
import type { Plan } from '../../../shared/schemas/plan.schema';
import { FLAGGED_PLANS, REFUSED_PLANS, memberDoc, twoBayDoc } from '../../fixtures/hardening-cases';

// Engine input hardening (issue 17 item 6): every case answers at once with a message naming
// the field or element: exit 2 for input outside the engine's bounds, exit 1 with a problem for
// a plan the engine reads but cannot honestly design as drawn.

const dir = mkdtempSync(join(tmpdir(), 'baywright-hardening-'));
let n = 0;
const fileWith = (doc: unknown): string => {
  const path = join(dir, `case-${++n}.json`);
  writeFileSync(path, JSON.stringify(doc));
  return path;
};

/** Runs a command in-process and measures it (the engine's own time; no process start-up). */
async function timed<T>(f: () => T | Promise<T>): Promise<{ out: T; ms: number }> {
  const t0 = performance.now();
  const out = await f();
  return { out, ms: performance.now() - t0 };
}

type ErrorJson = { error: { message: string; problems: string[] } };
type PlanJson = { problems: { code: string; elementId?: string; message: string }[]; equilibrium: Record<string, { applied_kip: number; reactions_kip: number }> };

describe('calc plan: input outside the bounds is refused with exit 2 naming the field', () => {
  for (const c of REFUSED_PLANS) {
    it(`when the plan has ${c.name}, then exit 2 with "${c.problem}" within a second`, async () => {
      const { out, ms } = await timed(() => runPlanCommand([fileWith(c.plan())]));
      expect(out.exitCode).toBe(2);
      expect((out.json as ErrorJson).error).toEqual({ message: 'invalid plan file', problems: [c.problem] });
      expect(ms).toBeLessThan(1000);
    });
  }

  it('when the process itself gets a column at x_ft 1e20, then it prints the JSON error on stdout and exits 2 (no abort)', () => {
    const r = spawnSync('npx', ['tsx', 'server/cli/calc.ts', 'plan', '-'], {
      cwd: new URL('../../..', import.meta.url).pathname, input: JSON.stringify(REFUSED_PLANS[0].plan()), encoding: 'utf8', timeout: 60_000,
    });
    expect(r.status).toBe(2);
    expect(JSON.parse(r.stdout)).toEqual({ error: { message: 'invalid plan file', problems: ['columns[0] (id C-A1).x_ft: must be within ±10000 ft (plan extent)'] } });
  }, 60_000);
});

describe('calc plan: a plan read but not designable as drawn exits 1 naming the element', () => {
  for (const c of FLAGGED_PLANS) {
    it(`when the plan has ${c.name}, then exit 1 with the ${c.code} problem on ${c.elementId} within a second`, async () => {
      const { out, ms } = await timed(() => runPlanCommand([fileWith(c.plan())]));
      expect(out.exitCode).toBe(1);
      const problems = (out.json as PlanJson).problems;
      expect(problems.find((p) => p.code === c.code && p.elementId === c.elementId)?.message).toBe(c.message);
      expect(problems.some((p) => p.code === 'support-cycle')).toBe(false);
      expect(ms).toBeLessThan(1000);
    });
  }

  it('when a point load is off the floor, then equilibrium shows its 5 kip unbalanced (applied includes it, no reaction does)', async () => {
    const base = (await timed(() => runPlanCommand([fileWith(twoBayDoc())]))).out.json as PlanJson;
    const off = (await timed(() => runPlanCommand([fileWith(FLAGGED_PLANS[1].plan())]))).out.json as PlanJson;
    // 5 kip dead load placed at (200, 200), outside every deck (invented case)
    expect(off.equilibrium.D.applied_kip - off.equilibrium.D.reactions_kip).toBeCloseTo(5, 6);
    expect(off.equilibrium.D.applied_kip - base.equilibrium.D.applied_kip).toBeCloseTo(5, 6);
    expect(off.equilibrium.D.reactions_kip).toBeCloseTo(base.equilibrium.D.reactions_kip, 6);
  });

  it('when two decks are identical, then the load is still carried twice (never light) and the problem says so', async () => {
    const base = (await timed(() => runPlanCommand([fileWith(twoBayDoc())]))).out.json as PlanJson;
    const dup = (await timed(() => runPlanCommand([fileWith(FLAGGED_PLANS[0].plan())]))).out.json as PlanJson;
    // 60 × 36 ft less the 6 × 6 ft opening = 2124 ft² at 50 + 15 psf dead, counted a second time (invented case)
    expect(dup.equilibrium.D.applied_kip - base.equilibrium.D.applied_kip).toBeGreaterThan((2124 * 65) / 1000);
  });
});

describe('calc member: magnitudes and constraints', () => {
  const member = (edit: (d: Record<string, any>) => void) => { const d = memberDoc(); edit(d); return fileWith(d); }; // eslint-disable-line @typescript-eslint/no-explicit-any
  const refused: [string, (d: Record<string, any>) => void, string][] = [ // eslint-disable-line @typescript-eslint/no-explicit-any
    ['w_klf 1e308', (d) => { d.loads = [{ case: 'D', kind: 'uniform', w_klf: 1e308 }]; }, 'loads[0].w_klf: must be at most 10000 klf'],
    ['P_kip 1e300', (d) => { d.loads[3].P_kip = 1e300; }, 'loads[3].P_kip: must be at most 100000 kip'],
    ['Fy_ksi 500', (d) => { d.Fy_ksi = 500; }, 'Fy_ksi: must be between 30 and 70 ksi'],
    ['an unknown locked shape', (d) => { d.shape = 'W99X1'; }, 'shape: unknown W-shape "W99X1" (not in AISC Shapes Database v15.0)'],
    ['brace points outside the span', (d) => { d.bracing = { points_ft: [10, 40] }; }, 'bracing.points_ft[1]: must be within the span 0–32 ft'],
    ['a deflection limit of 1e308', (d) => { d.deflectionLimits.live = 1e308; }, 'deflectionLimits.live: must be at most 100000 (span/n denominator)'],
  ];
  for (const [name, edit, problem] of refused) {
    it(`when the member has ${name}, then exit 2 with "${problem}" within a second`, async () => {
      const { out, ms } = await timed(() => runMemberCommand([member(edit)]));
      expect(out.exitCode).toBe(2);
      expect((out.json as ErrorJson).error).toEqual({ message: 'invalid member input', problems: [problem] });
      expect(ms).toBeLessThan(1000);
    });
  }

  it('when a size is locked deeper than maxDepth_in, then exit 1: it does not pass and the failure names the limit', async () => {
    const { out, ms } = await timed(() => runMemberCommand([member((d) => { d.shape = 'W24X55'; d.maxDepth_in = 21; })]));
    expect(out.exitCode).toBe(1);
    // AISC Shapes Database v15.0: W24X55 d = 23.6 in
    expect(out.json).toMatchObject({ shape: 'W24X55', passes: false, failure: 'Locked shape W24X55: depth d = 23.6 in is more than maxDepth_in = 21 in.' });
    expect(ms).toBeLessThan(1000);
  });

  it('when any member input lies within the bounds, then every number in the result is finite (never NaN or Infinity)', () => {
    const allFinite = (v: unknown): boolean =>
      typeof v === 'number' ? Number.isFinite(v) : Array.isArray(v) ? v.every(allFinite) : v !== null && typeof v === 'object' ? Object.values(v).every(allFinite) : true;
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 200, noNaN: true }),
        fc.double({ min: 0, max: 10_000, noNaN: true }),
        fc.double({ min: 0, max: 100_000, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.constantFrom<'LRFD' | 'ASD'>('LRFD', 'ASD'),
        (span, w, P, at, method) => {
          const r = designMember({
            span_ft: span, method, Fy_ksi: 50, bracing: 'none', deflectionLimits: { live: 360, total: 240 }, includeSelfWeight: true,
            loads: [{ case: 'D', kind: 'uniform', w_klf: w }, { case: 'L', kind: 'point', P_kip: P, x_ft: at * span }],
          });
          return allFinite(r);
        },
      ),
      { seed: 1717, numRuns: 60 },
    );
  });
});

describe('engine alone (schema bypassed): cost does not grow with coordinate magnitude', () => {
  it('when a column sits at 1e20 ft and a member runs to 1e12 ft, then the scheme is designed within a second with each named', () => {
    const plan = twoBayDoc() as unknown as Plan;
    plan.pointLoads[0].id = 'p1';
    plan.lineLoads[0].id = 'w1';
    plan.openings[0].id = 'o1';
    plan.columns[0].x_ft = 1e20;
    plan.members[0].end = [1e12, 0];
    plan.lineLoads.push({ id: 'w2', level: 'L2', start: [-1e12, -1e12], end: [1e12, 1e12], D_klf: 0.1, L_klf: 0 });
    const t0 = performance.now();
    const r = designScheme(plan);
    expect(performance.now() - t0).toBeLessThan(1000);
    expect(r.problems.find((p) => p.code === 'member-end-unsupported')?.message).toBe('Member gA12: end (1000000000000, 0) lands on no column, member or wall at level L2');
    expect(r.problems.find((p) => p.elementId === 'w2')?.code).toBe('load-off-floor');
    expect(r.members.find((m) => m.id === 'gA12')?.passes ?? false).toBe(false);
  });
});
