/**
 * Plain data (JSON-like values: numbers, strings, booleans, null, undefined, arrays and plain
 * objects) compared and copied by value, for the memos that decide what a re-design may reuse.
 */

/** Deep equality of plain data; numbers by Object.is (so 0 and −0 differ, as arithmetic may). */
export function sameValue(a: unknown, b: unknown): boolean {
  if (Object.is(a, b)) return true;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return false;
  if (Array.isArray(a)) {
    if (!Array.isArray(b) || a.length !== b.length) return false;
    for (let i = 0; i < a.length; i++) if (!sameValue(a[i], b[i])) return false;
    return true;
  }
  if (Array.isArray(b)) return false;
  const ka = Object.keys(a);
  const kb = Object.keys(b);
  if (ka.length !== kb.length) return false;
  for (const k of ka) {
    if (!Object.prototype.hasOwnProperty.call(b, k)) return false;
    if (!sameValue((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k])) return false;
  }
  return true;
}

/**
 * Deep equality of plain data with keys in the same order, so equal values also read as the
 * same JSON text; `seen` remembers pairs already found equal (results share parts, so a part
 * met again costs one lookup).
 */
export function sameValueInOrder(a: unknown, b: unknown, seen: WeakMap<object, object> = new WeakMap()): boolean {
  if (Object.is(a, b)) return true;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return false;
  if (seen.get(a) === b) return true;
  if (Array.isArray(a)) {
    if (!Array.isArray(b) || a.length !== b.length) return false;
    for (let i = 0; i < a.length; i++) if (!sameValueInOrder(a[i], b[i], seen)) return false;
  } else {
    if (Array.isArray(b) || Object.getPrototypeOf(a) !== Object.getPrototypeOf(b)) return false;
    const ka = Object.keys(a);
    const kb = Object.keys(b);
    if (ka.length !== kb.length) return false;
    for (let i = 0; i < ka.length; i++) {
      if (ka[i] !== kb[i]) return false;
      if (!sameValueInOrder((a as Record<string, unknown>)[ka[i]], (b as Record<string, unknown>)[ka[i]], seen)) return false;
    }
  }
  seen.set(a, b);
  return true;
}

/** A deep copy of plain data (own enumerable keys, undefined values kept), sharing nothing with it. */
export function copyValue<T>(value: T): T {
  if (typeof value !== 'object' || value === null) return value;
  if (Array.isArray(value)) return value.map(copyValue) as T;
  const out: Record<string, unknown> = {};
  for (const k of Object.keys(value)) out[k] = copyValue((value as Record<string, unknown>)[k]);
  return out as T;
}
