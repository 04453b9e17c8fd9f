import PDFDocument from 'pdfkit';
import { describeDifference, formatEstimateUsd, compositePricesText, notYetPriced, tonnageDifference } from '../../shared/tonnage/cost';
import { LB_PER_TON } from '../../shared/tonnage/tonnage';
import type { Comparison, ComparisonScheme } from '../services/comparison.service';

// The tonnage comparison as a printable PDF (US Letter, landscape): a dated title, the
// caution, the unit prices used, one column per scheme, the differences against the chosen
// (or first) scheme, and each scheme's figures by level and by kind. Standard PDF fonts only.

const MARGIN = 40;
const INK = '#111111';
const SOFT = '#555555';

const int = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });
const one = new Intl.NumberFormat('en-US', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
const two = new Intl.NumberFormat('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
const STATUS: Record<string, string> = { draft: 'Draft', in_review: 'In review', chosen: 'Chosen' };

/** The scheme the others are measured against: the chosen one, else the first. */
export function baseSchemeOf(schemes: ComparisonScheme[]): ComparisonScheme | undefined {
  const designed = schemes.filter((s) => s.totals);
  return designed.find((s) => s.status === 'chosen') ?? designed[0];
}

function table(doc: PDFKit.PDFDocument, header: string[], rows: string[][], widths: number[]): void {
  const x0 = MARGIN;
  let y = doc.y;
  const rowH = 15;
  const drawRow = (cells: string[], bold: boolean) => {
    if (y + rowH > doc.page.height - MARGIN) {
      doc.addPage();
      y = MARGIN;
    }
    let x = x0;
    doc.font(bold ? 'Helvetica-Bold' : 'Helvetica').fontSize(8.5).fillColor(INK);
    cells.forEach((cell, i) => {
      const w = widths[i];
      doc.text(cell, x + 3, y + 4, { width: w - 6, align: i === 0 ? 'left' : 'right', lineBreak: false, ellipsis: true });
      x += w;
    });
    doc.moveTo(x0, y + rowH).lineTo(x, y + rowH).lineWidth(bold ? 0.9 : 0.3).strokeColor(bold ? INK : SOFT).stroke();
    y += rowH;
  };
  drawRow(header, true);
  for (const r of rows) drawRow(r, false);
  doc.x = MARGIN;
  doc.y = y + 10;
}

export function comparisonPdf(c: Comparison): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'LETTER',
    layout: 'landscape',
    margin: MARGIN,
    bufferPages: true,
    info: { Title: `Tonnage comparison: ${c.project.name}`, Author: 'Baywright', Subject: 'Steel tonnage and cost by scheme' },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (b: Buffer) => chunks.push(b));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const width = doc.page.width - 2 * MARGIN;
  const date = c.generatedAt.slice(0, 10);

  doc.font('Helvetica-Bold').fontSize(16).fillColor(INK).text(`Tonnage comparison: ${c.project.name}`, MARGIN, MARGIN);
  doc.font('Helvetica').fontSize(9).fillColor(SOFT).text(`Issued ${date} by Baywright. Steel beams and girders of each scheme, from a design of its current plan.`);
  doc.moveDown(0.6);

  // Caution, boxed so it is not missed.
  const cautionTop = doc.y;
  doc.font('Helvetica-Bold').fontSize(9).fillColor(INK).text('Caution. ', MARGIN + 8, cautionTop + 6, { continued: true, width: width - 16 });
  doc.font('Helvetica').text(`${c.caution} Costs are estimates from unit prices, not a quotation.`, { width: width - 16 });
  const cautionBottom = doc.y + 6;
  doc.rect(MARGIN, cautionTop, width, cautionBottom - cautionTop).lineWidth(1).strokeColor(INK).stroke();
  doc.x = MARGIN;
  doc.y = cautionBottom + 8;

  doc.font('Helvetica').fontSize(8.5).fillColor(SOFT).text(c.basis, MARGIN, doc.y, { width });
  const p = c.prices.prices;
  doc.text(
    p
      ? `Unit prices${p.example ? ' (an invented example, not market prices)' : ''}: $${int.format(p.steel_usd_per_ton)} per ton fabricated and erected; $${int.format(p.connection_usd_each)} per connection${compositePricesText(p) ? `; ${compositePricesText(p)}` : ''}; set ${p.setAt.slice(0, 10)}${p.setBy ? ` by ${p.setBy.name}` : ''}.${notYetPriced(p).length ? ` Not yet priced: ${notYetPriced(p).join(', ').toLowerCase()}.` : ''}`
      : 'No unit prices are set for the firm: costs are not estimated.',
    { width },
  );
  doc.moveDown(0.8);

  const schemes = c.schemes;
  if (schemes.length === 0) {
    doc.font('Helvetica').fontSize(10).fillColor(INK).text('No schemes to compare.');
  } else {
    const labelW = 170;
    const colW = Math.min(150, (width - labelW) / schemes.length);
    const widths = [labelW, ...schemes.map(() => colW)];
    const cell = (s: ComparisonScheme, f: (t: NonNullable<ComparisonScheme['totals']>) => string) => (s.totals ? f(s.totals) : 'not designed');
    doc.font('Helvetica-Bold').fontSize(11).fillColor(INK).text('Totals');
    doc.moveDown(0.3);
    table(
      doc,
      ['', ...schemes.map((s) => s.name)],
      [
        ['Status', ...schemes.map((s) => STATUS[s.status] ?? s.status)],
        ['Plan revision designed', ...schemes.map((s) => (s.revision !== undefined ? String(s.revision) : '—'))],
        ['Steel weight, lb', ...schemes.map((s) => cell(s, (t) => int.format(t.steelWeight_lb)))],
        ['Steel weight, tons', ...schemes.map((s) => cell(s, (t) => one.format(t.steelWeight_lb / LB_PER_TON)))],
        ['Floor area, ft²', ...schemes.map((s) => cell(s, (t) => int.format(t.floorArea_ft2)))],
        ['Steel per floor area, psf', ...schemes.map((s) => cell(s, (t) => (t.steel_psf === null ? '—' : two.format(t.steel_psf))))],
        ['Pieces', ...schemes.map((s) => cell(s, (t) => int.format(t.pieces)))],
        ['Connections', ...schemes.map((s) => cell(s, (t) => int.format(t.connections)))],
        ['Estimated cost', ...schemes.map((s) => cell(s, (t) => (t.cost_usd === null ? 'not priced' : formatEstimateUsd(t.cost_usd))))],
        ['Members failing a check', ...schemes.map((s) => cell(s, () => int.format(s.failingMembers ?? 0)))],
      ],
      widths,
    );

    const base = baseSchemeOf(schemes);
    const others = schemes.filter((s) => s !== base && s.totals);
    if (base && base.totals && others.length > 0) {
      doc.font('Helvetica-Bold').fontSize(11).fillColor(INK).text(`Against ${base.name}${base.status === 'chosen' ? ' (chosen)' : ''}`);
      doc.moveDown(0.2);
      doc.font('Helvetica').fontSize(9.5);
      for (const s of others) {
        const d = tonnageDifference(base.totals, s.totals!);
        doc.text(`• ${describeDifference(s.name, base.name, d)}`, { width });
      }
      doc.moveDown(0.6);
    }

    for (const s of schemes) {
      if (!s.totals) continue;
      if (doc.y > doc.page.height - 160) doc.addPage();
      doc.font('Helvetica-Bold').fontSize(11).fillColor(INK).text(`${s.name}: by level and by kind`, MARGIN, doc.y);
      doc.moveDown(0.3);
      const rows = [
        ...(s.byLevel ?? []).map((l) => [l.levelName, int.format(l.steelWeight_lb), one.format(l.steelWeight_lb / LB_PER_TON), l.steel_psf === null ? '—' : two.format(l.steel_psf), int.format(l.pieces), int.format(l.connections), l.cost_usd === null ? '—' : formatEstimateUsd(l.cost_usd)]),
        ...(s.byKind ?? []).map((k) => [k.kind === 'girder' ? 'All girders' : k.kind === 'beam' ? 'All beams' : 'All columns', int.format(k.steelWeight_lb), one.format(k.steelWeight_lb / LB_PER_TON), k.steel_psf === null ? '—' : two.format(k.steel_psf), int.format(k.pieces), int.format(k.connections), k.cost_usd === null ? '—' : formatEstimateUsd(k.cost_usd)]),
      ];
      table(doc, ['', 'lb', 'tons', 'psf', 'pieces', 'connections', 'cost'], rows, [170, 90, 70, 70, 70, 80, 100]);
    }
  }

  // Footer on every page: date and caution again.
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    // Writing inside the bottom margin would start a new page; lift the margin for the footer.
    doc.page.margins.bottom = 0;
    doc.font('Helvetica').fontSize(7).fillColor(SOFT);
    doc.text(
      `Baywright tonnage comparison, ${c.project.name}, ${date}. Page ${i + 1} of ${range.count}. Results are an aid to a licensed engineer, who must check them; local codes and the engineer of record govern.`,
      MARGIN,
      doc.page.height - MARGIN + 12,
      { width, lineBreak: false },
    );
  }
  doc.end();
  return done;
}
