import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { dispatch } from '../../../src/features/editor/actions/action-registry';
import type { SavePlanOutcome } from '../../../src/features/editor/api/save-plan.api';
import { keepIssuedMarks } from '../../../src/features/editor/design/issued-marks';
import { LiveDesign } from '../../../src/features/editor/design/live-design';
import { createEditorStore } from '../../../src/features/editor/store/editor.store';
import { PlanAutosave } from '../../../src/features/editor/sync/plan-autosave';
import type { Plan } from '../../../shared/schemas/plan.schema';
import { twoBayPlan } from './plan-fixture';

// Marks once issued stay put (common practice): the Plan stores the marks its design gave.

async function designed(design: LiveDesign, plan: Plan) {
  design.request(plan);
  await vi.advanceTimersByTimeAsync(1);
  expect(design.snapshot.pending).toBe(false);
  return design.snapshot;
}

describe('the Plan keeps issued marks on its members', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  it('when a plan is opened and designed, then its marks are stored on the members with no undo step and no save', async () => {
    const store = createEditorStore({ plan: twoBayPlan() });
    const save = vi.fn(async (): Promise<SavePlanOutcome> => ({ kind: 'saved', revision: 2, repairs: [] }));
    const autosave = new PlanAutosave(store, 1, { save, storageKey: 'k' });
    autosave.start();
    const design = new LiveDesign(false);
    const snap = await designed(design, store.getState().plan);
    expect(keepIssuedMarks(store, snap, (a, b) => autosave.absorb(a, b))).toBe(true);
    const marks = new Map(snap.result!.members.map((m) => [m.id, m.mark]));
    for (const m of store.getState().plan.members) {
      expect(m.mark).toBe(marks.get(m.id));
      expect(m.markLocked).toBeUndefined();
    }
    expect(store.temporal.getState().pastStates).toHaveLength(0);
    await vi.advanceTimersByTimeAsync(2000);
    expect(save).not.toHaveBeenCalled();
    expect(autosave.snapshot.status).toBe('saved');
    // A second pass has nothing to store.
    expect(keepIssuedMarks(store, await designed(design, store.getState().plan), (a, b) => autosave.absorb(a, b))).toBe(false);
    autosave.stop();
  });

  it('when a beam is added after the marks were issued, then no other member’s mark changes and the save carries them', async () => {
    const store = createEditorStore({ plan: twoBayPlan() });
    const save = vi.fn(async (_r: number, _p: Plan): Promise<SavePlanOutcome> => ({ kind: 'saved', revision: 2, repairs: [] }));
    const autosave = new PlanAutosave(store, 1, { save, storageKey: 'k' });
    autosave.start();
    const design = new LiveDesign(false);
    keepIssuedMarks(store, await designed(design, store.getState().plan), (a, b) => autosave.absorb(a, b));
    const before = new Map(store.getState().plan.members.map((m) => [m.id, m.mark]));
    // Plan order would put a beam near y = 0 first; a fresh numbering would move the others.
    dispatch(store, 'column.add', { at: [-20, 0] });
    dispatch(store, 'member.add', { kind: 'beam', start: [-20, 0], end: [0, 0] });
    const snap = await designed(design, store.getState().plan);
    keepIssuedMarks(store, snap, (a, b) => autosave.absorb(a, b));
    const after = store.getState().plan.members;
    for (const m of after) if (before.has(m.id)) expect(m.mark, m.id).toBe(before.get(m.id));
    const added = after.find((m) => !before.has(m.id))!;
    expect(added.mark).toMatch(/^2B\d+$/);
    expect([...before.values()]).not.toContain(added.mark);
    await vi.advanceTimersByTimeAsync(700);
    expect(save).toHaveBeenCalledTimes(1);
    expect(save.mock.calls[0][1].members.find((m) => m.id === added.id)!.mark).toBe(added.mark);
    autosave.stop();
  });

  it('when the plan is read only, then nothing is written', async () => {
    const store = createEditorStore({ plan: twoBayPlan(), readOnly: true });
    const design = new LiveDesign(false);
    const plan = store.getState().plan;
    expect(keepIssuedMarks(store, await designed(design, plan), () => {})).toBe(false);
    expect(store.getState().plan).toBe(plan);
  });
});
