/**
 * "Grid from spacings": text such as `3@30, 2@28` (three bays of 30 ft, then two of 28 ft)
 * or `30 30 28.5`. Returns the bay spacings in feet, or an error naming the bad part.
 */
export type SpacingsResult = { ok: true; spacings_ft: number[] } | { ok: false; error: string };

/** Guard against a typo like `300@30` drawing hundreds of grid lines. */
export const MAX_BAYS = 60;
export const MAX_SPACING_FT = 200;

export function parseGridSpacings(text: string): SpacingsResult {
  const trimmed = text.trim();
  if (trimmed === '') return { ok: false, error: 'Enter at least one spacing, for example 3@30, 2@28.' };
  const parts = trimmed.replace(/\s*(?:ft\b|')/gi, '').replace(/\s*([@×*])\s*/g, '$1').split(/[,;\s]+/).filter((p) => p !== '');
  const spacings: number[] = [];
  for (const part of parts) {
    const match = /^(?:(\d+)[@×*])?(\d+(?:\.\d+)?|\.\d+)$/.exec(part);
    if (!match) return { ok: false, error: `“${part}” is not a spacing: write feet (30) or count@feet (3@30).` };
    const count = match[1] === undefined ? 1 : Number(match[1]);
    const spacing = Number(match[2]);
    if (count < 1) return { ok: false, error: `“${part}”: the count must be at least 1.` };
    if (!(spacing > 0)) return { ok: false, error: `“${part}”: a spacing must be more than 0 ft.` };
    if (spacing > MAX_SPACING_FT) return { ok: false, error: `“${part}”: ${spacing} ft is more than ${MAX_SPACING_FT} ft between grid lines.` };
    if (spacings.length + count > MAX_BAYS) return { ok: false, error: `More than ${MAX_BAYS} bays in one direction; check the counts.` };
    for (let i = 0; i < count; i++) spacings.push(spacing);
  }
  return { ok: true, spacings_ft: spacings };
}

/** Grid line offsets from spacings, starting at `origin_ft`: n spacings give n + 1 lines. */
export function offsetsFromSpacings(spacings_ft: readonly number[], origin_ft = 0): number[] {
  const offsets = [origin_ft];
  for (const s of spacings_ft) offsets.push(Math.round((offsets[offsets.length - 1] + s) * 1e6) / 1e6);
  return offsets;
}

/** Labels: lines of constant x are numbered 1, 2, 3 …; lines of constant y lettered A, B … Z, AA … */
export function gridLabel(axis: 'x' | 'y', index: number): string {
  if (axis === 'x') return String(index + 1);
  let n = index;
  let label = '';
  do {
    label = String.fromCharCode(65 + (n % 26)) + label;
    n = Math.floor(n / 26) - 1;
  } while (n >= 0);
  return label;
}
