import { W_SHAPE_COLUMNS, type WShape } from './w-shape.types';

/**
 * Parses the catalog CSV text (no fs here, so the generator and the tests share it).
 * Throws with the line number on a malformed row; values are never altered.
 */
export function parseWShapesCsv(text: string): WShape[] {
  const lines = text.split(/\r?\n/).filter((l) => l.trim() !== '');
  const header = lines[0].split(',').map((h) => h.trim());
  if (header.join(',') !== W_SHAPE_COLUMNS.join(',')) {
    throw new Error(`w-shapes CSV: unexpected header "${lines[0]}"`);
  }
  return lines.slice(1).map((line, i) => {
    const cells = line.split(',').map((c) => c.trim());
    if (cells.length !== header.length) {
      throw new Error(`w-shapes CSV line ${i + 2}: ${cells.length} cells, expected ${header.length}`);
    }
    const row: Record<string, string | number> = { label: cells[0] };
    for (let c = 1; c < header.length; c++) {
      const v = Number(cells[c]);
      if (cells[c] === '' || !Number.isFinite(v)) {
        throw new Error(`w-shapes CSV line ${i + 2}: ${header[c]} is not a number ("${cells[c]}")`);
      }
      row[header[c]] = v;
    }
    return row as unknown as WShape;
  });
}
