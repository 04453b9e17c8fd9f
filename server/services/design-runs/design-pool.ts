/**
 * Design runs off the request thread: a small pool of worker threads, each with a time and a
 * memory budget, and a bounded queue. One heavy plan occupies one worker; every other request
 * is still served, and a run over budget is stopped (the worker is replaced) and answered 422.
 */
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import type { StudyResult } from '../../../shared/engine/index';
import type { Plan } from '../../../shared/schemas/plan.schema';
import type { StudySpec } from '../../../shared/schemas/study.schema';
import { AppError } from '../../errors/app-error';
import type { DesignReply, DesignRequest, StoredDesign } from './design.worker';
import { KEPT_RESULTS } from './kept-results';

export interface DesignBudget {
  /** Longest a design run may take, ms. */
  timeoutMs: number;
  /** Heap of a worker, MB; a run that needs more is stopped. */
  memoryMb: number;
  /** Worker threads (designs in parallel). */
  workers: number;
  /** Runs waiting for a worker beyond which new ones are refused (503, try again). */
  maxQueue: number;
}

export const DEFAULT_DESIGN_BUDGET: DesignBudget = {
  timeoutMs: 60_000,
  memoryMb: 1024,
  workers: Math.max(1, Math.min(2, availableParallelism() - 1)),
  // Above the number of people a busy firm has designing at once (one run each), so a burst of
  // design requests waits its turn rather than being refused; each waiting run holds only its plan.
  maxQueue: 64,
};

interface Task {
  id: number;
  plan: Plan;
  /** The scheme designed (plain designs only): its worker may still hold its last result. */
  key?: string;
  study?: StudySpec;
  resolve: (r: never) => void;
  reject: (e: unknown) => void;
}

interface Slot {
  worker: Worker;
  task: Task | null;
  timer: NodeJS.Timeout | null;
  /** Schemes this worker designed last, newest first (as many as it keeps results of). */
  recent: string[];
}

/** Set by the server bundle (server/launch.mjs) to the worker's bundle beside it. */
declare const __BAYWRIGHT_DESIGN_WORKER__: string | undefined;
const BOOTSTRAP = new URL(typeof __BAYWRIGHT_DESIGN_WORKER__ === 'string' ? __BAYWRIGHT_DESIGN_WORKER__ : './design-worker.bootstrap.mjs', import.meta.url);
/** Longest a worker may take to start and pick up a run, ms. */
const WORKER_START_MS = 60_000;

const overBudget = (message: string) => new AppError(422, 'design_budget_exceeded', message);

export class DesignPool {
  private readonly slots: Slot[] = [];
  private readonly queue: Task[] = [];
  private nextId = 1;

  constructor(readonly budget: DesignBudget) {}

  /**
   * Designs a plan in a worker; resolves with the result as the server keeps it (packed, and
   * its JSON bytes), both made in the worker. Rejects with an AppError (422 over budget or
   * engine failure, 503 queue full).
   */
  run(plan: Plan, key?: string): Promise<StoredDesign> {
    return this.submit<StoredDesign>(plan, undefined, key);
  }

  /** A bay study of the plan in a worker, under the same budget (each option is a whole design). */
  runStudy(plan: Plan, study: StudySpec): Promise<StudyResult> {
    return this.submit<StudyResult>(plan, study);
  }

  private submit<T>(plan: Plan, study?: StudySpec, key?: string): Promise<T> {
    if (this.queue.length >= this.budget.maxQueue) {
      return Promise.reject(new AppError(503, 'design_busy', 'The server is designing many plans right now; try again in a moment.', { headers: { 'Retry-After': '5' } }));
    }
    return new Promise<T>((resolve, reject) => {
      this.queue.push({ id: this.nextId++, plan, ...(study ? { study } : {}), ...(key !== undefined ? { key } : {}), resolve: resolve as (r: never) => void, reject });
      this.dispatch();
    });
  }

  /** Runs being designed now and waiting. */
  get load(): { running: number; waiting: number } {
    return { running: this.slots.filter((s) => s.task).length, waiting: this.queue.length };
  }

  /** Stops every worker (tests, shutdown); queued runs are refused. */
  async close(): Promise<void> {
    for (const t of this.queue.splice(0)) t.reject(new AppError(503, 'design_busy', 'The server is shutting down.'));
    await Promise.all(this.slots.splice(0).map((s) => { this.finish(s); return s.worker.terminate(); }));
  }

