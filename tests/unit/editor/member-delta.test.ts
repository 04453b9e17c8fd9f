import fc from 'fast-check';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { LiveDesign } from '../../../src/features/editor/design/live-design';
import type { DesignReply, DesignRequest } from '../../../src/features/editor/design/live-design.types';
import { applyMemberDelta, memberDelta } from '../../../src/features/editor/design/member-delta';
import { designScheme, type SchemeMember, type SchemeResult } from '../../../shared/engine/index';
import type { Plan } from '../../../shared/schemas/plan.schema';
import { regularBuildingPlan } from '../../bench/plan.bench';

// The design worker sends only the members that differ from its last reply; the main thread
// rebuilds the list from the members it already holds. What the main thread ends with must read
// exactly as the worker's result, so every check here compares the JSON text.

const SHAPES = ['W18X40', 'W21X50', 'W16X31', 'W24X55', 'W14X22'];

/** The members whose JSON differs from the same place in `before` (the expected delta, worked out another way). */
function changedIndexes(before: SchemeMember[], after: SchemeMember[]): number[] {
  return after.flatMap((m, i) => (before[i] && JSON.stringify(before[i]) === JSON.stringify(m) ? [] : [i]));
}

/** One round of the protocol: the worker's delta and the main thread's copy of `before`, each through structured clone. */
function roundTrip(mainBefore: SchemeMember[] | undefined, workerBefore: SchemeMember[] | undefined, after: SchemeResult): SchemeMember[] {
  return applyMemberDelta(mainBefore, structuredClone(memberDelta(workerBefore, after.members)));
}

describe('member delta between design replies', () => {
  it('when one beam of a three-level building is locked to another size, then only the members whose result changed are sent, and the rebuilt list reads as the new result', () => {
    const plan = regularBuildingPlan(3, 4, 3);
    const first = designScheme(plan);
    const edited = structuredClone(plan);
    const beam = edited.members.find((m) => m.id === 'L3-B6-1')!;
    beam.shape = 'W24X55';
    const second = designScheme(edited, { previous: first });

    const delta = memberDelta(first.members, second.members);
    const sent = delta.flatMap((m, i) => (m ? [i] : []));
    expect(sent).toEqual(changedIndexes(first.members, second.members));
    // The locked beam changed; so did what carries it (its girder), and nothing on the other levels.
    expect(sent.map((i) => second.members[i].id)).toContain('L3-B6-1');
    expect(sent.length).toBeGreaterThan(0);
    expect(sent.length).toBeLessThan(second.members.length / 3);
    for (const i of sent) expect(second.members[i].level).toBe('L3');

    const mainCopy = structuredClone(first.members);
    expect(JSON.stringify(applyMemberDelta(mainCopy, structuredClone(delta)))).toBe(JSON.stringify(second.members));
    // Unchanged members are the main thread's own objects, not new copies.
    const rebuilt = applyMemberDelta(mainCopy, delta);
    const unchanged = delta.findIndex((m) => m === null);
    expect(rebuilt[unchanged]).toBe(mainCopy[unchanged]);
  });

  it('when there is no earlier reply, then every member is sent', () => {
    const r = designScheme(regularBuildingPlan(2, 2, 2));
    const delta = memberDelta(undefined, r.members);
    expect(delta.every((m) => m !== null)).toBe(true);
    expect(JSON.stringify(applyMemberDelta(undefined, delta))).toBe(JSON.stringify(r.members));
  });

  it('when a member has the same values with its keys in another order, or another id at the same place, then it is sent', () => {
    const r = designScheme(regularBuildingPlan(2, 2, 2));
    const [a, b] = r.members;
    const reordered = Object.fromEntries(Object.entries(a).reverse()) as unknown as SchemeMember;
    expect(memberDelta([a], [reordered])).toEqual([reordered]);
    expect(memberDelta([a, b], [a, { ...b, id: `${b.id}x` }])[1]).not.toBeNull();
    expect(memberDelta([a, b], [structuredClone(a), b])).toEqual([null, null]);
    // A value that differs only in a nested check (a ratio in the design's checks).
    const nested = structuredClone(a);
    nested.design!.checks[0].ratio += 1e-12;
    expect(memberDelta([a], [nested])).toEqual([nested]);
  });

  it('when the delta refers to a member the main thread does not have, then applying it throws naming the member', () => {
    expect(() => applyMemberDelta(undefined, [null])).toThrow('member 1');
    expect(() => applyMemberDelta([], [null])).toThrow('member 1');
  });

  it('property: over any chain of size locks and unlocks, the main thread rebuilt from deltas reads as each new result', () => {
    const base = regularBuildingPlan(2, 3, 2);
    const beams = base.members.filter((m) => m.kind === 'beam').map((m) => m.id);
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.constantFrom(...beams), fc.option(fc.constantFrom(...SHAPES), { nil: null })), { minLength: 1, maxLength: 6 }), (edits) => {
        let plan: Plan = structuredClone(base);
        let worker = designScheme(plan);
        let main = roundTrip(undefined, undefined, worker);
        for (const [id, shape] of edits) {
          plan = structuredClone(plan);
          plan.members.find((m) => m.id === id)!.shape = shape;
          const next = designScheme(plan, { previous: worker });
          main = roundTrip(main, worker.members, next);
          worker = next;
          expect(JSON.stringify(main)).toBe(JSON.stringify(next.members));
        }
      }),
      { numRuns: 15 },
    );
  });
});

