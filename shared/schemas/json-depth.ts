/**
 * Nesting depth of a parsed JSON value, checked without recursion: a document nested thousands
 * deep must be refused with its path before anything recursive (structuredClone, zod, a
 * migration) overflows the stack on it.
 */

/** Deeper than any plan file or API body Baywright reads (a plan file is about 6 levels). */
export const MAX_JSON_DEPTH = 64;

interface Frame { value: unknown; depth: number; key: string | number | null; parent: Frame | null }

/** The path to the first value nested deeper than maxDepth (first 8 keys), or null when none is. */
export function jsonTooDeepAt(value: unknown, maxDepth = MAX_JSON_DEPTH): (string | number)[] | null {
  const stack: Frame[] = [{ value, depth: 0, key: null, parent: null }];
  while (stack.length > 0) {
    const frame = stack.pop()!;
    const v = frame.value;
    if (v === null || typeof v !== 'object') continue;
    if (frame.depth >= maxDepth) {
      const path: (string | number)[] = [];
      for (let f: Frame | null = frame; f && f.key !== null; f = f.parent) path.unshift(f.key);
      return path.slice(0, 8);
    }
    // Pushed last to first, so values are visited in document order. Only containers are visited (a number or string is never too deep), so a file's many coordinates cost no frame.
    if (Array.isArray(v)) {
      for (let i = v.length - 1; i >= 0; i--) {
        const c: unknown = v[i];
        if (c !== null && typeof c === 'object') stack.push({ value: c, depth: frame.depth + 1, key: i, parent: frame });
      }
    } else {
      const keys = Object.keys(v);
      for (let i = keys.length - 1; i >= 0; i--) {
        const k = keys[i];
        const c = (v as Record<string, unknown>)[k];
        if (c !== null && typeof c === 'object') stack.push({ value: c, depth: frame.depth + 1, key: k, parent: frame });
      }
    }
  }
  return null;
}

/** "levels[0].elevation_ft.a" from a path. */
export function formatJsonPath(path: readonly (string | number)[]): string {
  let out = '';
  for (const p of path) out += typeof p === 'number' ? `[${p}]` : out === '' ? p : `.${p}`;
  return out;
}
