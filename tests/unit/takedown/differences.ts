/** Comparing two results as data, for the re-design tests. */

/** Paths where a and b differ: numbers beyond the relative tolerance, keys (and their order) and anything else exactly. */
export function differences(a: unknown, b: unknown, relTol: number, path = '$', out: string[] = []): string[] {
  if (typeof a === 'number' && typeof b === 'number') {
    if (Math.abs(a - b) > relTol * Math.max(1, Math.abs(a), Math.abs(b))) out.push(`${path}: ${a} ≠ ${b}`);
  } else if (Array.isArray(a) && Array.isArray(b)) {
    if (a.length !== b.length) out.push(`${path}: length ${a.length} ≠ ${b.length}`);
    else a.forEach((x, i) => differences(x, b[i], relTol, `${path}[${i}]`, out));
  } else if (a && b && typeof a === 'object' && typeof b === 'object' && !Array.isArray(a) && !Array.isArray(b)) {
    const ka = Object.keys(a);
    const kb = Object.keys(b);
    if (ka.join() !== kb.join()) out.push(`${path}: keys ${ka.join()} ≠ ${kb.join()}`);
    for (const k of ka) differences((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], relTol, `${path}.${k}`, out);
  } else if (a !== b) out.push(`${path}: ${JSON.stringify(a)} ≠ ${JSON.stringify(b)}`);
  return out;
}
