import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { W_SHAPES_V15 } from '../../../shared/catalog/w-shapes.generated';
import { parseWShapesCsv } from '../../../shared/catalog/w-shapes-csv.parser';
import { findWShape, getWShape, nominalDepthIn } from '../../../shared/catalog/w-shapes.catalog';
import { W_SHAPE_COLUMNS } from '../../../shared/catalog/w-shape.types';

const csvText = readFileSync(join(__dirname, '../../../shared/catalog/w-shapes-aisc-v15.csv'), 'utf8');

describe('W-shape catalog (AISC Shapes Database v15.0)', () => {
  it('when the CSV is re-parsed, then the generated module matches it exactly, row by row and cell by cell', () => {
    const parsed = parseWShapesCsv(csvText);
    expect(parsed.length).toBe(283); // AISC Shapes Database v15.0: 283 W-shapes (shared/data/README.md)
    expect(W_SHAPES_V15.length).toBe(parsed.length);
    parsed.forEach((row, i) => {
      for (const col of W_SHAPE_COLUMNS) expect(W_SHAPES_V15[i][col], `${row.label}.${col}`).toBe(row[col]);
    });
  });

  it('when the CSV cells are compared as text, then every number in the module reads back the same', () => {
    const lines = csvText.trim().split(/\r?\n/).slice(1);
    lines.forEach((line, i) => {
      const cells = line.split(',');
      W_SHAPE_COLUMNS.forEach((col, c) => {
        const v = W_SHAPES_V15[i][col];
        if (typeof v === 'number') expect(v).toBe(Number(cells[c]));
        else expect(v).toBe(cells[c]);
      });
    });
  });

  it('when a shape is looked up in any letter case, then its published properties come back', () => {
    const s = getWShape('w18x50');
    // AISC Shapes Database v15.0, W18X50 row
    expect(s.label).toBe('W18X50');
    expect(s.d_in).toBe(18);
    expect(s.Zx_in3).toBe(101);
    expect(s.Sx_in3).toBe(88.9);
    expect(s.ry_in).toBe(1.65);
    expect(findWShape('W18X51')).toBeUndefined();
    expect(() => getWShape('W18X51')).toThrow(/unknown W-shape "W18X51"/);
    expect(nominalDepthIn('W6X8.5')).toBe(6);
    expect(nominalDepthIn(s)).toBe(18);
  });

  it('when a row is malformed, then the parser names the line and column', () => {
    const bad = csvText.split('\n').slice(0, 2).join('\n').replace(/,335,/, ',x,');
    expect(() => parseWShapesCsv(bad)).toThrow(/line 2: W_plf/);
  });
});
