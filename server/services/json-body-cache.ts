import { createHash } from 'node:crypto';
import { gzipSync } from 'node:zlib';

// Response bodies that are expensive to build and never change once built (a stored design
// run's view, the schedule and tonnage of a run): serialised once to the exact bytes
// `res.json` would send, with a validator, and gzip-compressed once on first demand. Kept in a
// small cache bounded by bytes, least recently used first out, so memory stays flat however
// many runs are read.

/** A serialised JSON response body. */
export interface JsonBody {
  /** UTF-8 JSON text, byte-identical to JSON.stringify of the value. */
  readonly bytes: Buffer;
  /** Weak validator over the bytes (the same for the identity and gzip encodings of them). */
  readonly etag: string;
  /** The gzip encoding of bytes, made on first request (null until then). */
  gzip: Buffer | null;
}

/** Bodies below this many bytes are sent as they are (compressing them gains nothing). */
export const GZIP_MIN_BYTES = 2048;

export function jsonBodyFromBytes(bytes: Buffer): JsonBody {
  const etag = `W/"${createHash('sha1').update(bytes).digest('base64url')}"`;
  return { bytes, etag, gzip: null };
}

/** JSON.stringify(value) as a body. */
export function jsonBody(value: unknown): JsonBody {
  return jsonBodyFromBytes(Buffer.from(JSON.stringify(value), 'utf8'));
}

/** The gzip encoding of a body (made once). */
export function gzipOf(body: JsonBody): Buffer {
  return (body.gzip ??= gzipSync(body.bytes, { level: 6 }));
}

/** A least-recently-used map bounded by entry count and by the bytes its bodies hold. */
export class JsonBodyCache<K> {
  private readonly map = new Map<K, JsonBody>();
  private bytes = 0;

  constructor(
    readonly maxEntries: number,
    readonly maxBytes: number,
  ) {}

  /** The body's bytes with an allowance for its gzip encoding, which may be made later (JSON compresses well past 4:1). */
  private static sizeOf(body: JsonBody): number {
    return Math.ceil(body.bytes.length * 1.25);
  }

  get(key: K): JsonBody | undefined {
    const body = this.map.get(key);
    if (body) {
      this.map.delete(key);
      this.map.set(key, body);
    }
    return body;
  }

  set(key: K, body: JsonBody): JsonBody {
    this.delete(key);
    const size = JsonBodyCache.sizeOf(body);
    if (size > this.maxBytes) return body; // too big to keep: served, not cached
    this.map.set(key, body);
    this.bytes += size;
    this.trim();
    return body;
  }

  delete(key: K): void {
    const old = this.map.get(key);
    if (old) {
      this.map.delete(key);
      this.bytes -= JsonBodyCache.sizeOf(old);
    }
  }

  /** Drops every entry whose key matches. */
  deleteWhere(match: (key: K) => boolean): void {
    for (const key of [...this.map.keys()]) if (match(key)) this.delete(key);
  }

  clear(): void {
    this.map.clear();
    this.bytes = 0;
  }

  get size(): { entries: number; bytes: number } {
    return { entries: this.map.size, bytes: this.bytes };
  }

  private trim(): void {
    while (this.map.size > this.maxEntries || this.bytes > this.maxBytes) {
      const oldest = this.map.keys().next().value as K;
      this.delete(oldest);
    }
  }
}
