// One design-run worker thread: receives plans, answers with the `calc plan` result (plain
// data), so a long design never blocks the server's request thread.
import { parentPort } from 'node:worker_threads';
import { designScheme } from '../../../shared/engine/index';
import type { Plan } from '../../../shared/schemas/plan.schema';

export interface DesignRequest { id: number; plan: Plan }
export type DesignReply =
  | { id: number; started: true }
  | { id: number; ok: true; result: unknown }
  | { id: number; ok: false; message: string };

parentPort!.on('message', (msg: DesignRequest) => {
  // The time budget runs from here: the worker's own start-up is not the plan's doing.
  parentPort!.postMessage({ id: msg.id, started: true } satisfies DesignReply);
  let reply: DesignReply;
  try {
    reply = { id: msg.id, ok: true, result: designScheme(msg.plan) };
  } catch (err) {
    reply = { id: msg.id, ok: false, message: err instanceof Error ? err.message : String(err) };
  }
  parentPort!.postMessage(reply);
});
