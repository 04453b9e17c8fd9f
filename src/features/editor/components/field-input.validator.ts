import { parseQuantity, unitLabel, type ParseResult, type QuantityKind, type UnitSystem } from '../../../lib/units';

/**
 * What a typed value must be besides a number: 'nonNegative' for loads and pressures (gravity
 * only; the server refuses a negative placed load on save), 'positive' for spacings and sizes
 * that cannot be zero, 'any' for positions such as a grid line's offset.
 */
export type FieldBound = 'any' | 'nonNegative' | 'positive';

function unitWords(kind: QuantityKind, system: UnitSystem): string {
  const unit = unitLabel(kind, system);
  return unit === 'in' ? 'inches' : unit;
}

/** "enter a number of kip, 0 or more" — the request shown when a field cannot be used. */
export function fieldRequest(kind: QuantityKind, system: UnitSystem, bound: FieldBound): string {
  const base = `enter a number of ${unitWords(kind, system)}`;
  if (bound === 'nonNegative') return `${base}, 0 or more`;
  if (bound === 'positive') return `${base}, more than 0`;
  return base;
}

/**
 * Reads one Plan field typed in the reader's units: the plan's US value, or a message that
 * names the field ("Dead load: enter a number of kip, 0 or more"). A value that fails is never
 * to be written into the plan; the caller keeps the last valid one.
 */
export function readQuantityField(name: string, kind: QuantityKind, text: string, system: UnitSystem, bound: FieldBound): ParseResult {
  const request = fieldRequest(kind, system, bound);
  const parsed = parseQuantity(kind, text, system);
  if (!parsed.ok) {
    // parseQuantity's own wording is kept where it says something more useful than "enter a
    // number" (a wrong unit, a thousands separator, 12 inches or more).
    const generic = /^Enter a (number|value) /.test(parsed.error);
    return { ok: false, error: `${name}: ${generic ? request : parsed.error.charAt(0).toLowerCase() + parsed.error.slice(1)}` };
  }
  const value = parsed.value === 0 ? 0 : parsed.value; // no -0 in the plan
  if (!Number.isFinite(value)) return { ok: false, error: `${name}: ${request}` };
  if (bound === 'nonNegative' && value < 0) return { ok: false, error: `${name}: ${request}` };
  if (bound === 'positive' && !(value > 0)) return { ok: false, error: `${name}: ${request}` };
  return { ok: true, value };
}

/** A whole count typed into a field ("Beams per bay: enter a whole number, 1 or more"). */
export function readCountField(name: string, text: string, min: number): ParseResult {
  const raw = text.trim();
  const value = Number(raw);
  if (!/^\+?\d+$/.test(raw) || !Number.isSafeInteger(value) || value < min) {
    return { ok: false, error: `${name}: enter a whole number, ${min} or more` };
  }
  return { ok: true, value };
}
