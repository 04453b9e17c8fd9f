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

  it('when the server answers 409 because both changed one beam, then only that beam is asked about, named by grid location, and nothing local is lost', async () => {
    const base = twoBayPlan();
    const store = createEditorStore({ plan: base });
    // Elsewhere someone sized beam b2 and deleted beam b7.
    const theirs = { ...base, members: base.members.filter((m) => m.id !== 'b7').map((m) => (m.id === 'b2' ? { ...m, shape: 'W21X44' } : m)) };
    const save = vi.fn(async (): Promise<SavePlanOutcome> => ({ kind: 'conflict', current: { revision: 9, plan: theirs, updatedBy: 'Imogen Ashdown', updatedAt: '2026-12-02T03:00:00Z' } }));
    const storage = memoryStorage();
    const autosave = new PlanAutosave(store, 7, { save, storage, storageKey: 'k' });
    autosave.start();
    // Here: b2 sized differently, and a new beam.
    store.setState({ plan: { ...base, members: base.members.map((m) => (m.id === 'b2' ? { ...m, shape: 'W24X55' } : m)) } });
    dispatch(store, 'member.add', { kind: 'beam', start: [5, 0], end: [5, 36] });
    await vi.advanceTimersByTimeAsync(600);
    expect(autosave.snapshot.status).toBe('conflict');
    const c = autosave.snapshot.conflict!;
    expect(c.items.map(({ key, label, mine, theirs: t }) => ({ key, label, mine, theirs: t }))).toEqual([
      { key: 'members:b2', label: `beam at A–B / 1+10'-0"`, mine: 'size W24X55', theirs: 'size W21X44' },
    ]);
    expect(c.theirsVsBase!.kinds).toEqual([{ kind: 'members', added: 0, removed: 1, changed: 1 }]);
    expect(store.getState().plan.members).toHaveLength(12);
    expect(JSON.parse(storage.data.get('k')!).plan.members).toHaveLength(12);
    // Further edits wait for the choice instead of being sent.
    dispatch(store, 'member.add', { kind: 'beam', start: [25, 0], end: [25, 36] });
    await vi.advanceTimersByTimeAsync(2000);
    expect(save).toHaveBeenCalledTimes(1);
  });

  it('when "keep mine" is chosen for the one beam both changed, then their other change and all of mine are saved on their revision', async () => {
    const base = twoBayPlan();
    const store = createEditorStore({ plan: base });
    const theirs = { ...base, members: base.members.filter((m) => m.id !== 'b7').map((m) => (m.id === 'b2' ? { ...m, shape: 'W21X44' } : m)) };
    const save = vi
      .fn<(revision: number, plan: Plan) => Promise<SavePlanOutcome>>()
      .mockResolvedValueOnce({ kind: 'conflict', current: { revision: 9, plan: theirs, updatedBy: null, updatedAt: null } })
      .mockResolvedValueOnce({ kind: 'saved', revision: 10, repairs: [] });
    const autosave = new PlanAutosave(store, 7, { save, storage: null, storageKey: 'k' });
    autosave.start();
    store.setState({ plan: { ...base, members: base.members.map((m) => (m.id === 'b2' ? { ...m, shape: 'W24X55' } : m)) } });
    dispatch(store, 'member.add', { kind: 'beam', start: [5, 0], end: [5, 36] });
    await vi.advanceTimersByTimeAsync(600);
    await autosave.resolve(new Map([['members:b2', 'mine']]));
    expect(save).toHaveBeenCalledTimes(2);
    expect(save.mock.calls[1][0]).toBe(9);
    const sent = save.mock.calls[1][1];
    expect(sent.members.find((m) => m.id === 'b2')!.shape).toBe('W24X55');
    expect(sent.members.some((m) => m.id === 'b7')).toBe(false); // their delete kept
    expect(sent.members).toHaveLength(11); // 11 − b7 + my new beam
    expect(store.getState().plan).toBe(sent);
    expect(autosave.snapshot).toMatchObject({ status: 'saved', revision: 10, conflict: null });
  });

  it('when "take theirs for all" is chosen, then their version of the beam is saved with my other changes', async () => {
    const base = twoBayPlan();
    const store = createEditorStore({ plan: base });
    const theirs = { ...base, members: base.members.map((m) => (m.id === 'b2' ? { ...m, shape: 'W21X44' } : m)) };
    const save = vi
      .fn<(revision: number, plan: Plan) => Promise<SavePlanOutcome>>()
      .mockResolvedValueOnce({ kind: 'conflict', current: { revision: 9, plan: theirs, updatedBy: null, updatedAt: null } })
      .mockResolvedValueOnce({ kind: 'saved', revision: 10, repairs: [] });
    const autosave = new PlanAutosave(store, 7, { save, storage: null, storageKey: 'k' });
    autosave.start();
    store.setState({ plan: { ...base, members: base.members.map((m) => (m.id === 'b2' ? { ...m, shape: 'W24X55' } : m.id === 'b3' ? { ...m, shape: 'W18X35' } : m)) } });
    await vi.advanceTimersByTimeAsync(600);
    await autosave.takeTheirsForAll();
    const sent = save.mock.calls[1][1];
    expect(sent.members.find((m) => m.id === 'b2')!.shape).toBe('W21X44');
    expect(sent.members.find((m) => m.id === 'b3')!.shape).toBe('W18X35');
    expect(autosave.snapshot).toMatchObject({ status: 'saved', revision: 10 });
  });

  it('when the server merged the save with theirs, then the editor shows the merged plan, says what came in, and sends nothing more', async () => {
    const base = twoBayPlan();
    const store = createEditorStore({ plan: base });
    let sentPlan: Plan | null = null;
    const save = vi.fn(async (_revision: number, plan: Plan): Promise<SavePlanOutcome> => {
      sentPlan = plan;
      const merged = { ...plan, members: plan.members.map((m) => (m.id === 'b2' ? { ...m, shape: 'W21X44' } : m)) };
      return { kind: 'saved', revision: 10, repairs: [], merged: { basedOn: 7, mergedWith: 9, by: ['Imogen Ashdown'], changes: ['beam 2B1 at A–B / 1+10\'-0": size W21X44'], plan: merged } };
    });
    const autosave = new PlanAutosave(store, 7, { save, storage: null, storageKey: 'k' });
    autosave.start();
    dispatch(store, 'member.add', { kind: 'beam', start: [5, 0], end: [5, 36] });
    await vi.advanceTimersByTimeAsync(600);
    expect(sentPlan!.members).toHaveLength(12);
    const shown = store.getState().plan;
    expect(shown.members).toHaveLength(12);
    expect(shown.members.find((m) => m.id === 'b2')!.shape).toBe('W21X44');
    expect(autosave.snapshot).toMatchObject({ status: 'saved', revision: 10, conflict: null, merged: { by: ['Imogen Ashdown'], revision: 9 } });
    await vi.advanceTimersByTimeAsync(5000);
    expect(save).toHaveBeenCalledTimes(1);
    autosave.dismissMerged();
    expect(autosave.snapshot.merged).toBeNull();
  });

  it('when I kept drawing while a merged save was on its way, then my new edit is merged over theirs and saved on the merged revision', async () => {
    const base = twoBayPlan();
    const store = createEditorStore({ plan: base });
    let release: (o: SavePlanOutcome) => void = () => {};
    const save = vi
      .fn<(revision: number, plan: Plan) => Promise<SavePlanOutcome>>()
      .mockImplementationOnce(() => new Promise((resolve) => (release = resolve)))
      .mockResolvedValueOnce({ kind: 'saved', revision: 11, repairs: [] });
    const autosave = new PlanAutosave(store, 7, { save, storage: null, storageKey: 'k' });
    autosave.start();
    dispatch(store, 'member.add', { kind: 'beam', start: [5, 0], end: [5, 36] });
    await vi.advanceTimersByTimeAsync(600);
    const sent = save.mock.calls[0][1];
    // While the save is out, b3 is sized here; theirs sized b2.
    store.setState({ plan: { ...store.getState().plan, members: store.getState().plan.members.map((m) => (m.id === 'b3' ? { ...m, shape: 'W18X35' } : m)) } });
    release({ kind: 'saved', revision: 10, repairs: [], merged: { basedOn: 7, mergedWith: 9, by: ['Imogen Ashdown'], changes: [], plan: { ...sent, members: sent.members.map((m) => (m.id === 'b2' ? { ...m, shape: 'W21X44' } : m)) } } });
    await vi.advanceTimersByTimeAsync(600);
    expect(save).toHaveBeenCalledTimes(2);
    expect(save.mock.calls[1][0]).toBe(10);
    const second = save.mock.calls[1][1];
    expect(second.members.find((m) => m.id === 'b2')!.shape).toBe('W21X44');
    expect(second.members.find((m) => m.id === 'b3')!.shape).toBe('W18X35');
    expect(autosave.snapshot).toMatchObject({ status: 'saved', revision: 11 });
  });

  it('when the two cannot be merged and "keep mine" is chosen, then my whole plan is saved over their revision', async () => {
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

  it('when the two cannot be merged and "take theirs" is chosen, then their plan is shown and mine is one Undo away', async () => {
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
