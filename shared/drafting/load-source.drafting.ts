/**
 * A load's `source` (the engine's own short grammar: "deck d3 zone office, tributary 4.2 ft:
 * dead 50 + superimposed 15 psf", "self weight 40 plf", "beam b4 reaction (reducible live)",
 * "point load P2", "line load W1") written for a person: figures in the reader's units and
 * elements by the names people use (marks, zone names), when the caller gives them. The engine
 * keeps its text in US units and ids (it is part of the `calc plan` output); only what is
 * shown is rewritten.
 */

export type SourceQuantityKind = 'length_ft' | 'pressure_psf' | 'lineLoad_klf' | 'force_kip';
/** Number (US, the engine's unit) → text with its unit in the reader's system. */
export type SourceQuantityText = (kind: SourceQuantityKind, valueUS: number) => string;

export interface SourceNames {
  /** "beam 2B1 at B–C / 2" for a member id. */
  member?(id: string): string | undefined;
  /** A load zone's name ("Open office"). */
  zone?(id: string): string | undefined;
  /** "at B / 2" for a point or line load id. */
  load?(id: string): string | undefined;
}

const N = '(\\d+(?:\\.\\d+)?)';
const UNITS = new RegExp(`dead ${N} \\+ superimposed ${N} psf|${N}–${N} ft\\b|${N} (ft|psf|plf|klf|kip)\\b`, 'g');
const KIND: Record<string, SourceQuantityKind> = { ft: 'length_ft', psf: 'pressure_psf', plf: 'lineLoad_klf', klf: 'lineLoad_klf', kip: 'force_kip' };

function rewriteUnits(text: string, q: SourceQuantityText): string {
  return text.replace(UNITS, (_all, dead, sdl, from, to, value, unit) => {
    if (dead !== undefined) return `dead ${q('pressure_psf', Number(dead))} + superimposed ${q('pressure_psf', Number(sdl))}`;
    if (from !== undefined) {
      const a = q('length_ft', Number(from));
      const b = q('length_ft', Number(to));
      const unitOf = (s: string) => s.slice(s.lastIndexOf(' '));
      return unitOf(a) === unitOf(b) ? `${a.slice(0, a.lastIndexOf(' '))}–${b}` : `${a}–${b}`;
    }
    const v = Number(value);
    return q(KIND[unit], unit === 'plf' ? v / 1000 : v);
  });
}

function rewriteNames(text: string, names: SourceNames): string {
  let out = text;
  if (names.zone || names.load) {
    // "deck d3 zone office" → "deck of Open office"
    out = out.replace(/\bdeck (\S+) zone ([^,:)]+?)(?=[,:)]|$)/g, (all, _deck, zone) => {
      const name = names.zone?.(zone);
      return name ? `deck of ${name}` : all;
    });
    out = out.replace(/\(deck (\S+), lever rule/g, '(deck, lever rule');
  }
  if (names.member) {
    out = out.replace(/\b(girder|beam) (\S+) (reaction|start|end)\b/g, (all, _kind, id, what) => {
      const name = names.member!(id);
      return name ? `${name} ${what}` : all;
    });
  }
  if (names.load) {
    out = out.replace(/\b(point load|line load) (\S+?)(?=[\s,:)]|$)/g, (all, kind, id) => {
      const where = names.load!(id);
      return where ? `${kind} ${where}` : all;
    });
  }
  return out;
}

/** The source as a person reads it; `quantity` null leaves figures as the engine wrote them (US). */
export function describeLoadSource(source: string, quantity: SourceQuantityText | null, names: SourceNames = {}): string {
  const named = rewriteNames(source, names);
  return quantity ? rewriteUnits(named, quantity) : named;
}
