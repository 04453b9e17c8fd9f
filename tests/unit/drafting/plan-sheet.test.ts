import { readFileSync } from 'node:fs';
import { PDFParse } from 'pdf-parse';
import { describe, expect, it } from 'vitest';
import { designScheme, SCHEME_CAUTION } from '../../../shared/engine/index';
import { buildPlanSheet, buildPlanSheets, chooseScale, LINE_WEIGHTS } from '../../../shared/drafting/plan-sheet.drafting';
import { parsePlanFile, type Plan } from '../../../shared/schemas/plan.schema';
import { renderSheetsPdf } from '../../../server/pdf/plan-sheet.pdf';
import { sheetFontsEmbedded } from '../../../server/pdf/sheet-fonts.pdf';

const fixture = (): Plan =>
  parsePlanFile(JSON.parse(readFileSync(new URL('../../fixtures/plans/two-bay.plan.json', import.meta.url), 'utf8'))).plan!;

const titleBlock = {
  project: 'Harbour Lane Studio',
  projectNumber: 'HL-07',
  client: 'Tessaly Holdings',
  scheme: 'Scheme A',
  revision: 4,
  date: '2025-05-01',
  preparedBy: 'Dana Drafter',
  sheetIndex: 1,
  sheetCount: 1,
};

describe('chooseScale', () => {
  it('when the framing fits at 1/4", then 1/4" = 1\'-0" is chosen; when it does not, the next smaller standard scale', () => {
    // 40 ft at 1/4" = 10 in = 720 pt; 60 ft at 1/4" = 15 in (too wide for 700 pt), at 3/16" = 11.25 in, at 1/8" = 7.5 in = 540 pt
    expect(chooseScale(40, 20, 720, 500).label).toBe('1/4" = 1\'-0"');
    expect(chooseScale(60, 36, 700, 450).label).toBe('1/8" = 1\'-0"');
    expect(chooseScale(240, 120, 700, 450).label).toBe('1/32" = 1\'-0"');
  });
});

describe('buildPlanSheet on the two-bay fixture', () => {
  const plan = fixture();
  const design = designScheme(plan);
  const sheet = buildPlanSheet({ plan, design, levelId: 'L2', titleBlock, showReactions: true, caution: SCHEME_CAUTION });
  const texts = sheet.primitives.filter((p) => p.type === 'text').map((p) => (p.type === 'text' ? p.text : ''));

  it('when drawn, then every column shows the size of its length below the level beside its mark', () => {
    for (const c of design.columns) {
      const shape = c.levels.find((l) => l.level === 'L2')!.shape!;
      expect(shape).toMatch(/^W1[024]X\d+$/);
      expect(sheet.primitives.some((p) => p.type === 'text' && p.ref === c.id && p.text === shape)).toBe(true);
      expect(sheet.drawnSizes).toContain(shape);
    }
  });

  it('when drawn, then the sheet is 11 × 17 in landscape at 1/8" = 1\'-0"', () => {
    expect([sheet.width_pt, sheet.height_pt]).toEqual([1224, 792]);
    expect(sheet.scale.label).toBe('1/8" = 1\'-0"');
  });

  it('when drawn, then every member carries its size and mark, and girders are heavier than beams', () => {
    for (const m of design.members) {
      expect(texts).toContain(m.shape);
      expect(texts).toContain(m.mark);
      const line = sheet.primitives.find((p) => p.type === 'line' && p.ref === m.id);
      expect(line && line.type === 'line' && line.weight).toBe(m.kind === 'girder' ? LINE_WEIGHTS.girder : LINE_WEIGHTS.beam);
    }
    expect(LINE_WEIGHTS.girder).toBeGreaterThan(LINE_WEIGHTS.beam);
  });

  it('when drawn at 1/8" = 1\'-0", then a 30 ft bay is 3.75 in (270 pt) between grid lines', () => {
    const xs = sheet.primitives
      .filter((p) => p.type === 'line' && p.dash && p.x1 === p.x2)
      .map((p) => (p.type === 'line' ? p.x1 : 0))
      .sort((a, b) => a - b);
    expect(xs).toHaveLength(3);
    expect(xs[1] - xs[0]).toBeCloseTo(270, 9);
  });

  it('when drawn, then grid bubbles, bay dimensions, column marks, the caution and the title block are on it', () => {
    expect(texts.filter((t) => t === 'A')).toHaveLength(2);
    expect(texts).toContain('30\'-0"');
    expect(texts).toContain('60\'-0"');
    expect(texts).toContain('B2');
    expect(texts).toContain('Dana Drafter');
    expect(texts.join(' ')).toContain('licensed');
    expect(texts).toContain('FRAMING PLAN — LEVEL 2');
  });

  it('when reactions are asked for, then each end shows 1.2D+1.6L of its reactions', () => {
    const b2 = design.members.find((m) => m.id === 'b2')!;
    const r = 1.2 * b2.reactions.start.D_kip + 1.6 * b2.reactions.start.L_kip; // ASCE 7-16 §2.3.1 comb. 2
    expect(texts).toContain(`R=${r.toFixed(1)}`);
    const without = buildPlanSheet({ plan, design, levelId: 'L2', titleBlock, showReactions: false, caution: SCHEME_CAUTION });
    expect(without.primitives.some((p) => p.type === 'text' && p.text.startsWith('R='))).toBe(false);
  });
});

describe('renderSheetsPdf', () => {
  it('when rendered, then it is a PDF whose text holds every mark and size of its level, in the app fonts', async () => {
    const plan = fixture();
    const design = designScheme(plan);
    const sheets = buildPlanSheets({ plan, design, titleBlock, showReactions: false, caution: SCHEME_CAUTION });
    const pdf = await renderSheetsPdf(sheets, { title: 'Two-bay', author: 'Dana Drafter' });
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(sheetFontsEmbedded()).toBe(true);
    expect(pdf.toString('latin1')).toContain('Inter');
    const parser = new PDFParse({ data: new Uint8Array(pdf) });
    const { pages } = await parser.getText();
    await parser.destroy();
    expect(pages).toHaveLength(1);
    for (const m of design.members) {
      expect(pages[0].text).toContain(m.mark);
      expect(pages[0].text).toContain(m.shape!);
    }
    expect(pages[0].text).toContain('CAUTION');
  });
});
