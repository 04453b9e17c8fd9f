/**
 * Saves the plan being edited: every change, debounced, PUT with the revision it was based
 * on. When someone saved in between, the server merges the two on element ids and saves the
 * merge: the editor takes in their changes (and says which). Only elements both changed come
 * back as a conflict: nothing is overwritten and nothing local is dropped, and the engineer
 * chooses per element (or for all) whether to keep mine or take theirs; everything else of
 * both is kept. Until a save succeeds the local plan is also kept on this device.
 */
import type { Plan } from '../../../../shared/schemas/plan.schema';
import { conflictKey, mergePlans, type MergeChoice, type MergeConflict } from '../../../../shared/schemas/plan-merge';
import { elementName, sideWords } from '../../../../shared/drafting/plan-changes.drafting';
import type { SaveConflict, SavePlanOutcome } from '../api/save-plan.api';
import type { EditorStore } from '../store/editor.store';
import { diffPlans, type PlanDiff } from './plan-diff';

/** One element both sides changed, as the engineer is asked about it. */
export interface ConflictItem extends MergeConflict {
  key: string;
  /** "beam 2B1 at B–C / 2" */
  label: string;
  /** What I did to it, and what they did ("size W21X44", "removed"). */
  mine: string;
  theirs: string;
}

export interface SaveConflictState extends SaveConflict {
  /** The plan both started from (what this editor last saved or loaded). */
  base: Plan;
  /** Elements both changed differently: asked about. Empty when the merge itself cannot be saved (`mergeProblem`). */
  items: ConflictItem[];
  theirsVsBase: PlanDiff | null;
  mineVsTheirs: PlanDiff | null;
}

/** What a merged save took in from the others' saves, for the notice above the plan. */
export interface MergedNotice {
  by: string[];
  revision: number;
  changes: string[];
}

function elementIds(plan: Plan): Set<string> {
  const ids = new Set<string>();
  for (const list of [plan.levels, plan.grids ?? [], plan.columns, plan.members, plan.decks, plan.zones, plan.pointLoads, plan.lineLoads, plan.openings]) for (const e of list) ids.add(e.id);
  return ids;
}

export type SaveStatus = 'saved' | 'pending' | 'saving' | 'conflict' | 'invalid' | 'offline' | 'readonly';

