import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { writeJsonDocument } from '../../../server/cli/json-stream';

const written = (value: unknown, indent: number) => {
  const chunks: string[] = [];
  writeJsonDocument(value, (c) => chunks.push(c), indent);
  return chunks.join('');
};

describe('writeJsonDocument (streamed JSON of calc)', () => {
  it('when given any JSON value, then the text equals JSON.stringify compact and indented', () => {
    fc.assert(
      fc.property(fc.jsonValue({ maxDepth: 6 }), (v) => {
        expect(written(v, 0)).toBe(`${JSON.stringify(v)}\n`);
        expect(written(v, 2)).toBe(`${JSON.stringify(v, null, 2)}\n`);
      }),
      { numRuns: 300 },
    );
  });

  it('when objects hold undefined, functions or toJSON, then they are skipped or converted as JSON.stringify does', () => {
    const v = { a: undefined, b: [undefined, () => 1, 3], c: { toJSON: () => 'x' }, d: { e: { f: { g: [1, { h: undefined }] } } }, s: 'line\nbreak' };
    expect(written(v, 0)).toBe(`${JSON.stringify(v)}\n`);
    expect(written(v, 2)).toBe(`${JSON.stringify(v, null, 2)}\n`);
  });

  it('when top-level lists are longer than one slice (any JSON, undefined and functions among them), then the compact text is JSON.stringify\'s', () => {
    const element = fc.oneof(fc.jsonValue({ maxDepth: 3 }), fc.constant(undefined), fc.constant(() => 1));
    fc.assert(
      fc.property(fc.dictionary(fc.string({ maxLength: 4 }), fc.array(element, { minLength: 0, maxLength: 300 }), { maxKeys: 3 }), (v) => {
        expect(written(v, 0)).toBe(`${JSON.stringify(v)}\n`);
        expect(written(v, 2)).toBe(`${JSON.stringify(v, null, 2)}\n`);
      }),
      { numRuns: 60 },
    );
  });

  it('when a top-level list holds an element with toJSON, then toJSON sees the element\'s own index, as in JSON.stringify', () => {
    const list: unknown[] = Array.from({ length: 150 }, (_, i) => ({ i }));
    list[140] = { toJSON: (key: string) => `at ${key}` };
    const v = { members: list };
    expect(written(v, 0)).toBe(`${JSON.stringify(v)}\n`);
    expect(written(v, 0)).toContain('"at 140"');
  });

  it('when the document is large, then it is written in several pieces of bounded size', () => {
    const v = { members: Array.from({ length: 5000 }, (_, i) => ({ id: `m${i}`, shape: 'W18X35', ratio: i / 5000 })) };
    const chunks: string[] = [];
    writeJsonDocument(v, (c) => chunks.push(c), 0);
    expect(chunks.length).toBeGreaterThan(3);
    expect(Math.max(...chunks.map((c) => c.length))).toBeLessThan(70_000);
    expect(JSON.parse(chunks.join(''))).toEqual(v);
  });
});
