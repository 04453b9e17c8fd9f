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

/** Plain-data equality, keys in the same order; `seen` remembers pairs already found equal (results share parts). */
function sameOrdered(a: unknown, b: unknown, seen: WeakMap<object, object>): boolean {
  if (Object.is(a, b)) return true;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return false;
  if (seen.get(a) === b) return true;
  if (Array.isArray(a)) {
    if (!Array.isArray(b) || a.length !== b.length) return false;
    for (let i = 0; i < a.length; i++) if (!sameOrdered(a[i], b[i], seen)) return false;
  } else {
    if (Array.isArray(b) || Object.getPrototypeOf(a) !== Object.getPrototypeOf(b)) return false;
    const ka = Object.keys(a);
    const kb = Object.keys(b);
    if (ka.length !== kb.length) return false;
    for (let i = 0; i < ka.length; i++) {
      if (ka[i] !== kb[i]) return false;
      if (!sameOrdered((a as Record<string, unknown>)[ka[i]], (b as Record<string, unknown>)[ka[i]], seen)) return false;
    }
  }
  seen.set(a, b);
  return true;
}

/** For each member of `after`: null when the member at the same place in `before` is equal to it, else the member. */
export function memberDelta(before: readonly SchemeMember[] | undefined, after: readonly SchemeMember[]): (SchemeMember | null)[] {
  const seen = new WeakMap<object, object>();
  return after.map((m, i) => {
    const was = before?.[i];
    return was !== undefined && was.id === m.id && sameOrdered(m, was, seen) ? null : m;
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
