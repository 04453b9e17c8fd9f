import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = join(__dirname, '../../..');

/** Runs `npm run -s calc -- <args>` with stdin, as an engineer would. */
function calc(args: string[], stdin = ''): { code: number | null; stdout: string; json: any } {
  const r = spawnSync('npm', ['run', '-s', 'calc', '--', ...args], { cwd: root, input: stdin, encoding: 'utf8', timeout: 60000 });
  let json: unknown = undefined;
  json = JSON.parse(r.stdout); // throws (fails the test) unless stdout is exactly one JSON document
  return { code: r.status, stdout: r.stdout, json };
}

const member = {
  span_ft: 32,
  loads: [
    { case: 'D', kind: 'uniform', w_klf: 0.6 },
    { case: 'L', kind: 'uniform', w_klf: 0.8 },
    { case: 'D', kind: 'partial', w_klf: 0.3, from_ft: 0, to_ft: 12 },
    { case: 'L', kind: 'point', P_kip: 6, x_ft: 16 },
  ],
  bracing: 'continuous', method: 'LRFD', Fy_ksi: 50, deflectionLimits: { live: 360, total: 240 },
  maxDepth_in: 21, includeSelfWeight: true,
};

describe('npm run -s calc -- member (spawned)', () => {
  it('when a member can be designed, then stdout is one JSON document with the contract fields and exit code 0', () => {
    const r = calc(['member', '-'], JSON.stringify(member));
    expect(r.code).toBe(0);
    expect(r.stdout.trim().startsWith('{')).toBe(true);
    for (const f of ['shape', 'weight_plf', 'passes', 'governing', 'Mr_kipft', 'Mc_kipft', 'Vr_kip', 'Vc_kip', 'Mp_kipft', 'Mn_kipft',
      'Lp_ft', 'Lr_ft', 'Lb_ft', 'Cb', 'deflectionLive_in', 'deflectionTotal_in', 'ratios', 'reactions', 'checks']) {
      expect(r.json, f).toHaveProperty(f);
    }
    expect(r.json.passes).toBe(true);
    expect(r.json.ratio).toBeLessThanOrEqual(1);
    expect(r.json.reactions.start).toHaveProperty('D_kip');
    expect(r.json.checks[0]).toMatchObject({ name: 'flexure', clause: expect.stringContaining('AISC 360-16'), combination: '1.2D+1.6L' });
  }, 90000);

  it('when a locked shape does not pass, then exit code is 1 and the shape is reported as is', () => {
    const r = calc(['member', '-'], JSON.stringify({ ...member, shape: 'W12X14' }));
    expect(r.code).toBe(1);
    expect(r.json.shape).toBe('W12X14');
    expect(r.json.passes).toBe(false);
  }, 90000);

  it('when the input is bad, then exit code is 2 with an error naming each field path', () => {
    const bad = { ...member, loads: [...member.loads, { case: 'L', kind: 'point', P_kip: 2, x_ft: 40 }], shape: 'W18X51' };
    const r = calc(['member', '-'], JSON.stringify(bad));
    expect(r.code).toBe(2);
    expect(r.json.error.message).toBe('invalid member input');
    expect(r.json.error.problems).toEqual([
      'loads[4].x_ft: must be within the span 0–32 ft',
      'shape: unknown W-shape "W18X51" (not in AISC Shapes Database v15.0)',
    ]);
  }, 90000);

  it('when the subcommand is unknown or the file is missing, then exit code is 2 with the same error shape', () => {
    const u = calc(['beam', '-'], '{}');
    expect(u.code).toBe(2);
    expect(u.json.error.problems[0]).toMatch(/^subcommand: must be one of member/);
    const m = calc(['member', join(root, 'no-such-file.json')]);
    expect(m.code).toBe(2);
    expect(m.json.error.problems[0]).toMatch(/^input: cannot read/);
  }, 90000);
});
