// Maps a demand/capacity ratio to Baywright's utilisation band, its colour tokens and the
// printed ratio. Colour is never shown alone: every caller prints `printed` beside it.

export type UtilisationBand = 'spare' | 'working' | 'near' | 'over' | 'none';

export type Utilisation = {
  band: UtilisationBand;
  /** Short words for the band, e.g. "Near limit". */
  label: string;
  /** The ratio as printed, two decimals, rounded up so it is never understated. */
  printed: string;
  /** CSS custom properties from src/styles/utilisation.css. */
  colour: string;
  inkColour: string;
  passes: boolean;
};

/** Upper bounds (inclusive) of each passing band. Above 1.00 the member is over. */
export const UTILISATION_LIMITS = { spare: 0.5, working: 0.9, near: 1.0 } as const;

const LABELS: Record<UtilisationBand, string> = {
  spare: 'Spare',
  working: 'Working',
  near: 'Near limit',
  over: 'Over',
  none: 'No result',
};

const MAX_PRINTED = 9.99;

/**
 * Prints a ratio to two decimals, rounding UP (a wrong number is worse than a missing one:
 * 1.004 prints "1.01", never "1.00"). The tiny tolerance absorbs binary noise such as
 * 0.1 * 7 = 0.7000000000000001 so that it still prints "0.70".
 */
export function formatRatio(ratio: number): string {
  if (!Number.isFinite(ratio) || ratio < 0) return '—';
  if (ratio > MAX_PRINTED) return `>${MAX_PRINTED.toFixed(2)}`;
  const up = Math.ceil(ratio * 100 - 1e-9) / 100;
  return up.toFixed(2);
}

export function utilisationBand(ratio: number): UtilisationBand {
  if (!Number.isFinite(ratio) || ratio < 0) return Number.isNaN(ratio) || ratio < 0 ? 'none' : 'over';
  if (ratio <= UTILISATION_LIMITS.spare) return 'spare';
  if (ratio <= UTILISATION_LIMITS.working) return 'working';
  if (ratio <= UTILISATION_LIMITS.near) return 'near';
  return 'over';
}

export function utilisation(ratio: number): Utilisation {
  const band = utilisationBand(ratio);
  let printed = formatRatio(ratio);
  if (band === 'over') {
    // The band is judged on the exact ratio; an over member never prints as "1.00".
    if (!Number.isFinite(ratio)) printed = `>${MAX_PRINTED.toFixed(2)}`;
    else if (Number(printed) <= UTILISATION_LIMITS.near) printed = '1.01';
  }
  return {
    band,
    label: LABELS[band],
    printed,
    colour: `var(--color-util-${band})`,
    inkColour: `var(--color-util-${band}-ink)`,
    passes: band === 'spare' || band === 'working' || band === 'near',
  };
}