  private dispatch(): void {
    while (this.queue.length > 0) {
      const next = this.queue[0];
      // An idle worker that designed this scheme lately re-designs only what changed; else any idle one.
      const idle = this.slots.filter((s) => s.task === null);
      let slot = (next.key !== undefined ? idle.find((s) => s.recent.includes(next.key!)) : undefined) ?? idle[0];
      if (!slot && this.slots.length < this.budget.workers) slot = this.spawn();
      if (!slot) return;
      const task = this.queue.shift()!;
      if (task.key !== undefined) slot.recent = [task.key, ...slot.recent.filter((k) => k !== task.key)].slice(0, KEPT_RESULTS);
      slot.task = task;
      slot.worker.ref();
      // Until the worker says it has started (a new worker loads the engine first): a start-up budget.
      this.arm(slot, WORKER_START_MS, () => new AppError(503, 'design_busy', 'The design worker did not start; try again in a moment.'));
      slot.worker.postMessage({ id: task.id, plan: task.plan, ...(task.study ? { study: task.study } : {}), ...(task.key !== undefined ? { key: task.key } : {}) } satisfies DesignRequest);
    }
  }

  private arm(slot: Slot, ms: number, error: () => AppError): void {
    if (slot.timer) clearTimeout(slot.timer);
    slot.timer = setTimeout(() => this.fail(slot, error()), ms);
  }

  private spawn(): Slot {
    const worker = new Worker(BOOTSTRAP, {
      resourceLimits: { maxOldGenerationSizeMb: this.budget.memoryMb },
      stdout: false,
      stderr: false,
    });
    const slot: Slot = { worker, task: null, timer: null, recent: [] };
    worker.unref();
    worker.on('message', (reply: DesignReply) => {
      const task = slot.task;
      if (!task || reply.id !== task.id) return;
      if ('started' in reply) {
        this.arm(slot, this.budget.timeoutMs, () =>
          overBudget(`The design took longer than ${this.budget.timeoutMs / 1000} s and was stopped. Design a smaller part of the scheme, or split it into schemes.`),
        );
        return;
      }
      this.finish(slot);
      if (reply.ok) task.resolve(('stored' in reply ? reply.stored : reply.result) as never);
      else task.reject(new AppError(422, 'design_failed', `The plan could not be designed: ${reply.message}`));
      this.dispatch();
    });
    worker.on('error', (err: Error & { code?: string }) => {
      this.fail(
        slot,
        err.code === 'ERR_WORKER_OUT_OF_MEMORY'
          ? overBudget(`The design needed more than its ${this.budget.memoryMb} MB memory budget and was stopped. Design a smaller part of the scheme, or split it into schemes.`)
          : new AppError(422, 'design_failed', `The plan could not be designed: ${err.message}`),
      );
    });
    worker.on('exit', () => {
      if (this.slots.includes(slot)) this.fail(slot, new AppError(422, 'design_failed', 'The plan could not be designed: the design stopped unexpectedly.'));
    });
    this.slots.push(slot);
    return slot;
  }

  private finish(slot: Slot): void {
    if (slot.timer) clearTimeout(slot.timer);
    slot.timer = null;
    slot.task = null;
    slot.worker.unref();
  }

  /** The slot's run fails with err; its worker is stopped and dropped (a new one is made on demand). */
  private fail(slot: Slot, err: unknown): void {
    const task = slot.task;
    const i = this.slots.indexOf(slot);
    if (i >= 0) this.slots.splice(i, 1);
    this.finish(slot);
    void slot.worker.terminate();
    task?.reject(err);
    this.dispatch();
  }
}

let pool: DesignPool | null = null;
let budget: DesignBudget = DEFAULT_DESIGN_BUDGET;

/** Sets the budget of design runs (createApp calls it from the config); replaces an idle pool. */
export function configureDesignRuns(next: Partial<DesignBudget> = {}): void {
  const wanted = { ...DEFAULT_DESIGN_BUDGET, ...next };
  if (JSON.stringify(wanted) === JSON.stringify(budget)) return;
  budget = wanted;
  const old = pool;
  pool = null;
  // Runs in flight on the old pool finish there (its idle workers never keep the process alive).
  if (old && old.load.running === 0 && old.load.waiting === 0) void old.close();
}

/** The process's design pool, made on first use. */
export function designPool(): DesignPool {
  return (pool ??= new DesignPool(budget));
}
