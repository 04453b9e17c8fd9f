/**
 * One bay study at a time in a Web Worker (on the main thread where there is none, e.g. in
 * component tests), with progress and cancel. Cancel terminates the worker; the next run
 * starts a fresh one.
 */
import { runStudy, StudyInputError, type StudyResult } from '../../../../shared/engine/index';
import type { Plan } from '../../../../shared/schemas/plan.schema';
import type { StudySpec } from '../../../../shared/schemas/study.schema';
import type { StudyReplyMessage } from './study-messages';

export interface StudyRunCallbacks {
  onProgress: (done: number, total: number) => void;
  onDone: (result: StudyResult, engineMs: number) => void;
  onError: (message: string, problems: string[]) => void;
}

export class StudyRunner {
  private worker: Worker | null = null;
  private cancelled = false;

  constructor(private readonly useWorker = typeof Worker !== 'undefined') {}

  run(plan: Plan, spec: StudySpec, cb: StudyRunCallbacks): void {
    this.cancel();
    this.cancelled = false;
    if (this.useWorker) {
      try {
        const worker = new Worker(new URL('./study.worker.ts', import.meta.url), { type: 'module' });
        this.worker = worker;
        worker.onmessage = (e: MessageEvent<StudyReplyMessage>) => {
          const m = e.data;
          if (m.type === 'progress') cb.onProgress(m.done, m.total);
          else {
            this.stopWorker();
            if (m.type === 'done') cb.onDone(m.result, m.engineMs);
            else cb.onError(m.message, m.problems);
          }
        };
        worker.onerror = (e) => {
          this.stopWorker();
          cb.onError(`The study stopped: ${e.message || 'the worker failed'}`, []);
        };
        worker.postMessage({ plan, spec });
        return;
      } catch {
        this.worker = null;
      }
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

  get running(): boolean {
    return this.worker !== null;
  }

  cancel(): void {
    this.cancelled = true;
    this.stopWorker();
  }

  private stopWorker(): void {
    this.worker?.terminate();
    this.worker = null;
  }
}
