/**
 * Weight of a concrete slab on fluted steel deck (design-basis §1, plain geometry):
 * concrete above the ribs plus the ribs' share (rib height × average rib width / rib spacing),
 * times the unit weight, plus the deck's own weight. psf.
 */
export interface SlabBuildUp {
  ribHeight_in: number;
  toppingThickness_in: number;
  ribAvgWidth_in: number;
  ribSpacing_in: number;
  concreteWeight_pcf: number;
  fc_ksi: number;
  deckWeight_psf: number;
}

export function slabWeight(slab: SlabBuildUp): { concrete_psf: number; deck_psf: number; total_psf: number; equivalentThickness_in: number; text: string } {
  const equivalentThickness_in = slab.toppingThickness_in + (slab.ribHeight_in * slab.ribAvgWidth_in) / slab.ribSpacing_in;
  const concrete_psf = (slab.concreteWeight_pcf * equivalentThickness_in) / 12;
  const total_psf = concrete_psf + slab.deckWeight_psf;
  const text = `slab ${slab.concreteWeight_pcf} pcf × (${slab.toppingThickness_in} + ${slab.ribHeight_in} × ${slab.ribAvgWidth_in}/${slab.ribSpacing_in}) in / 12 = ${concrete_psf.toFixed(1)} psf + deck ${slab.deckWeight_psf} psf = ${total_psf.toFixed(1)} psf`;
  return { concrete_psf, deck_psf: slab.deckWeight_psf, total_psf, equivalentThickness_in, text };
}
