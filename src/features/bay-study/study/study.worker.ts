// Runs a bay study off the main thread, posting progress after each option. Cancelling
// terminates the worker (the study is one synchronous loop).
import { runStudy, StudyInputError } from '../../../../shared/engine/index';
import type { StudyReplyMessage, StudyRequestMessage } from './study-messages';

const scope = self as unknown as { onmessage: ((e: MessageEvent<StudyRequestMessage>) => void) | null; postMessage(message: StudyReplyMessage): void };

scope.onmessage = (e) => {
  const t0 = performance.now();
  try {
    const result = runStudy(e.data.plan, e.data.spec, { onProgress: (done, total) => scope.postMessage({ type: 'progress', done, total }) });
    scope.postMessage({ type: 'done', result, engineMs: performance.now() - t0 });
  } catch (err) {
    if (err instanceof StudyInputError) scope.postMessage({ type: 'error', message: err.message, problems: err.problems });
    else scope.postMessage({ type: 'error', message: err instanceof Error ? err.message : String(err), problems: [] });
  }
};
