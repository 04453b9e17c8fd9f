import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = join(__dirname, '../../../..');
const request = JSON.parse(readFileSync(join(root, 'tests/fixtures/studies/two-bay-west.study.json'), 'utf8'));

/** Runs `npm run -s calc -- study -` with the request on standard input. */
function calc(stdin: string): { code: number | null; json: any } {
  const r = spawnSync('npm', ['run', '-s', 'calc', '--', 'study', '-'], { cwd: root, input: stdin, encoding: 'utf8', timeout: 90000 });
  return { code: r.status, json: JSON.parse(r.stdout) }; // throws unless stdout is exactly one JSON document
}

describe('npm run -s calc -- study (spawned)', () => {
  it('when a bay is studied over 6–15 ft both ways, then stdout is one JSON document of 20 options with the contract fields and exit 0', () => {
    const r = calc(JSON.stringify({ ...request, spacing_ft: { from: 6, to: 15, step: 1 } }));
    expect(r.code).toBe(0);
    expect(r.json.options).toHaveLength(20);
    for (const f of ['direction', 'spacing_ft', 'steelWeight_lb', 'steel_psf', 'pieces', 'maxDepth_in', 'cost', 'passes', 'lightest', 'cheapest', 'shallowest']) {
      expect(r.json.options[0], f).toHaveProperty(f);
    }
    expect(r.json.options.filter((o: { lightest: boolean }) => o.lightest).length).toBeGreaterThan(0);
    // No composite range asked: every option designs the framing as the plan has it.
    expect(r.json.options.map((o: { composite: unknown }) => o.composite)).toEqual(Array(20).fill(null));
  }, 120000);

  it('when the step is 0 and the spacing negative, then exit 2 with the error contract naming both fields', () => {
    const r = calc(JSON.stringify({ ...request, spacing_ft: { from: -2, to: 15, step: 0 } }));
    expect(r.code).toBe(2);
    expect(r.json.error.message).toBe('invalid study request');
    expect(r.json.error.problems).toEqual(['spacing_ft.from: must be more than 0 ft (got -2)', 'spacing_ft.step: must be more than 0 ft (got 0)']);
  }, 120000);
});
