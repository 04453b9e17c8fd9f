// Designs the scheme off the main thread so drawing stays smooth. Keeps the last result so
// designScheme can reuse unchanged member designs (its `previous` option).
import '../../../lib/zod-jitless';
import { designScheme, type SchemeResult } from '../../../../shared/engine/index';
import type { Plan } from '../../../../shared/schemas/plan.schema';
import type { DesignReply, DesignRequest } from './live-design.types';
import { memberDelta } from './member-delta';

const scope = self as unknown as { onmessage: ((e: MessageEvent<DesignRequest>) => void) | null; postMessage(message: DesignReply): void };
let previous: SchemeResult | undefined;
/** The members of the last reply: the main thread holds them too, so only changed ones are sent. */
let sent: SchemeResult['members'] | undefined;

scope.onmessage = (e) => {
  const { seq, plan } = e.data;
  const t0 = performance.now();
  try {
    const result = designScheme(plan as Plan, { previous });
    previous = result;
    const engineMs = performance.now() - t0;
    const members = memberDelta(sent, result.members);
    sent = result.members;
    scope.postMessage({ seq, result: { ...result, members: [] }, members, engineMs });
  } catch (err) {
    scope.postMessage({ seq, error: err instanceof Error ? err.message : String(err), engineMs: performance.now() - t0 });
  }
};
