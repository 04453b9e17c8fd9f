/**
 * `calc plan` copies each member with its fields written out (server/cli/plan-output.ts). These
 * tests hold the copies to the key-by-key copy they replace: the same text for plans with and
 * without the wet-concrete stage, and a member with a field the copy does not list keeps it.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { parsePlanFile, type Plan } from '../../../shared/schemas/plan.schema';
import { designScheme, type SchemeMember } from '../../../shared/engine/index';
import { planOutput, withCompositeFields } from '../../../server/cli/plan-output';

const twoBay = (): Plan => parsePlanFile(JSON.parse(readFileSync(new URL('../../fixtures/plans/two-bay.plan.json', import.meta.url), 'utf8'))).plan!;

/** The copies as they were written before: a spread, then every key but design and loads. */
const spreadCopy = (m: SchemeMember) => ({ ...m, studs: m.studs ?? null, camber_in: m.camber_in ?? null, percentComposite: m.percentComposite ?? null });
const keyByKeyDefault = (m: SchemeMember) => Object.fromEntries(Object.entries(m).filter(([k]) => k !== 'design' && k !== 'loads'));

describe('calc plan member copies', () => {
  const plans: [string, Plan][] = [['bare steel', twoBay()], ['wet-concrete stage (superimposed-dead deflection setting)', (() => {
    const p = twoBay();
    p.designBasis.totalDeflectionIncludes = 'superimposedDeadAndLive';
    return p;
  })()]];
  for (const [what, plan] of plans) {
    it(`when the plan is ${what}, then each view's text equals the key-by-key copy's`, () => {
      const result = designScheme(plan);
      expect(result.members.length).toBeGreaterThan(3);
      const fast = result.members.map(withCompositeFields);
      const slow = result.members.map(spreadCopy);
      expect(JSON.stringify(fast)).toBe(JSON.stringify(slow));
      const doc = (members: SchemeMember[]) => ({ ...result, members, repairs: [] });
      expect(JSON.stringify(planOutput(doc(fast), 'default'))).toBe(JSON.stringify({ ...doc(slow), members: slow.map(keyByKeyDefault) }));
      expect(JSON.stringify(planOutput(doc(fast), 'detail'))).toBe(JSON.stringify(doc(slow)));
      // planOutput adds the composite fields itself: the engine's members as they come give the same text in every view.
      const raw = doc(result.members);
      expect(JSON.stringify(planOutput(raw, 'default'))).toBe(JSON.stringify({ ...doc(slow), members: slow.map(keyByKeyDefault) }));
      expect(JSON.stringify(planOutput(raw, 'detail'))).toBe(JSON.stringify(doc(slow)));
      const summaryKeys = ['id', 'mark', 'shape', 'passes', 'ratio', 'governing', 'studs', 'camber_in', 'percentComposite', 'reactions'] as const;
      const slowSummary = slow.map((m) => Object.fromEntries(summaryKeys.map((k) => [k, m[k]])));
      expect(JSON.stringify((planOutput(raw, 'summary') as { members: unknown[] }).members)).toBe(JSON.stringify(slowSummary));
    }, 60_000);
  }

  it('when a member carries a field the written-out copy does not list, then the field is kept in order', () => {
    const m = { ...designScheme(twoBay()).members[0], extraNote: 'kept' } as SchemeMember & { extraNote: string };
    const copied = withCompositeFields(m) as unknown as Record<string, unknown>;
    expect(copied.extraNote).toBe('kept');
    expect(Object.keys(copied).slice(-4)).toEqual(['extraNote', 'studs', 'camber_in', 'percentComposite']);
    const out = planOutput({ ...designScheme(twoBay()), members: [copied as unknown as SchemeMember], repairs: [] }, 'default') as { members: Record<string, unknown>[] };
    expect(out.members[0].extraNote).toBe('kept');
    expect('design' in out.members[0]).toBe(false);
  }, 60_000);
});
