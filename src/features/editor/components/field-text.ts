import { toDisplay, type QuantityKind, type UnitSystem } from '../../../lib/units';

/**
 * The text an editable field starts with: the value in the reader's system to four decimals
 * (trailing zeros dropped), so 20 kN typed and read back in US shows 4.4962, not
 * 4.49617886199421. A field whose text is left as this is not written back, so showing it
 * never nudges the stored value.
 */
export function fieldText(kind: QuantityKind, valueUS: number, system: UnitSystem): string {
  return String(Number(toDisplay(kind, valueUS, system).toFixed(4)));
}
