/**
 * Saves the plan being edited: every change, debounced, PUT with the revision it was based
 * on. On a conflict (someone saved in between) nothing is overwritten and nothing local is
 * dropped: the editor shows what differs and the engineer chooses "keep mine" or "take
 * theirs". Until a save succeeds the local plan is also kept on this device.
 */
import type { Plan } from '../../../../shared/schemas/plan.schema';
import type { SaveConflict, SavePlanOutcome } from '../api/save-plan.api';
import type { EditorStore } from '../store/editor.store';
import { diffPlans, type PlanDiff } from './plan-diff';

export type SaveStatus = 'saved' | 'pending' | 'saving' | 'conflict' | 'invalid' | 'offline' | 'readonly';

export interface AutosaveSnapshot {
  status: SaveStatus;
  revision: number;
  message: string | null;
  conflict: (SaveConflict & { theirsVsBase: PlanDiff | null; mineVsTheirs: PlanDiff | null }) | null;
  problems: string[];
  savedAt: number | null;
}

export interface AutosaveDeps {
  save(revision: number, plan: Plan): Promise<SavePlanOutcome>;
  /** After a successful save (to refresh server caches and ask for the stored design). */
  onSaved?(revision: number, plan: Plan): void;
  storage?: Pick<Storage, 'getItem' | 'setItem' | 'removeItem'> | null;
  storageKey: string;
  debounceMs?: number;
  retryMs?: number;
}

export interface LocalDraft {
  baseRevision: number;
  plan: Plan;
  keptAt: string;
}

export class PlanAutosave {
  private lastSaved: Plan;
  private timer: ReturnType<typeof setTimeout> | null = null;
  private listeners = new Set<() => void>();
  private unsubscribe: (() => void) | null = null;
  private inFlight = false;
  snapshot: AutosaveSnapshot;

  constructor(private store: EditorStore, revision: number, private deps: AutosaveDeps) {
    this.lastSaved = store.getState().plan;
    this.snapshot = { status: store.getState().readOnly ? 'readonly' : 'saved', revision, message: null, conflict: null, problems: [], savedAt: null };
  }

  start() {
    if (this.store.getState().readOnly) return;
    let previous = this.store.getState().plan;
    this.unsubscribe = this.store.subscribe((s) => {
      if (s.plan === previous) return;
      previous = s.plan;
      this.changed();
    });
  }

  stop() {
    this.unsubscribe?.();
    if (this.timer) clearTimeout(this.timer);
    this.listeners.clear();
  }

  subscribe = (l: () => void) => {
    this.listeners.add(l);
    return () => void this.listeners.delete(l);
  };

  getSnapshot = () => this.snapshot;

  /** A draft kept on this device from an earlier session, when it differs from what was loaded. */
  readLocalDraft(): LocalDraft | null {
    try {
      const raw = this.deps.storage?.getItem(this.deps.storageKey);
      if (!raw) return null;
      const draft = JSON.parse(raw) as LocalDraft;
      if (JSON.stringify(draft.plan) === JSON.stringify(this.lastSaved)) return null;
      return draft;
    } catch {
      return null;
    }
  }

  discardLocalDraft() {
    this.deps.storage?.removeItem(this.deps.storageKey);
  }

  private set(patch: Partial<AutosaveSnapshot>) {
    this.snapshot = { ...this.snapshot, ...patch };
    for (const l of this.listeners) l();
  }

  private keepLocal() {
    const draft: LocalDraft = { baseRevision: this.snapshot.revision, plan: this.store.getState().plan, keptAt: new Date().toISOString() };
    try {
      this.deps.storage?.setItem(this.deps.storageKey, JSON.stringify(draft));
    } catch {
      // Storage full or blocked: the plan is still in memory and in the save queue.
    }
  }

  private changed() {
    const plan = this.store.getState().plan;
    if (plan === this.lastSaved) {
      if (this.snapshot.status === 'pending') this.set({ status: 'saved' });
      return;
    }
    this.keepLocal();
    if (this.snapshot.status === 'conflict') return; // wait for the engineer's choice
    this.set({ status: this.inFlight ? 'saving' : 'pending' });
    this.schedule(this.deps.debounceMs ?? 600);
  }

  private schedule(ms: number) {
    if (this.timer) clearTimeout(this.timer);
    this.timer = setTimeout(() => void this.flush(), ms);
  }

  /**
   * The plan changes from `from` to `to` by something derived from it (marks issued by the
   * design), not by an edit: when `from` is what was saved, `to` counts as saved too, so
   * opening a plan writes no revision; the derived part goes with the next real save.
   */
  absorb(from: Plan, to: Plan) {
    if (this.lastSaved === from) this.lastSaved = to;
  }

  /** Save now (also used by "keep mine"). */
  async flush(): Promise<void> {
    this.timer = null;
    if (this.inFlight || this.snapshot.status === 'conflict') return;
    const plan = this.store.getState().plan;
    if (plan === this.lastSaved && this.snapshot.status !== 'offline') {
      this.set({ status: 'saved' });
      return;
    }
    this.inFlight = true;
    this.set({ status: 'saving' });
    let outcome: SavePlanOutcome;
    try {
      outcome = await this.deps.save(this.snapshot.revision, plan);
    } catch (e) {
      this.inFlight = false;
      this.set({ status: 'offline', message: e instanceof Error ? e.message : 'Could not save.' });
      this.schedule(this.deps.retryMs ?? 5000);
      return;
    }
    this.inFlight = false;
    if (outcome.kind === 'saved') {
      this.lastSaved = plan;
      this.set({ status: 'saved', revision: outcome.revision, message: outcome.repairs.length ? `Saved; the server fixed: ${outcome.repairs.join('; ')}` : null, problems: [], savedAt: Date.now() });
      this.deps.onSaved?.(outcome.revision, plan);
      if (this.store.getState().plan !== plan) this.changed();
      else this.discardLocalDraft();
      return;
    }
    if (outcome.kind === 'conflict') {
      const theirs = outcome.current.plan;
      this.set({
        status: 'conflict',
        conflict: {
          ...outcome.current,
          theirsVsBase: theirs ? diffPlans(this.lastSaved, theirs) : null,
          mineVsTheirs: theirs ? diffPlans(theirs, this.store.getState().plan) : null,
        },
      });
      return;
    }
    this.set({ status: 'invalid', problems: outcome.problems, message: 'The server refused this plan; your drawing is kept here.' });
  }

  /** Save over the other change: my plan, based on their revision. */
  async keepMine() {
    const c = this.snapshot.conflict;
    if (!c) return;
    this.set({ status: 'pending', revision: c.revision, conflict: null });
    this.lastSaved = c.plan ?? this.lastSaved;
    await this.flush();
  }

  /** Take the saved plan; mine stays one Undo away (and on this device until then). */
  takeTheirs() {
    const c = this.snapshot.conflict;
    if (!c || !c.plan) return;
    this.lastSaved = c.plan;
    this.set({ status: 'saved', revision: c.revision, conflict: null });
    this.store.setState({ plan: c.plan, selection: [], draft: { kind: 'none' } });
  }
}
