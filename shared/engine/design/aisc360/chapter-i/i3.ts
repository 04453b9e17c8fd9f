/**
 * AISC 360-16 I3.2a: positive flexural strength of a composite beam from the plastic stress
 * distribution (compact web: every rolled W-shape at Fy ≤ 50 ksi has h/tw ≤ 3.76 √(E/Fy), the
 * catalog's web class is asserted by the caller). Partial composite per I3.2d: the concrete
 * compression C = min(0.85 f'c Ac, Fy As, ΣQn).
 *
 * Steel idealised as two flanges bf × tf and a web tw between them (fillets ignored: the
 * compression block in the flange/web is placed in the plate, which is conservative for Mn).
 */
import { eqC_I3_1 } from './i3.equations';

export interface CompositeSteel {
  asIn2: number;
  dIn: number;
  bfIn: number;
  tfIn: number;
  twIn: number;
  ixIn4: number;
  /** Plastic modulus of the shape (catalog, with its fillets), in³. */
  zxIn3: number;
  fyKsi: number;
}

export interface CompositeConcrete {
  /** Effective width b (I3.1a), in. */
  bIn: number;
  /** Concrete area in compression Ac (I3.2c: above the deck for perpendicular ribs; ribs by average width for parallel), in². */
  acIn2: number;
  fcKsi: number;
  /** Depth of slab from its top to the top of the steel (hr + tc), in. */
  slabTopToSteelIn: number;
  /** Depth of concrete that may be in compression, from the top (tc for perpendicular ribs, tc + hr for parallel), in. */
  compressibleDepthIn: number;
  /**
   * Parallel ribs (I3.2c): the slab is full width b only down to the topping's depth tc; below it
   * the ribs are b × wr/s wide. Absent (perpendicular ribs, or a solid slab): full width throughout.
   */
  ribs?: { toppingIn: number; widthFraction: number };
}

export type PnaLocation = 'slab' | 'flange' | 'web';

export interface CompositeFlexure {
  /** C = min(0.85 f'c Ac, Fy As, ΣQn), kip. */
  cKip: number;
  cConcreteKip: number;
  cSteelKip: number;
  sumQnKip: number;
  governsC: 'concrete' | 'steel' | 'studs';
  /** Depth of the concrete compression block, in. */
  aIn: number;
  /** Y2: top of steel to the centroid of the concrete compression force, in. */
  y2In: number;
  pna: PnaLocation;
  /** Depth of the PNA below the top of steel (0 when it is in the slab), in. */
  ypIn: number;
  /** Compression in the steel, kip. */
  cSteelCompKip: number;
  mnKipIn: number;
  /** Fraction of full composite: ΣQn / min(0.85 f'c Ac, Fy As), capped at 1. */
  percentComposite: number;
}

/**
 * Depth a of the concrete compression block and Y2 (top of steel to the centroid of C). Over a
 * full-width slab, a = C / (0.85 f'c b). With parallel ribs a block deeper than the topping goes
 * on into the ribs at their own width b wr/s, so it is deeper and its centroid lower than a
 * full-width block would give (taking it full width would overstate the lever arm and Mn).
 */
export function concreteBlock(concrete: CompositeConcrete, cKip: number): { aIn: number; y2In: number } {
  const unitKip = 0.85 * concrete.fcKsi * concrete.bIn; // kip per inch of depth, full width
  const ribs = concrete.ribs;
  const fullWidthKip = ribs ? unitKip * ribs.toppingIn : Infinity;
  if (!ribs || cKip <= fullWidthKip) {
    const aIn = Math.min(concrete.compressibleDepthIn, cKip / unitKip);
    return { aIn, y2In: concrete.slabTopToSteelIn - aIn / 2 };
  }
  const ribKip = cKip - fullWidthKip;
  const ribDepthIn = Math.min(concrete.compressibleDepthIn - ribs.toppingIn, ribKip / (unitKip * ribs.widthFraction));
  const centroidFromTopIn = (fullWidthKip * (ribs.toppingIn / 2) + ribKip * (ribs.toppingIn + ribDepthIn / 2)) / cKip;
  return { aIn: ribs.toppingIn + ribDepthIn, y2In: concrete.slabTopToSteelIn - centroidFromTopIn };
}

