/**
 * Column tiers (design-basis §8): one shape for a run of storeys between splices. A column
 * length is the piece below one of the column's levels; tiers are numbered from the bottom
 * (tier 1 is the lowest piece). Default: a new tier every two storeys counted from the bottom
 * (common practice: splices about 4 ft above every second floor). Splice levels, where given,
 * are the levels at which a new tier starts: the lengths above that floor belong to it.
 *
 * The splice is taken at the floor, not 4 ft above it: the storey above a splice is checked
 * with the upper (lighter) tier's shape over its whole length, the conservative reading.
 */

/** Common practice: two storeys per column tier. */
export const DEFAULT_STOREYS_PER_TIER = 2;

export interface TierLength {
  /** The level at the top of this length (its entry in the column stack). */
  level: string;
  /** The level at its bottom, null when it runs down to elevation 0 ft. */
  bottomLevel: string | null;
}

/**
 * Tier number (1 = lowest) of each length, lengths given top down as in the column stack.
 * `spliceLevels` null: every `storeysPerTier` lengths from the bottom; otherwise a new tier
 * starts above each listed level (a level at no length's bottom is ignored here; validation
 * reports it).
 */
export function assignTiers(lengthsTopDown: readonly TierLength[], spliceLevels: readonly string[] | null, storeysPerTier = DEFAULT_STOREYS_PER_TIER): number[] {
  const n = lengthsTopDown.length;
  const tiers = new Array<number>(n);
  const splices = spliceLevels ? new Set(spliceLevels) : null;
  const per = Math.max(1, Math.floor(storeysPerTier));
  let tier = 0;
  for (let fromBottom = 0; fromBottom < n; fromBottom++) {
    const i = n - 1 - fromBottom;
    const startsTier = fromBottom === 0 || (splices ? lengthsTopDown[i].bottomLevel !== null && splices.has(lengthsTopDown[i].bottomLevel!) : fromBottom % per === 0);
    if (startsTier) tier++;
    tiers[i] = tier;
  }
  return tiers;
}

/** The splice levels a tier assignment implies: the bottom level of the lowest length of every tier above the first. */
export function spliceLevelsOf(lengthsTopDown: readonly TierLength[], tiers: readonly number[]): string[] {
  const out: string[] = [];
  for (let i = lengthsTopDown.length - 2; i >= 0; i--) {
    if (tiers[i] !== tiers[i + 1] && lengthsTopDown[i].bottomLevel !== null) out.push(lengthsTopDown[i].bottomLevel!);
  }
  return out;
}
