// One design-run worker thread: receives plans, answers with the `calc plan` result (plain
// data), so a long design never blocks the server's request thread. A plain design also comes
// back in the forms the server keeps (design-run-storage.ts), made here rather than on the
// request thread: the packed form it stores and the result's JSON text as UTF-8 bytes (moved,
// not copied), which becomes the body of the design's responses.
import { parentPort } from 'node:worker_threads';
import { designScheme, runStudy } from '../../../shared/engine/index';
import type { Plan } from '../../../shared/schemas/plan.schema';
import type { StudySpec } from '../../../shared/schemas/study.schema';
import { packDesignResult, type PackedResult } from '../design-run-storage';

/** A plan to design, or with `study` a bay study of it (issue 15), under the same budget. */
export interface DesignRequest { id: number; plan: Plan; study?: StudySpec }

/** A designed plan as the server keeps it: packed for storage, and JSON.stringify(result) as UTF-8. */
export interface StoredDesign {
  packed: PackedResult;
  json: Uint8Array;
}

export type DesignReply =
  | { id: number; started: true }
  | { id: number; ok: true; result: unknown }
  | { id: number; ok: true; stored: StoredDesign }
  | { id: number; ok: false; message: string };

parentPort!.on('message', (msg: DesignRequest) => {
  // The time budget runs from here: the worker's own start-up is not the plan's doing.
  parentPort!.postMessage({ id: msg.id, started: true } satisfies DesignReply);
  let reply: DesignReply;
  const transfer: ArrayBuffer[] = [];
  try {
    if (msg.study) {
      reply = { id: msg.id, ok: true, result: runStudy(msg.plan, msg.study) };
    } else {
      const result = designScheme(msg.plan);
      const text = JSON.stringify(result);
      const json = Buffer.from(text, 'utf8');
      // A Buffer of its own (not a slice of the shared pool), so its memory can be moved.
      const bytes = new Uint8Array(json.buffer, json.byteOffset, json.byteLength);
      const own = bytes.byteOffset === 0 && bytes.byteLength === bytes.buffer.byteLength ? bytes : bytes.slice();
      transfer.push(own.buffer as ArrayBuffer);
      reply = { id: msg.id, ok: true, stored: { packed: packDesignResult(result, text), json: own } };
    }
  } catch (err) {
    reply = { id: msg.id, ok: false, message: err instanceof Error ? err.message : String(err) };
  }
  parentPort!.postMessage(reply, transfer);
});
