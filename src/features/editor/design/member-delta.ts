/**
 * What the design worker sends back for the members: only those that differ from its last
 * reply. A structured clone of a 10,000-member result takes the main thread longer than the
 * engine takes to design it, and after an edit nearly every member is the same as before.
 *
 *   memberDelta(before, after)  // worker: null where after.members[i] equals before.members[i]
 *   applyMemberDelta(before, delta)  // main thread: the full list again (unchanged members are
 *                                    // the objects it already holds)
 *
 * "Equal" is plain-data equality with keys in the same order, so the list the main thread ends
 * with reads exactly as the worker's (JSON included). The worker replies in order and the main
 * thread keeps every successful reply, so both hold the same `before`.
 */
import type { SchemeMember } from '../../../../shared/engine/index';
import { sameValueInOrder } from '../../../../shared/engine/plain-value';

/** For each member of `after`: null when the member at the same place in `before` is equal to it, else the member. */
export function memberDelta(before: readonly SchemeMember[] | undefined, after: readonly SchemeMember[]): (SchemeMember | null)[] {
  const seen = new WeakMap<object, object>();
  return after.map((m, i) => {
    const was = before?.[i];
    return was !== undefined && was.id === m.id && sameValueInOrder(m, was, seen) ? null : m;
  });
}

/** The full member list from a delta and the list it was made against; throws when the two are out of step. */
export function applyMemberDelta(before: readonly SchemeMember[] | undefined, delta: readonly (SchemeMember | null)[]): SchemeMember[] {
  return delta.map((m, i) => {
    if (m !== null) return m;
    const was = before?.[i];
    if (was === undefined) throw new Error(`The design reply refers to member ${i + 1}, which the last result does not have.`);
    return was;
  });
}
