// Canvas colours, read from the app's CSS tokens (src/styles) so the plan and the pages agree.
import type { UtilisationBand } from '../../../lib/utilisation';
import { formatQuantity, formatValue, type UnitSystem } from '../../../lib/units';

export interface PlanTheme {
  paper: string;
  ink: string;
  inkSoft: string;
  inkFaint: string;
  line: string;
  accent: string;
  accentWash: string;
  load: string;
  util: Record<UtilisationBand, { fill: string; ink: string }>;
}

const FALLBACK: PlanTheme = {
  paper: '#fbf9f4',
  ink: '#1c2228',
  inkSoft: '#4a525a',
  inkFaint: '#767a7b',
  line: '#cdc3ae',
  accent: '#2b3fc2',
  accentWash: '#e4e6f6',
  load: '#7a5a12',
  util: {
    spare: { fill: '#9dbcaf', ink: '#1f3d33' },
    working: { fill: '#3a7468', ink: '#ffffff' },
    near: { fill: '#c9911c', ink: '#2a1d00' },
    over: { fill: '#9f2d27', ink: '#ffffff' },
    none: { fill: '#b9b3a6', ink: '#2b2b2b' },
  },
};

export function readPlanTheme(): PlanTheme {
  if (typeof document === 'undefined' || typeof getComputedStyle !== 'function') return FALLBACK;
  const css = getComputedStyle(document.documentElement);
  const v = (name: string, fallback: string) => css.getPropertyValue(name).trim() || fallback;
  const band = (b: UtilisationBand) => ({ fill: v(`--color-util-${b}`, FALLBACK.util[b].fill), ink: v(`--color-util-${b}-ink`, FALLBACK.util[b].ink) });
  return {
    paper: v('--color-paper-raised', FALLBACK.paper),
    ink: v('--color-ink', FALLBACK.ink),
    inkSoft: v('--color-ink-soft', FALLBACK.inkSoft),
    inkFaint: v('--color-ink-faint', FALLBACK.inkFaint),
    line: v('--color-line', FALLBACK.line),
    accent: v('--color-accent', FALLBACK.accent),
    accentWash: v('--color-accent-wash', FALLBACK.accentWash),
    load: v('--color-notice', FALLBACK.load),
    util: { spare: band('spare'), working: band('working'), near: band('near'), over: band('over'), none: band('none') },
  };
}

export const MONO = '"JetBrains Mono Variable", ui-monospace, monospace';
export const SANS = '"Inter Variable", ui-sans-serif, system-ui, sans-serif';

/** 30 → 30'-0", 28.5 → 28'-6", 7.25 → 7'-3". */
export function feetInches(ft: number): string {
  const sign = ft < 0 ? '-' : '';
  let whole = Math.floor(Math.abs(ft));
  let inches = Math.round((Math.abs(ft) - whole) * 12 * 4) / 4;
  if (inches >= 12) {
    whole += 1;
    inches -= 12;
  }
  return `${sign}${whole}'-${inches % 1 === 0 ? inches : inches.toFixed(2).replace(/0+$/, '')}"`;
}

/**
 * A length on the drawing in the reader's system: US feet-and-inches (30'-0"), SI metres to
 * the millimetre (9.144 m). The plan itself stays in feet.
 */
export function lengthText(ft: number, system: UnitSystem): string {
  return system === 'SI' ? formatQuantity('length_ft', ft, 'SI', { digits: 3 }) : feetInches(ft);
}

/** Trimmed number for a load label: at most two decimals, no trailing zeros (1.5, 12, 0.25). */
function tidy(text: string): string {
  return text.includes('.') ? text.replace(/0+$/, '').replace(/\.$/, '') : text;
}

/** "5D + 3L kip" / "22.24D + 13.34L kN": the dead and live of a point load. */
export function pointLoadText(D_kip: number, L_kip: number, system: UnitSystem): string {
  const v = (kip: number) => tidy(formatValue('force_kip', kip, system, { digits: 2 }));
  return `${v(D_kip)}D + ${v(L_kip)}L ${system === 'SI' ? 'kN' : 'k'}`;
}

/** "0.5D + 0.2L klf" / "7.3D + 2.92L kN/m": the dead and live of a line load. */
export function lineLoadText(D_klf: number, L_klf: number, system: UnitSystem): string {
  const v = (klf: number) => tidy(formatValue('lineLoad_klf', klf, system, { digits: 2 }));
  return `${v(D_klf)}D + ${v(L_klf)}L ${system === 'SI' ? 'kN/m' : 'klf'}`;
}
