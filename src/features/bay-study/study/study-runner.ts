/**
 * Bay studies in a Web Worker (on the main thread where there is none, e.g. in component
 * tests), with progress and cancel. The worker is kept between runs and warmed with the plan
 * when the panel opens; cancel terminates it and the next run starts a fresh one.
 */
import { runStudy, StudyInputError, type StudyResult } from '../../../../shared/engine/index';
import type { Plan } from '../../../../shared/schemas/plan.schema';
import type { StudySpec } from '../../../../shared/schemas/study.schema';
import type { StudyReplyMessage, StudyRequestMessage } from './study-messages';

export interface StudyRunCallbacks {
  onProgress: (done: number, total: number) => void;
  onDone: (result: StudyResult, engineMs: number) => void;
  onError: (message: string, problems: string[]) => void;
}

export class StudyRunner {
  private worker: Worker | null = null;
  private callbacks: StudyRunCallbacks | null = null;
  private cancelled = false;

  constructor(private readonly useWorker = typeof Worker !== 'undefined') {}

  private ensureWorker(): Worker | null {
    if (!this.useWorker) return null;
    if (this.worker) return this.worker;
    try {
      const worker = new Worker(new URL('./study.worker.ts', import.meta.url), { type: 'module' });
      worker.onmessage = (e: MessageEvent<StudyReplyMessage>) => {
        const m = e.data;
        const cb = this.callbacks;
        if (!cb) return;
        if (m.type === 'progress') cb.onProgress(m.done, m.total);
        else {
          this.callbacks = null;
          if (m.type === 'done') cb.onDone(m.result, m.engineMs);
          else cb.onError(m.message, m.problems);
        }
      };
      worker.onerror = (e) => {
        const cb = this.callbacks;
        this.stopWorker();
        cb?.onError(`The study stopped: ${e.message || 'the worker failed'}`, []);
      };
      this.worker = worker;
      return worker;
    } catch {
      return null;
    }
  }

  /** Loads the engine and designs the plan ahead of a run. */
  warm(plan: Plan): void {
    this.ensureWorker()?.postMessage({ type: 'warm', plan } satisfies StudyRequestMessage);
  }

  run(plan: Plan, spec: StudySpec, cb: StudyRunCallbacks): void {
    if (this.callbacks) this.cancel();
    this.cancelled = false;
    const worker = this.ensureWorker();
    if (worker) {
      this.callbacks = cb;
      worker.postMessage({ type: 'run', plan, spec } satisfies StudyRequestMessage);
      return;
    }
    // No worker: run after this event, so the button press paints first.
    setTimeout(() => {
      if (this.cancelled) return;
      const t0 = performance.now();
      try {
        const result = runStudy(plan, spec, { onProgress: cb.onProgress });
        cb.onDone(result, performance.now() - t0);
      } catch (err) {
        if (err instanceof StudyInputError) cb.onError(err.message, err.problems);
        else cb.onError(err instanceof Error ? err.message : String(err), []);
      }
    }, 0);
  }

  /** Stops a run in progress (the worker is terminated; nothing of the run is kept). */
  cancel(): void {
    this.cancelled = true;
    this.callbacks = null;
    this.stopWorker();
  }

  /** Releases the worker when the panel closes. */
  dispose(): void {
    this.cancel();
  }

  private stopWorker(): void {
    this.worker?.terminate();
    this.worker = null;
  }
}
