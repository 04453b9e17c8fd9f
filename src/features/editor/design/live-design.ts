/**
 * Live design: after each change the scheme is designed in the browser (in a Web Worker when
 * there is one) and the newest result is published. Results are derived from the plan, so
 * they live here rather than in the editor store or the server cache.
 *
 * Timing: `lastEditToSizesMs` is from the plan change to the frame that shows the new sizes.
 */
import { designScheme, type SchemeMember, type SchemeResult } from '../../../../shared/engine/index';
import type { Plan } from '../../../../shared/schemas/plan.schema';
import type { DesignReply } from './live-design.types';
import { applyMemberDelta } from './member-delta';

export interface LiveDesignSnapshot {
  result: SchemeResult | null;
  /** The plan `result` was designed from (the same object the editor held). */
  plan?: Plan | null;
  byId: Map<string, SchemeMember>;
  /** Designing a newer plan than the one shown. */
  pending: boolean;
  error: string | null;
  lastEditToSizesMs: number | null;
  lastEngineMs: number | null;
}

type Listener = () => void;

export class LiveDesign {
  private worker: Worker | null = null;
  private seq = 0;
  private editAt = new Map<number, number>();
  private listeners = new Set<Listener>();
  private previous: SchemeResult | undefined;
  private timer: ReturnType<typeof setTimeout> | null = null;
  private busy = false;
  private queued: { seq: number; plan: Plan } | null = null;
  private inFlight: Plan | null = null;
  snapshot: LiveDesignSnapshot = { result: null, plan: null, byId: new Map(), pending: false, error: null, lastEditToSizesMs: null, lastEngineMs: null };
  /** Called after a new result has been drawn, with the measured time. */
  onMeasured: ((ms: number) => void) | null = null;

  constructor(useWorker = typeof Worker !== 'undefined') {
    if (useWorker) {
      try {
        this.worker = new Worker(new URL('./live-design.worker.ts', import.meta.url), { type: 'module' });
        this.worker.onmessage = (e: MessageEvent<DesignReply>) => this.receive(e.data);
        this.worker.onerror = () => {
          // Fall back to the main thread rather than show no sizes.
          this.worker?.terminate();
          this.worker = null;
          this.busy = false;
          if (this.queued) this.flush();
        };
      } catch {
        this.worker = null;
      }
    }
  }

  subscribe = (listener: Listener) => {
    this.listeners.add(listener);
    return () => void this.listeners.delete(listener);
  };

  getSnapshot = () => this.snapshot;

  /** A plan changed at `editedAt` (performance.now()). Designs the newest plan; older requests are dropped. */
  request(plan: Plan, editedAt = performance.now()) {
    const seq = ++this.seq;
    this.editAt.set(seq, editedAt);
    this.queued = { seq, plan };
    // With a worker, post at once so the design runs while React renders the edit;
    // on the main thread, wait for the event handler to finish first.
    if (this.worker && !this.busy) this.flush();
    else if (this.timer === null) this.timer = setTimeout(() => this.flush(), 0);
    this.publish({ ...this.snapshot, pending: true });
  }

  private flush() {
    this.timer = null;
    if (this.busy || !this.queued) return;
    const { seq, plan } = this.queued;
    this.queued = null;
    this.busy = true;
    this.inFlight = plan;
    if (this.worker) {
      this.worker.postMessage({ seq, plan });
      return;
    }
    const t0 = performance.now();
    try {
      const result = designScheme(plan, { previous: this.previous });
      this.receive({ seq, result, engineMs: performance.now() - t0 });
    } catch (err) {
      this.receive({ seq, error: err instanceof Error ? err.message : String(err), engineMs: performance.now() - t0 });
    }
  }

  private receive(reply: DesignReply) {
    this.busy = false;
    const editedAt = this.editAt.get(reply.seq) ?? performance.now();
    for (const k of [...this.editAt.keys()]) if (k <= reply.seq) this.editAt.delete(k);
    const stale = this.queued !== null;
    let result: SchemeResult | null = null;
    if (!('error' in reply)) {
      try {
        result = reply.members ? { ...reply.result, members: applyMemberDelta(this.previous?.members, reply.members) } : reply.result;
      } catch {
        // Never expected (replies come in order and each is kept): design that plan again here,
        // and every plan after it.
        this.worker?.terminate();
        this.worker = null;
        if (!this.queued && this.inFlight) this.queued = { seq: reply.seq, plan: this.inFlight };
        this.flush();
        return;
      }
    }
    if ('error' in reply || result === null) {
      this.publish({ ...this.snapshot, pending: stale, error: 'error' in reply ? reply.error : null, lastEngineMs: reply.engineMs });
    } else {
      this.previous = result;
      const byId = new Map(result.members.map((m) => [m.id, m]));
      this.publish({ ...this.snapshot, result, plan: this.inFlight, byId, pending: stale, error: null, lastEngineMs: reply.engineMs });
      // Measured when the frame showing the sizes has been drawn.
      const raf = typeof requestAnimationFrame === 'function' ? requestAnimationFrame : (f: () => void) => setTimeout(f, 0);
      raf(() => {
        const ms = performance.now() - editedAt;
        this.snapshot = { ...this.snapshot, lastEditToSizesMs: ms };
        this.onMeasured?.(ms);
      });
    }
    if (this.queued) this.flush();
  }

  private publish(next: LiveDesignSnapshot) {
    this.snapshot = next;
    for (const l of this.listeners) l();
  }

  dispose() {
    if (this.timer !== null) clearTimeout(this.timer);
    this.worker?.terminate();
    this.worker = null;
    this.listeners.clear();
  }
}