/** Plastic Mn of the composite section for a given ΣQn (I3.2a, I3.2d). */
export function compositePlasticFlexure(steel: CompositeSteel, concrete: CompositeConcrete, sumQnKip: number): CompositeFlexure {
  const { asIn2, dIn, bfIn, tfIn, twIn, fyKsi } = steel;
  const cConcreteKip = 0.85 * concrete.fcKsi * concrete.acIn2;
  const cSteelKip = fyKsi * asIn2;
  const full = Math.min(cConcreteKip, cSteelKip);
  const cKip = Math.min(full, Math.max(0, sumQnKip));
  const governsC: CompositeFlexure['governsC'] = sumQnKip < full ? 'studs' : cConcreteKip <= cSteelKip ? 'concrete' : 'steel';
  const { aIn, y2In } = concreteBlock(concrete, cKip);
  // Steel compression force so that C + Cs = T = Fy As − Cs.
  const cSteelCompKip = Math.max(0, (cSteelKip - cKip) / 2);
  let pna: PnaLocation;
  let ypIn: number;
  let aCompIn2: number;
  let yCompIn: number; // centroid of the steel compression area below top of steel
  const flangeKip = fyKsi * bfIn * tfIn;
  if (cSteelCompKip <= 1e-9) {
    pna = 'slab'; ypIn = 0; aCompIn2 = 0; yCompIn = 0;
  } else if (cSteelCompKip <= flangeKip) {
    pna = 'flange';
    ypIn = cSteelCompKip / (fyKsi * bfIn);
    aCompIn2 = bfIn * ypIn;
    yCompIn = ypIn / 2;
  } else {
    pna = 'web';
    const webIn2 = (cSteelCompKip - flangeKip) / fyKsi;
    const webDepthIn = webIn2 / twIn;
    ypIn = tfIn + webDepthIn;
    aCompIn2 = bfIn * tfIn + webIn2;
    yCompIn = (bfIn * tfIn * (tfIn / 2) + webIn2 * (tfIn + webDepthIn / 2)) / aCompIn2;
  }
  // Tension: the rest of the steel, centroid from the doubly symmetric section about d/2.
  const aTensIn2 = asIn2 - aCompIn2;
  const yTensIn = (asIn2 * (dIn / 2) - aCompIn2 * yCompIn) / aTensIn2;
  // Moments of C (concrete) and Cs (steel compression) about the tension resultant.
  const plasticKipIn = cKip * (y2In + yTensIn) + cSteelCompKip * (yTensIn - yCompIn);
  // The plate idealisation leaves out the fillets, so at small ΣQn it can fall a little below
  // the catalog Fy Zx of the steel alone; the composite section is never weaker than its steel
  // (braced continuously by the hardened slab, F2.1), so Mn is at least Fy Zx.
  const mnKipIn = Math.max(plasticKipIn, fyKsi * steel.zxIn3);
  return {
    cKip, cConcreteKip, cSteelKip, sumQnKip, governsC, aIn, y2In, pna, ypIn, cSteelCompKip, mnKipIn,
    percentComposite: full > 0 ? Math.min(1, sumQnKip / full) : 0,
  };
}

/** Lower-bound I of the composite section (Commentary Eq. C-I3-1) with ΣQn capped at full composite. */
export function lowerBoundInertia(steel: CompositeSteel, concrete: CompositeConcrete, sumQnKip: number, y2In: number): { ilbIn4: number; yEnaIn: number; sumQnUsedKip: number } {
  const full = Math.min(0.85 * concrete.fcKsi * concrete.acIn2, steel.fyKsi * steel.asIn2);
  const q = Math.min(full, Math.max(0, sumQnKip));
  const r = eqC_I3_1(steel.ixIn4, steel.asIn2, steel.dIn / 2, y2In, q, steel.fyKsi);
  return { ...r, sumQnUsedKip: q };
}