export interface AutosaveSnapshot {
  status: SaveStatus;
  revision: number;
  message: string | null;
  conflict: SaveConflictState | null;
  /** Set after a save was merged with someone else's; cleared by dismissMerged. */
  merged: MergedNotice | null;
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
    this.snapshot = { status: store.getState().readOnly ? 'readonly' : 'saved', revision, message: null, conflict: null, merged: null, problems: [], savedAt: null };
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
      if (outcome.merged?.plan) {
        this.tookMerge(plan, outcome.revision, outcome.merged.plan, { by: outcome.merged.by, revision: outcome.merged.mergedWith, changes: outcome.merged.changes });
        this.set({ message: outcome.repairs.length ? `Saved; the server fixed: ${outcome.repairs.join('; ')}` : null, problems: [], savedAt: Date.now() });
        this.deps.onSaved?.(outcome.revision, outcome.merged.plan);
        return;
      }
      this.lastSaved = plan;
      this.set({ status: 'saved', revision: outcome.revision, message: outcome.repairs.length ? `Saved; the server fixed: ${outcome.repairs.join('; ')}` : null, problems: [], savedAt: Date.now() });
      this.deps.onSaved?.(outcome.revision, plan);
      if (this.store.getState().plan !== plan) this.changed();
      else this.discardLocalDraft();
      return;
    }
    if (outcome.kind === 'conflict') {
      const theirs = outcome.current.plan;
      if (!theirs) {
        this.set({ status: 'conflict', conflict: { ...outcome.current, base: this.lastSaved, items: [], theirsVsBase: null, mineVsTheirs: null } });
        return;
      }
      this.enterConflict(this.lastSaved, theirs, outcome.current);
      return;
    }
    this.set({ status: 'invalid', problems: outcome.problems, message: 'The server refused this plan; your drawing is kept here.' });
  }

  /**
   * The server saved `sent` merged with theirs as `merged` (revision `revision`). The editor
   * shows the merge; edits made while the save was on its way are merged over it here the same
   * way (base: what was sent), and asked about when they touch an element theirs changed.
   */
  private tookMerge(sent: Plan, revision: number, merged: Plan, notice: MergedNotice) {
    const local = this.store.getState().plan;
    this.lastSaved = merged;
    if (local === sent) {
      this.set({ status: 'saved', revision, merged: notice });
      this.apply(merged);
      this.discardLocalDraft();
      return;
    }
    const m = mergePlans(sent, local, merged);
    if (m.conflicts.length > 0) {
      this.set({ revision, merged: notice });
      this.enterConflict(sent, merged, { revision, plan: merged, updatedBy: notice.by.join(', ') || null, updatedAt: null });
      return;
    }
    this.set({ status: 'pending', revision, merged: notice });
    this.apply(m.plan);
    this.schedule(this.deps.debounceMs ?? 600);
  }

  /** Shows `plan` in the editor (one Undo step), keeping the selection of elements still there. */
  private apply(plan: Plan) {
    const ids = elementIds(plan);
    const { selection } = this.store.getState();
    this.store.setState({ plan, selection: selection.filter((id) => ids.has(id)) });
  }

  private enterConflict(base: Plan, theirs: Plan, current: SaveConflict) {
    const mine = this.store.getState().plan;
    const { conflicts } = mergePlans(base, mine, theirs);
    const items: ConflictItem[] = conflicts.map((c) => ({
      ...c,
      key: conflictKey(c),
      label: elementName(c.kind, c.id, [theirs, mine, base]),
      mine: sideWords(c, base, mine),
      theirs: sideWords(c, base, theirs),
    }));
    this.set({
      status: 'conflict',
      conflict: { ...current, plan: theirs, base, items, theirsVsBase: diffPlans(base, theirs), mineVsTheirs: diffPlans(theirs, mine) },
    });
  }

  /**
   * The engineer's answers to a conflict: each element both changed takes mine or theirs (as
   * `choices` says; theirs when unanswered), everything else of both is kept, and the result
   * is saved on their revision.
   */
  async resolve(choices: ReadonlyMap<string, MergeChoice>) {
    const c = this.snapshot.conflict;
    if (!c || !c.plan) return;
    const mine = this.store.getState().plan;
    const merged = mergePlans(c.base, mine, c.plan, (x) => choices.get(conflictKey(x))).plan;
    this.lastSaved = c.plan;
    this.set({ status: 'pending', revision: c.revision, conflict: null });
    this.apply(JSON.stringify(merged) === JSON.stringify(c.plan) ? c.plan : merged);
    await this.flush();
  }

  /** Mine for every element both changed; everything else of both is kept. */
  keepMineForAll() {
    const items = this.snapshot.conflict?.items ?? [];
    return this.resolve(new Map(items.map((i) => [i.key, 'mine' as const])));
  }

  /** Theirs for every element both changed; my other changes are kept. */
  takeTheirsForAll() {
    return this.resolve(new Map());
  }

  dismissMerged() {
    this.set({ merged: null });
  }

  /** Save over the other change: my whole plan, based on their revision (when the two cannot be merged). */
  async keepMine() {
    const c = this.snapshot.conflict;
    if (!c) return;
    this.set({ status: 'pending', revision: c.revision, conflict: null });
    this.lastSaved = c.plan ?? this.lastSaved;
    await this.flush();
  }

  /** Take their whole plan (when the two cannot be merged); mine stays one Undo away (and on this device until then). */
  takeTheirs() {
    const c = this.snapshot.conflict;
    if (!c || !c.plan) return;
    this.lastSaved = c.plan;
    this.set({ status: 'saved', revision: c.revision, conflict: null });
    this.store.setState({ plan: c.plan, selection: [], draft: { kind: 'none' } });
  }
}