/** A Worker stand-in that speaks the worker's protocol (or a broken one) on the same thread. */
class FakeWorker {
  static broken = false;
  onmessage: ((e: MessageEvent<DesignReply>) => void) | null = null;
  onerror: (() => void) | null = null;
  terminated = false;
  private previous: SchemeResult | undefined;
  private sent: SchemeMember[] | undefined;
  postMessage(msg: DesignRequest) {
    const result = designScheme(structuredClone(msg.plan) as Plan, { previous: this.previous });
    this.previous = result;
    // Broken: claims every member is as before, with nothing sent before.
    const members = FakeWorker.broken ? result.members.map(() => null) : memberDelta(this.sent, result.members);
    this.sent = result.members;
    const reply = structuredClone({ seq: msg.seq, result: { ...result, members: [] }, members, engineMs: 1 });
    queueMicrotask(() => this.onmessage?.({ data: reply } as unknown as MessageEvent<DesignReply>));
  }
  terminate() {
    this.terminated = true;
  }
}

describe('the editor’s live design with the worker’s deltas', () => {
  afterEach(() => {
    vi.unstubAllGlobals();
    FakeWorker.broken = false;
  });

  it('when two edits are designed through the worker, then each published result reads as a design of that plan made here', async () => {
    vi.stubGlobal('Worker', FakeWorker);
    const design = new LiveDesign(true);
    let plan = regularBuildingPlan(2, 3, 2);
    for (const shape of [null, 'W21X50', 'W14X22']) {
      plan = structuredClone(plan);
      plan.members.find((m) => m.id === 'L2-B5-0')!.shape = shape;
      design.request(plan);
      await vi.waitFor(() => expect(design.snapshot.pending).toBe(false));
      expect(JSON.stringify(design.snapshot.result)).toBe(JSON.stringify(designScheme(plan)));
      if (shape) expect(design.snapshot.byId.get('L2-B5-0')!.shape).toBe(shape); // a locked size is kept
    }
    design.dispose();
  });

  it('when a reply is out of step with what the main thread holds, then the plan is designed on the main thread instead and the sizes still show', async () => {
    vi.stubGlobal('Worker', FakeWorker);
    FakeWorker.broken = true;
    const design = new LiveDesign(true);
    const plan = regularBuildingPlan(2, 2, 2);
    design.request(plan);
    await vi.waitFor(() => expect(design.snapshot.result).not.toBeNull());
    expect(design.snapshot.error).toBeNull();
    expect(JSON.stringify(design.snapshot.result)).toBe(JSON.stringify(designScheme(plan)));
    design.dispose();
  });
});
