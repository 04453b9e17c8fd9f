/**
 * Writes one JSON document in pieces, so a building's result is never held as one string.
 * The text is exactly `JSON.stringify(value, null, indent)` (indent 0: compact): containers down
 * to `STREAM_DEPTH` are opened and closed here, anything deeper is stringified whole and
 * re-indented (JSON.stringify escapes newlines inside strings, so every raw newline is layout).
 */
// 2: the document and its top-level lists are walked here; each element of a list (a member, a
// column) is one JSON.stringify call, which is much faster than walking its fields in script.
const STREAM_DEPTH = 2;
/** Pieces are gathered up to this size before one write (fewer, larger writes). */
const FLUSH_CHARS = 1 << 16;
/**
 * Compact output: a top-level list is stringified this many elements at a time (one
 * JSON.stringify call per slice, its brackets dropped), which writes the same text as one
 * call per element at a fraction of the script work; 64 members are about 60 kB.
 */
const SLICE = 64;

type Write = (chunk: string) => void;

class ChunkedWriter {
  private parts: string[] = [];
  private size = 0;
  constructor(private readonly write: Write) {}
  push(s: string): void {
    this.parts.push(s);
    this.size += s.length;
    if (this.size >= FLUSH_CHARS) this.flush();
  }
  flush(): void {
    if (this.parts.length === 0) return;
    this.write(this.parts.join(''));
    this.parts = [];
    this.size = 0;
  }
}

/** The value JSON.stringify would serialise for `key` (toJSON applied), or undefined when it skips it. */
function serialisable(holderKey: string, value: unknown): unknown {
  if (value !== null && typeof value === 'object' && typeof (value as { toJSON?: unknown }).toJSON === 'function') {
    value = (value as { toJSON: (k: string) => unknown }).toJSON(holderKey);
  }
  if (value === undefined || typeof value === 'function' || typeof value === 'symbol') return undefined;
  return value;
}

const hasToJson = (v: unknown) => v !== null && typeof v === 'object' && typeof (v as { toJSON?: unknown }).toJSON === 'function';

function emit(out: ChunkedWriter, value: unknown, indent: number, depth: number): void {
  const isContainer = value !== null && typeof value === 'object';
  if (!isContainer || depth >= STREAM_DEPTH) {
    const text = JSON.stringify(value, null, indent);
    out.push(indent > 0 && depth > 0 ? text.replaceAll('\n', `\n${' '.repeat(indent * depth)}`) : text);
    return;
  }
  const inner = indent > 0 ? `\n${' '.repeat(indent * (depth + 1))}` : '';
  const close = indent > 0 ? `\n${' '.repeat(indent * depth)}` : '';
  if (Array.isArray(value)) {
    if (value.length === 0) return out.push('[]');
    if (indent === 0 && depth === STREAM_DEPTH - 1 && !value.some(hasToJson)) {
      // Without toJSON (which would see the slice's index as its key) a slice's text is its
      // elements' texts joined by commas, undefined and functions written as null, as element by element.
      out.push('[');
      for (let i = 0; i < value.length; i += SLICE) {
        const text = JSON.stringify(value.slice(i, i + SLICE));
        out.push(i === 0 ? text.slice(1, -1) : `,${text.slice(1, -1)}`);
      }
      out.push(']');
      return;
    }
    out.push('[');
    for (let i = 0; i < value.length; i++) {
      out.push(i === 0 ? inner : `,${inner}`);
      const v = serialisable(String(i), value[i]);
      if (v === undefined) out.push('null');
      else emit(out, v, indent, depth + 1);
    }
    out.push(`${close}]`);
    return;
  }
  let first = true;
  for (const key of Object.keys(value)) {
    const v = serialisable(key, (value as Record<string, unknown>)[key]);
    if (v === undefined) continue;
    out.push(`${first ? `{${inner}` : `,${inner}`}${JSON.stringify(key)}${indent > 0 ? ': ' : ':'}`);
    first = false;
    emit(out, v, indent, depth + 1);
  }
  out.push(first ? '{}' : `${close}}`);
}

/** Writes `value` as JSON (then a newline) through `write`, in pieces of about 64 k characters. */
export function writeJsonDocument(value: unknown, write: Write, indent: number): void {
  const out = new ChunkedWriter(write);
  const v = serialisable('', value);
  if (v === undefined) throw new Error('writeJsonDocument: the value has no JSON form');
  emit(out, v, indent, 0);
  out.push('\n');
  out.flush();
}
