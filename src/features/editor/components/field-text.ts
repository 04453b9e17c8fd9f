import { toDisplay, type QuantityKind, type UnitSystem } from '../../../lib/units';

/**
 * The text an editable field starts with: the plan's US value as stored, or its SI
 * conversion to four decimals (trailing zeros dropped). A field whose text is left as this
 * is not written back, so showing SI never nudges a stored US value.
 */
export function fieldText(kind: QuantityKind, valueUS: number, system: UnitSystem): string {
  if (system === 'US') return String(valueUS);
  return String(Number(toDisplay(kind, valueUS, system).toFixed(4)));
}
