// Runs bay studies off the main thread, posting progress after each option. A 'warm' message
// designs the plan ahead of a run (the study's base design), so the run starts with the engine
// loaded and the base ready. Cancelling terminates the worker (a study is one synchronous loop).
import { designScheme, runStudy, StudyInputError, type SchemeResult } from '../../../../shared/engine/index';
import type { StudyReplyMessage, StudyRequestMessage } from './study-messages';

const scope = self as unknown as { onmessage: ((e: MessageEvent<StudyRequestMessage>) => void) | null; postMessage(message: StudyReplyMessage): void };
let warm: { key: string; base: SchemeResult } | null = null;

scope.onmessage = (e) => {
  const msg = e.data;
  const key = JSON.stringify(msg.plan);
  if (msg.type === 'warm') {
    if (warm?.key !== key) {
      try {
        warm = { key, base: designScheme(msg.plan) };
      } catch {
        warm = null; // the run will say what is wrong
      }
    }
    return;
  }
  const t0 = performance.now();
  try {
    const base = warm?.key === key ? warm.base : undefined;
    const result = runStudy(msg.plan, msg.spec, { base, onProgress: (done, total) => scope.postMessage({ type: 'progress', done, total }) });
    scope.postMessage({ type: 'done', result, engineMs: performance.now() - t0 });
  } catch (err) {
    if (err instanceof StudyInputError) scope.postMessage({ type: 'error', message: err.message, problems: err.problems });
    else scope.postMessage({ type: 'error', message: err instanceof Error ? err.message : String(err), problems: [] });
  }
};
