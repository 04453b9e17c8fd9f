import { describe, expect, it } from 'vitest';
import { spawn, spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { statSync, utimesSync } from 'node:fs';

const root = join(__dirname, '../../..');
const fixture = 'tests/fixtures/plans/two-bay.plan.json';
/** `npm run -s calc -- …` as an engineer scripts it: stdout is a pipe here, never a terminal. */
const calc = (args: string[]) => spawnSync('npm', ['run', '-s', 'calc', '--', ...args], { cwd: root, encoding: 'utf8', timeout: 90_000 });

/** The members[] fields calc-interface.md names for `calc plan` (a contract). */
const CONTRACT_MEMBER_FIELDS = ['id', 'mark', 'kind', 'shape', 'span_ft', 'passes', 'governing', 'ratio', 'tributaryWidth_ft', 'tributaryArea_ft2', 'KLL', 'liveReductionFactor', 'Lb_ft', 'Cb', 'Mr_kipft', 'Mc_kipft', 'reactions'];

describe('npm run -s calc -- plan: views and layout', () => {
  it('when stdout is a pipe, then the default document is compact, carries every contract field and no per-member detail', () => {
    const r = calc(['plan', fixture]);
    expect(r.status).toBe(0);
    expect(r.stdout.trimEnd().split('\n')).toHaveLength(1);
    const out = JSON.parse(r.stdout);
    for (const k of ['members', 'columns', 'totals', 'equilibrium', 'problems']) expect(out, k).toHaveProperty(k);
    for (const f of CONTRACT_MEMBER_FIELDS) expect(out.members[0], f).toHaveProperty(f);
    expect(out.members[0].reactions.start).toHaveProperty('supportedBy');
    expect(out.members[0]).not.toHaveProperty('design');
    expect(out.members[0]).not.toHaveProperty('loads');
    expect(out.columns[0].levels[0]).toHaveProperty('Pr_kip');
    for (const f of ['steelWeight_lb', 'floorArea_ft2', 'steel_psf', 'pieces']) expect(out.totals).toHaveProperty(f);
  }, 90_000);

  it('when --detail and --pretty are given, then the document is indented and each member carries its checks and loads', () => {
    const detail = calc(['plan', '--detail', '--pretty', fixture]);
    expect(detail.status).toBe(0);
    expect(detail.stdout.startsWith('{\n  "name": ')).toBe(true);
    const out = JSON.parse(detail.stdout);
    expect(out.members[0].design.checks[0].clause).toContain('AISC 360-16');
    expect(out.members[0].loads.length).toBeGreaterThan(0);
    // The default view is the detail view less those two fields, value for value.
    const def = JSON.parse(calc(['plan', fixture]).stdout);
    const stripped = { ...out, members: out.members.map(({ design: _d, loads: _l, ...rest }: Record<string, unknown>) => rest) };
    expect(def).toEqual(stripped);
  }, 120_000);

  it('when --summary is given, then members carry id, mark, shape, ratio, governing and reactions only, with columns, totals and problems', () => {
    const r = calc(['plan', '--summary', fixture]);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    // studs, camber_in and percentComposite are on every calc plan member (null where not composite: calc-interface.md Additions).
    expect(Object.keys(out.members[0])).toEqual(['id', 'mark', 'shape', 'passes', 'ratio', 'governing', 'studs', 'camber_in', 'percentComposite', 'reactions']);
    expect(out.members[0]).toMatchObject({ id: 'gA12', mark: '2G1' });
    expect(Object.keys(out)).toEqual(['name', 'members', 'columns', 'totals', 'problems', 'caution']);
  }, 90_000);

  it('when an option is unknown or --summary meets --detail, then it exits 2 naming the option', () => {
    const r = calc(['plan', '--sumary', fixture]);
    expect(r.status).toBe(2);
    expect(JSON.parse(r.stdout).error.problems[0]).toContain('--sumary');
    const both = calc(['plan', '--summary', '--detail', fixture]);
    expect(both.status).toBe(2);
    expect(JSON.parse(both.stdout).error.problems[0]).toContain('--summary');
  }, 90_000);
});

describe('npm run -s calc: the bundled command line', () => {
  it('when the bundle is older than a source it was built from, then the next run rebuilds it before running', () => {
    const bundle = join(root, 'node_modules/.cache/baywright-calc/calc.mjs');
    expect(calc(['plan', '--summary', fixture]).status).toBe(0); // builds it if absent
    const old = new Date('2001-01-01T00:00:00Z');
    utimesSync(bundle, old, old); // every source is now newer than the bundle
    const r = calc(['plan', '--summary', fixture]);
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).members).toHaveLength(11);
    expect(statSync(bundle).mtimeMs).toBeGreaterThan(old.getTime() + 1000);
  }, 120_000);

  it('when the reader closes the pipe early (| head), then calc stops quietly with the exit code of the design, no stack trace', async () => {
    const full = calc(['plan', '--detail', '--pretty', fixture]);
    expect(full.status).toBe(0);
    expect(full.stdout.length).toBeGreaterThan(65_536); // more than a pipe holds, so a write meets the closed pipe
    const child = spawn('npm', ['run', '-s', 'calc', '--', 'plan', '--detail', '--pretty', fixture], { cwd: root });
    let stderr = '';
    child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
    child.stdout.once('data', () => child.stdout.destroy());
    const code = await new Promise<number | null>((done) => child.on('close', done));
    expect(stderr).not.toMatch(/EPIPE|Error|at /);
    expect(code).toBe(full.status);
  }, 120_000);

  it("when the launcher starts, then this Node's V8 knows the flag it sets for a short process", async () => {
    const { CALC_V8_FLAGS } = await import('../../../server/cli/calc-v8-flags.mjs');
    expect(CALC_V8_FLAGS).toMatch(/^--interrupt-budget=\d+$/);
    // V8 ignores an unknown flag set at run time, so ask a fresh Node, which refuses one (exit 9).
    const r = spawnSync(process.execPath, [CALC_V8_FLAGS, '-e', '0'], { encoding: 'utf8' });
    expect(r.status, r.stderr).toBe(0);
    expect(spawnSync(process.execPath, ['--interrupt-budgett=1', '-e', '0']).status).toBe(9);
  });
});
