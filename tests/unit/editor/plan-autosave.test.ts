import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { dispatch } from '../../../src/features/editor/actions/action-registry';
import type { SavePlanOutcome } from '../../../src/features/editor/api/save-plan.api';
import { createEditorStore } from '../../../src/features/editor/store/editor.store';
import { PlanAutosave } from '../../../src/features/editor/sync/plan-autosave';
import { addMember } from '../../../src/features/editor/actions/plan-edits';
import type { Plan } from '../../../shared/schemas/plan.schema';
import { twoBayPlan } from './plan-fixture';

function memoryStorage() {
  const data = new Map<string, string>();
  return { getItem: (k: string) => data.get(k) ?? null, setItem: (k: string, v: string) => void data.set(k, v), removeItem: (k: string) => void data.delete(k), data };
}

describe('autosave with revisions', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  it('when several edits come quickly, then one PUT is sent 600 ms after the last, with the base revision', async () => {
    const store = createEditorStore({ plan: twoBayPlan() });
    const save = vi.fn(async (_revision: number, _plan: Plan): Promise<SavePlanOutcome> => ({ kind: 'saved', revision: 8, repairs: [] }));
    const storage = memoryStorage();
    const autosave = new PlanAutosave(store, 7, { save, storage, storageKey: 'k' });
    autosave.start();
    dispatch(store, 'member.add', { kind: 'beam', start: [5, 0], end: [5, 36] });
    await vi.advanceTimersByTimeAsync(300);
    dispatch(store, 'member.add', { kind: 'beam', start: [15, 0], end: [15, 36] });
    expect(autosave.snapshot.status).toBe('pending');
    expect(storage.data.has('k')).toBe(true);
    await vi.advanceTimersByTimeAsync(599);
    expect(save).not.toHaveBeenCalled();
    await vi.advanceTimersByTimeAsync(1);
    expect(save).toHaveBeenCalledTimes(1);
    expect(save.mock.calls[0][0]).toBe(7);
    expect(save.mock.calls[0][1].members).toHaveLength(13);
    expect(autosave.snapshot).toMatchObject({ status: 'saved', revision: 8 });
    // Saved: the copy kept on this device is dropped.
    expect(storage.data.has('k')).toBe(false);
  });

  it('when the server answers 409, then the banner data counts the differences and nothing local is lost', async () => {
    const base = twoBayPlan();
    const store = createEditorStore({ plan: base });
    // Elsewhere someone deleted beam b7 and added a girder.
    const theirs = addMember({ ...base, members: base.members.filter((m) => m.id !== 'b7') }, 'L2', 'girder', [0, 18], [30, 18]).plan;
    const save = vi.fn(async (): Promise<SavePlanOutcome> => ({ kind: 'conflict', current: { revision: 9, plan: theirs, updatedBy: 'Imogen Ashdown', updatedAt: '2026-12-02T03:00:00Z' } }));
    const storage = memoryStorage();
    const autosave = new PlanAutosave(store, 7, { save, storage, storageKey: 'k' });
    autosave.start();
    dispatch(store, 'member.add', { kind: 'beam', start: [5, 0], end: [5, 36] });
    await vi.advanceTimersByTimeAsync(600);
    expect(autosave.snapshot.status).toBe('conflict');
    const c = autosave.snapshot.conflict!;
    expect(c.theirsVsBase!.kinds).toEqual([{ kind: 'members', added: 1, removed: 1, changed: 0 }]);
    // Mine has b7 and my new beam, not their girder.
    expect(c.mineVsTheirs!.kinds).toEqual([{ kind: 'members', added: 2, removed: 1, changed: 0 }]);
    expect(store.getState().plan.members).toHaveLength(12);
    expect(JSON.parse(storage.data.get('k')!).plan.members).toHaveLength(12);
    // Further edits wait for the choice instead of being sent.
    dispatch(store, 'member.add', { kind: 'beam', start: [25, 0], end: [25, 36] });
    await vi.advanceTimersByTimeAsync(2000);
    expect(save).toHaveBeenCalledTimes(1);
  });

  it('when "keep mine" is chosen, then my plan is saved over their revision', async () => {
    const base = twoBayPlan();
    const store = createEditorStore({ plan: base });
    const theirs = { ...base, members: base.members.slice(1) };
    const save = vi
      .fn<(revision: number, plan: Plan) => Promise<SavePlanOutcome>>()
      .mockResolvedValueOnce({ kind: 'conflict', current: { revision: 9, plan: theirs, updatedBy: null, updatedAt: null } })
      .mockResolvedValueOnce({ kind: 'saved', revision: 10, repairs: [] });
    const autosave = new PlanAutosave(store, 7, { save, storage: null, storageKey: 'k' });
    autosave.start();
    dispatch(store, 'member.add', { kind: 'beam', start: [5, 0], end: [5, 36] });
    await vi.advanceTimersByTimeAsync(600);
    await autosave.keepMine();
    expect(save).toHaveBeenCalledTimes(2);
    expect(save.mock.calls[1][0]).toBe(9);
    expect(save.mock.calls[1][1].members).toHaveLength(12);
    expect(autosave.snapshot).toMatchObject({ status: 'saved', revision: 10, conflict: null });
  });

  it('when "take theirs" is chosen, then their plan is shown and mine is one Undo away', async () => {
    const base = twoBayPlan();
    const store = createEditorStore({ plan: base });
    const theirs = { ...base, members: base.members.slice(1) };
    const save = vi.fn(async (): Promise<SavePlanOutcome> => ({ kind: 'conflict', current: { revision: 9, plan: theirs, updatedBy: null, updatedAt: null } }));
    const autosave = new PlanAutosave(store, 7, { save, storage: null, storageKey: 'k' });
    autosave.start();
    dispatch(store, 'member.add', { kind: 'beam', start: [5, 0], end: [5, 36] });
    await vi.advanceTimersByTimeAsync(600);
    autosave.takeTheirs();
    expect(store.getState().plan).toBe(theirs);
    expect(autosave.snapshot).toMatchObject({ status: 'saved', revision: 9, conflict: null });
    dispatch(store, 'edit.undo');
    expect(store.getState().plan.members).toHaveLength(12);
  });

  it('when the server cannot be reached, then the plan stays pending on this device and is retried', async () => {
    const store = createEditorStore({ plan: twoBayPlan() });
    const save = vi
      .fn<(revision: number, plan: Plan) => Promise<SavePlanOutcome>>()
      .mockRejectedValueOnce(new Error('Could not reach the Baywright server.'))
      .mockResolvedValueOnce({ kind: 'saved', revision: 8, repairs: [] });
    const storage = memoryStorage();
    const autosave = new PlanAutosave(store, 7, { save, storage, storageKey: 'k', retryMs: 1000 });
    autosave.start();
    dispatch(store, 'member.add', { kind: 'beam', start: [5, 0], end: [5, 36] });
    await vi.advanceTimersByTimeAsync(600);
    expect(autosave.snapshot.status).toBe('offline');
    expect(storage.data.has('k')).toBe(true);
    await vi.advanceTimersByTimeAsync(1000);
    expect(autosave.snapshot).toMatchObject({ status: 'saved', revision: 8 });
  });
});
