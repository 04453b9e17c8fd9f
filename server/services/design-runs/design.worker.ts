// One design-run worker thread: receives plans, answers with the `calc plan` result (plain
// data), so a long design never blocks the server's request thread. A plain design also comes
// back in the forms the server keeps (design-run-storage.ts), made here rather than on the
// request thread: the packed form it stores and the result's JSON text as UTF-8 bytes (moved,
// not copied), which becomes the body of the design's responses.
import { parentPort } from 'node:worker_threads';
import { designScheme, runStudy, type SchemeResult } from '../../../shared/engine/index';
import type { Plan } from '../../../shared/schemas/plan.schema';
import type { StudySpec } from '../../../shared/schemas/study.schema';
import { packDesignResult, type PackedResult } from '../design-run-storage';
import { KEPT_RESULT_MAX_MEMBERS, KEPT_RESULTS } from './kept-results';

/**
 * A plan to design, or with `study` a bay study of it (issue 15), under the same budget. `key`
 * (the scheme) lets the worker pass its last result of that scheme to the engine, which then
 * sizes again only members whose design input changed (the engine compares the inputs
 * themselves, so the result is the same as a fresh design; tests/api/design-runs-incremental).
 */
export interface DesignRequest { id: number; plan: Plan; study?: StudySpec; key?: string }

const lastResults = new Map<string, SchemeResult>();

/** A designed plan as the server keeps it: packed for storage, and JSON.stringify(result) as UTF-8. */
export interface StoredDesign {
  packed: PackedResult;
  json: Uint8Array;
  /**
   * Which kept result the worker re-designed from: its last of this scheme, else its newest of
   * another (designs are reused only where a member's input is the same, so a copy or variant of
   * a scheme gains too); null for a design from nothing. The result is the same either way.
   */
  startedFrom?: 'this scheme' | 'another scheme' | null;
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
      const ofScheme = msg.key !== undefined ? lastResults.get(msg.key) : undefined;
      const previous = ofScheme ?? [...lastResults.values()].pop();
      if (msg.key !== undefined) lastResults.delete(msg.key);
      const result = designScheme(msg.plan, previous ? { previous } : {});
      // Kept for the scheme's next run unless the plan is very large (its memo would crowd the worker's memory budget).
      if (msg.key !== undefined && result.members.length <= KEPT_RESULT_MAX_MEMBERS) {
        lastResults.set(msg.key, result);
        for (const k of lastResults.keys()) if (lastResults.size > KEPT_RESULTS) lastResults.delete(k);
      }
      const text = JSON.stringify(result);
      const json = Buffer.from(text, 'utf8');
      // A Buffer of its own (not a slice of the shared pool), so its memory can be moved.
      const bytes = new Uint8Array(json.buffer, json.byteOffset, json.byteLength);
      const own = bytes.byteOffset === 0 && bytes.byteLength === bytes.buffer.byteLength ? bytes : bytes.slice();
      transfer.push(own.buffer as ArrayBuffer);
      reply = { id: msg.id, ok: true, stored: { packed: packDesignResult(result, text), json: own, startedFrom: ofScheme ? 'this scheme' : previous ? 'another scheme' : null } };
    }
  } catch (err) {
    reply = { id: msg.id, ok: false, message: err instanceof Error ? err.message : String(err) };
  }
  parentPort!.postMessage(reply, transfer);
});
