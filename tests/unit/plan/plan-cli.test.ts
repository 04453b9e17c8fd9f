import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';

const run = (args: string[], input?: string) =>
  spawnSync('npx', ['tsx', 'server/cli/calc.ts', 'plan', ...args], { cwd: new URL('../../..', import.meta.url).pathname, input, encoding: 'utf8', timeout: 60_000 });

describe('npm run calc -- plan', () => {
  it('when given the two-bay fixture, then it prints the scheme and exits 0', () => {
    const r = run(['tests/fixtures/plans/two-bay.plan.json']);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.members).toHaveLength(11);
    expect(out.members[0]).toMatchObject({ id: 'gA12', mark: '2G1', kind: 'girder', passes: true });
    expect(out.columns.map((c: { id: string }) => c.id)).toEqual(['C-A1', 'C-A2', 'C-A3', 'C-B1', 'C-B2', 'C-B3']);
    expect(out.equilibrium.D.reactions_kip).toBeCloseTo(out.equilibrium.D.applied_kip, 9);
  }, 60_000);

  it('when the plan is bad, then it exits 2 with problems naming the element', () => {
    const doc = JSON.parse(readFileSync(new URL('../../fixtures/plans/two-bay.plan.json', import.meta.url), 'utf8'));
    doc.members[4].kind = 'joist';
    const r = run(['-'], JSON.stringify(doc));
    expect(r.status).toBe(2);
    const out = JSON.parse(r.stdout);
    expect(out.error.message).toBe('invalid plan file');
    expect(out.error.problems[0]).toContain('members[4] (id b1).kind');
  }, 60_000);

  it('when a member end lands on nothing, then it exits 1 and lists the problem', () => {
    const doc = JSON.parse(readFileSync(new URL('../../fixtures/plans/two-bay.plan.json', import.meta.url), 'utf8'));
    doc.members[5].end = [10, 40];
    const r = run(['-'], JSON.stringify(doc));
    expect(r.status).toBe(1);
    expect(JSON.parse(r.stdout).problems.map((p: { code: string; elementId: string }) => `${p.code}:${p.elementId}`)).toContain('member-end-unsupported:b2');
  }, 60_000);

  it('when a placed load is negative (uplift), then it exits 2 naming the load and field', () => {
    const doc = JSON.parse(readFileSync(new URL('../../fixtures/plans/two-bay.plan.json', import.meta.url), 'utf8'));
    doc.pointLoads[0].D_kip = -2;
    const r = run(['-'], JSON.stringify(doc));
    expect(r.status).toBe(2);
    const out = JSON.parse(r.stdout);
    expect(out.error.problems.join('\n')).toMatch(/pointLoads\[0\].*\.D_kip: must be 0 or more/);
  }, 60_000);
});
