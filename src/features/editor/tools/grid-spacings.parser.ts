import { fromDisplay, parseQuantity, toDisplay, unitLabel, type UnitSystem } from '../../../lib/units';

/**
 * "Grid from spacings": text such as `3@30, 2@28` (three bays of 30 ft, then two of 28 ft)
 * or `30 30 28.5`. Plain numbers are in the shown system's length unit (ft, or m when SI is
 * shown: `3@9.144`); a unit written after a number (ft, ', m) is honoured. Returns the bay
 * spacings in feet (the plan's unit), or an error naming the bad part.
 */
export type SpacingsResult = { ok: true; spacings_ft: number[] } | { ok: false; error: string };

/** Guard against a typo like `300@30` drawing hundreds of grid lines. */
export const MAX_BAYS = 60;
export const MAX_SPACING_FT = 200;

/** Metres typed are converted to feet and rounded to 1e-6 ft (0.3 µm) so 9.144 m is 30 ft, not 30.000000000000004. */
const FT_ROUND = 1e6;

export function parseGridSpacings(text: string, system: UnitSystem = 'US'): SpacingsResult {
  const u = unitLabel('length_ft', system);
  const trimmed = text.trim();
  const example = system === 'SI' ? '3@9.144, 2@8.534' : '3@30, 2@28';
  if (trimmed === '') return { ok: false, error: `Enter at least one spacing, for example ${example}.` };
  const parts = trimmed
    .replace(/\s*(ft\b|'|m\b)/gi, '$1')
    .replace(/\s*([@×*])\s*/g, '$1')
    .split(/[,;\s]+/)
    .filter((p) => p !== '');
  const spacings: number[] = [];
  const words = system === 'SI' ? 'metres' : 'feet';
  const shown = (ft: number) => `${Math.round(toDisplay('length_ft', ft, system) * 1000) / 1000} ${u}`;
  for (const part of parts) {
    const match = /^(?:(\d+)[@×*])?(\d+(?:\.\d+)?|\.\d+)(ft|'|m)?$/i.exec(part);
    if (!match) return { ok: false, error: `“${part}” is not a spacing: write ${words} (${system === 'SI' ? '9.144' : '30'}) or count@${words} (${system === 'SI' ? '3@9.144' : '3@30'}).` };
    const count = match[1] === undefined ? 1 : Number(match[1]);
    const unit = match[3]?.toLowerCase();
    let spacing_ft: number;
    if (unit === undefined) spacing_ft = fromDisplay('length_ft', Number(match[2]), system);
    else {
      const parsed = parseQuantity('length_ft', unit === "'" ? `${match[2]}'` : `${match[2]} ${unit}`, system);
      if (!parsed.ok) return { ok: false, error: `“${part}”: ${parsed.error}` };
      spacing_ft = parsed.value;
    }
    if (system === 'SI' || unit === 'm') spacing_ft = Math.round(spacing_ft * FT_ROUND) / FT_ROUND;
    if (count < 1) return { ok: false, error: `“${part}”: the count must be at least 1.` };
    if (!(spacing_ft > 0)) return { ok: false, error: `“${part}”: a spacing must be more than 0 ${u}.` };
    if (spacing_ft > MAX_SPACING_FT) return { ok: false, error: `“${part}”: ${shown(spacing_ft)} is more than ${shown(MAX_SPACING_FT)} between grid lines.` };
    if (spacings.length + count > MAX_BAYS) return { ok: false, error: `More than ${MAX_BAYS} bays in one direction; check the counts.` };
    for (let i = 0; i < count; i++) spacings.push(spacing_ft);
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
