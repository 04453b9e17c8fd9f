/**
 * Estimated cost of a scheme's framing from the firm's unit prices. Pure arithmetic:
 *   cost = tons × price per ton (fabricated and erected) + connections × price per connection.
 * Items the estimate does not price yet are listed so screens and exports can say so.
 */
import { LB_PER_TON, type TonnageFigures } from './tonnage';

export interface UnitPrices {
  /** US dollars per short ton of beams and girders, fabricated and erected. */
  steel_usd_per_ton: number;
  /** US dollars per end connection, fabricated and erected. */
  connection_usd_each: number;
  /** US dollars per shear stud, installed; absent = not priced. */
  stud_usd_each?: number | null;
  /** US dollars per cambered piece; absent = not priced. */
  camber_usd_each?: number | null;
}

/** Items the estimate leaves out until they are priced. */
export const NOT_YET_PRICED: readonly string[] = ['Shear studs', 'Camber'];

/** The items of NOT_YET_PRICED that these prices still leave out. */
export function notYetPriced(prices: Pick<UnitPrices, 'stud_usd_each' | 'camber_usd_each'>): string[] {
  const out: string[] = [];
  if (prices.stud_usd_each == null) out.push('Shear studs');
  if (prices.camber_usd_each == null) out.push('Camber');
  return out;
}

const priceFmt = new Intl.NumberFormat('en-US', { maximumFractionDigits: 2 });

/**
 * The stud and camber prices as a phrase for exports ("$4.50 per shear stud; $350 per cambered
 * piece"), or null when neither is priced.
 */
export function compositePricesText(prices: Pick<UnitPrices, 'stud_usd_each' | 'camber_usd_each'>): string | null {
  const parts: string[] = [];
  if (prices.stud_usd_each != null) parts.push(`$${priceFmt.format(prices.stud_usd_each)} per shear stud`);
  if (prices.camber_usd_each != null) parts.push(`$${priceFmt.format(prices.camber_usd_each)} per cambered piece`);
  return parts.length ? parts.join('; ') : null;
}

export interface CostBreakdown {
  steel_usd: number;
  connections_usd: number;
  /** Studs × price each (0 when not priced). */
  studs_usd: number;
  /** Cambered pieces × price each (0 when not priced). */
  camber_usd: number;
  cost_usd: number;
}

function finiteOrZero(v: number): number {
  return Number.isFinite(v) ? v : 0;
}

export function estimateCost(t: Pick<TonnageFigures, 'steelWeight_lb' | 'connections'> & Partial<Pick<TonnageFigures, 'studs' | 'camberedPieces'>>, prices: UnitPrices): CostBreakdown {
  const steel_usd = (finiteOrZero(t.steelWeight_lb) / LB_PER_TON) * finiteOrZero(prices.steel_usd_per_ton);
  const connections_usd = finiteOrZero(t.connections) * finiteOrZero(prices.connection_usd_each);
  const studs_usd = finiteOrZero(t.studs ?? 0) * finiteOrZero(prices.stud_usd_each ?? 0);
  const camber_usd = finiteOrZero(t.camberedPieces ?? 0) * finiteOrZero(prices.camber_usd_each ?? 0);
  return { steel_usd, connections_usd, studs_usd, camber_usd, cost_usd: steel_usd + connections_usd + studs_usd + camber_usd };
}

/** other − base for each figure; percent is relative to the base's steel weight. */
export interface TonnageDifference {
  steelWeight_lb: number;
  steelWeight_tons: number;
  /** null when either side has no floor area. */
  steel_psf: number | null;
  /** Change of steel weight as a percentage of the base; null when the base weighs nothing. */
  steelWeight_pct: number | null;
  /** null when either side has no cost. */
  cost_usd: number | null;
  pieces: number;
  connections: number;
}

export interface ComparableFigures {
  steelWeight_lb: number;
  steel_psf: number | null;
  pieces: number;
  connections: number;
  cost_usd: number | null;
}

export function tonnageDifference(base: ComparableFigures, other: ComparableFigures): TonnageDifference {
  const lb = other.steelWeight_lb - base.steelWeight_lb;
  return {
    steelWeight_lb: lb,
    steelWeight_tons: lb / LB_PER_TON,
    steel_psf: base.steel_psf !== null && other.steel_psf !== null ? other.steel_psf - base.steel_psf : null,
    steelWeight_pct: base.steelWeight_lb > 0 ? (lb / base.steelWeight_lb) * 100 : null,
    cost_usd: base.cost_usd !== null && other.cost_usd !== null ? other.cost_usd - base.cost_usd : null,
    pieces: other.pieces - base.pieces,
    connections: other.connections - base.connections,
  };
}

const tonsFmt = new Intl.NumberFormat('en-US', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
const dollarsFmt = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD', maximumFractionDigits: 0 });

/** Dollars of an estimate, to the nearest $100 ($13,900). */
export function formatEstimateUsd(usd: number): string {
  return dollarsFmt.format(Math.round(usd / 100) * 100);
}

function pctText(pct: number): string {
  const a = Math.abs(pct);
  return a > 0 && a < 1 ? `${a.toFixed(1)} %` : `${Math.round(a)} %`;
}

/**
 * One sentence a manager reads: "Scheme B is 4.2 tons (7 %) lighter and $13,900 cheaper
 * than Scheme A." Weights to 0.1 ton, percent whole, dollars to $100.
 */
export function describeDifference(otherName: string, baseName: string, d: TonnageDifference): string {
  const sameWeight = Math.abs(d.steelWeight_tons) < 0.05;
  const pct = d.steelWeight_pct === null ? '' : ` (${pctText(d.steelWeight_pct)})`;
  const weight = `${tonsFmt.format(Math.abs(d.steelWeight_tons))} tons${pct} ${d.steelWeight_lb < 0 ? 'lighter' : 'heavier'}`;
  const roundedUsd = d.cost_usd === null ? null : Math.round(Math.abs(d.cost_usd) / 100) * 100;
  const cost = roundedUsd === null || roundedUsd === 0 ? null : `${dollarsFmt.format(roundedUsd)} ${d.cost_usd! < 0 ? 'cheaper' : 'more expensive'}`;
  const sameCost = roundedUsd === 0;
  if (sameWeight) {
    if (cost) return `${otherName} weighs about the same as ${baseName} (within 0.1 ton) and is ${cost}.`;
    if (sameCost) return `${otherName} weighs and costs about the same as ${baseName}.`;
    return `${otherName} weighs about the same as ${baseName} (within 0.1 ton).`;
  }
  if (cost) return `${otherName} is ${weight} and ${cost} than ${baseName}.`;
  if (sameCost) return `${otherName} is ${weight} than ${baseName} at about the same cost.`;
  return `${otherName} is ${weight} than ${baseName}.`;
}
