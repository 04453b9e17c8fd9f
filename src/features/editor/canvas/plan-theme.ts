// Canvas colours, read from the app's CSS tokens (src/styles) so the plan and the pages agree.
import type { UtilisationBand } from '../../../lib/utilisation';

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
