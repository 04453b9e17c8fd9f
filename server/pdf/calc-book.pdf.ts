import PDFDocument from 'pdfkit';
import { cellText, type CalcBlock, type CalcBook, type CalcCell, type CalcColumn } from '../../shared/report/calc-book.report';
import { sheetFonts } from './sheet-fonts.pdf';

// Lays out a calc book document model (shared/report) on US Letter portrait pages: the app's
// own fonts (Inter for text, JetBrains Mono for numbers so columns of figures line up),
// tables that carry their header onto the next page, and a footer on every page with the
// running title, "page n of N" and the caution.

const MARGIN = 50;
const FOOTER_H = 30;
const INK = '#111111';
const SOFT = '#555555';
const RULE = '#999999';
const SIZE = 8.5;

type Doc = PDFKit.PDFDocument;

const bottom = (doc: Doc) => doc.page.height - MARGIN - FOOTER_H;
const width = (doc: Doc) => doc.page.width - 2 * MARGIN;

function ensure(doc: Doc, h: number): void {
  if (doc.y + h > bottom(doc)) {
    doc.addPage();
    doc.x = MARGIN;
    doc.y = MARGIN;
  }
}

const isNumber = (c: CalcCell) => c !== null && typeof c !== 'string';

function cellFont(c: CalcCell, bold = false): string {
  if (isNumber(c)) return bold ? 'mono-bold' : 'mono';
  return bold ? 'sans-bold' : 'sans';
}

function drawTable(doc: Doc, columns: CalcColumn[], rows: CalcCell[][], caption?: string): void {
  const total = columns.reduce((s, c) => s + c.weight, 0);
  const widths = columns.map((c) => (c.weight / total) * width(doc));
  const pad = 3;
  const heightOf = (cells: CalcCell[], bold: boolean) =>
    Math.max(
      ...cells.map((c, i) => {
        doc.font(cellFont(c, bold)).fontSize(SIZE);
        return doc.heightOfString(cellText(c), { width: widths[i] - 2 * pad });
      }),
    ) +
    2 * pad;
  const drawRow = (cells: CalcCell[], header: boolean) => {
    const h = heightOf(cells, header);
    let x = MARGIN;
    const y = doc.y;
    cells.forEach((c, i) => {
      const align = columns[i]?.align ?? 'left';
      doc.font(header ? 'sans-bold' : cellFont(c)).fontSize(SIZE).fillColor(header ? INK : c === null ? SOFT : INK);
      doc.text(cellText(c), x + pad, y + pad, { width: widths[i] - 2 * pad, align });
      x += widths[i];
    });
    doc
      .moveTo(MARGIN, y + h)
      .lineTo(MARGIN + width(doc), y + h)
      .lineWidth(header ? 0.8 : 0.3)
      .strokeColor(header ? INK : RULE)
      .stroke();
    doc.x = MARGIN;
    doc.y = y + h;
  };
  const header = columns.map((c) => c.label);
  const headerH = heightOf(header, true);
  if (caption) {
    ensure(doc, 14 + headerH + 16);
    doc.font('sans-bold').fontSize(SIZE + 0.5).fillColor(INK).text(caption, MARGIN, doc.y, { width: width(doc) });
    doc.moveDown(0.2);
  }
  ensure(doc, headerH + (rows[0] ? heightOf(rows[0], false) : 0));
  drawRow(header, true);
  for (const r of rows) {
    const h = heightOf(r, false);
    if (doc.y + h > bottom(doc)) {
      doc.addPage();
      doc.y = MARGIN;
      drawRow(header, true);
    }
    drawRow(r, false);
  }
  if (rows.length === 0) {
    doc.font('sans').fontSize(SIZE).fillColor(SOFT).text('None.', MARGIN + pad, doc.y + pad);
  }
  doc.x = MARGIN;
  doc.y += 8;
}

function drawFields(doc: Doc, rows: [string, CalcCell][]): void {
  const labelW = width(doc) * 0.38;
  const valueW = width(doc) - labelW;
  for (const [label, value] of rows) {
    doc.font(cellFont(value)).fontSize(SIZE + 0.5);
    const h = Math.max(doc.heightOfString(cellText(value), { width: valueW }), doc.font('sans').heightOfString(label, { width: labelW - 8 })) + 3;
    ensure(doc, h);
    const y = doc.y;
    doc.font('sans').fontSize(SIZE + 0.5).fillColor(SOFT).text(label, MARGIN, y, { width: labelW - 8 });
    doc.font(cellFont(value)).fillColor(INK).text(cellText(value), MARGIN + labelW, y, { width: valueW });
    doc.x = MARGIN;
    doc.y = y + h;
  }
  doc.y += 6;
}

function drawCaution(doc: Doc, text: string): void {
  doc.font('sans-bold').fontSize(9.5);
  const h = doc.heightOfString(text, { width: width(doc) - 16 }) + 12;
  ensure(doc, h);
  const top = doc.y;
  doc.fillColor(INK).text(text, MARGIN + 8, top + 6, { width: width(doc) - 16 });
  doc.rect(MARGIN, top, width(doc), h).lineWidth(1).strokeColor(INK).stroke();
  doc.x = MARGIN;
  doc.y = top + h + 8;
}

function drawBlock(doc: Doc, b: CalcBlock): void {
  switch (b.type) {
    case 'heading':
      ensure(doc, 40);
      doc.font('sans-bold').fontSize(11).fillColor(INK).text(b.text, MARGIN, doc.y, { width: width(doc) });
      doc.moveDown(0.3);
      return;
    case 'paragraph':
      doc.font(b.tone === 'strong' ? 'sans-bold' : 'sans').fontSize(b.tone === 'soft' ? SIZE : SIZE + 0.5);
      ensure(doc, doc.heightOfString(b.text, { width: width(doc) }));
      doc.fillColor(b.tone === 'soft' ? SOFT : INK).text(b.text, MARGIN, doc.y, { width: width(doc) });
      doc.moveDown(0.5);
      return;
    case 'caution':
      drawCaution(doc, b.text);
      return;
    case 'list':
      for (const item of b.items) {
        doc.font('sans').fontSize(SIZE + 0.5);
        ensure(doc, doc.heightOfString(item, { width: width(doc) - 12 }) + 2);
        const y = doc.y;
        doc.fillColor(INK).text('•', MARGIN, y).text(item, MARGIN + 12, y, { width: width(doc) - 12 });
        doc.y += 2;
      }
      doc.x = MARGIN;
      doc.moveDown(0.4);
      return;
    case 'fields':
      drawFields(doc, b.rows);
      return;
    case 'table':
      drawTable(doc, b.columns, b.rows, b.caption);
      return;
  }
}

export function renderCalcBookPdf(book: CalcBook, info: { author: string }): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'LETTER',
    layout: 'portrait',
    margin: MARGIN,
    bufferPages: true,
    info: { Title: book.title, Author: info.author, Subject: book.caution, Creator: 'Baywright', Producer: 'Baywright' },
  });
  for (const f of sheetFonts()) {
    if (f.data) doc.registerFont(f.font, f.data);
    else doc.registerFont(f.font, f.standard);
  }
  const chunks: Buffer[] = [];
  doc.on('data', (b: Buffer) => chunks.push(b));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  book.sections.forEach((s, i) => {
    if (i > 0 && s.pageBreakBefore) {
      doc.addPage();
      doc.y = MARGIN;
    }
    if (i === 0) {
      doc.font('sans-bold').fontSize(22).fillColor(INK).text(s.title, MARGIN, MARGIN + 40, { width: width(doc) });
      doc.moveDown(0.4);
    } else {
      ensure(doc, 80);
      doc.x = MARGIN;
      const y = doc.y;
      doc.font('sans-bold').fontSize(s.memberId ? 12 : 14).fillColor(INK).text(s.title, MARGIN, y, { width: width(doc) });
      doc
        .moveTo(MARGIN, doc.y + 1)
        .lineTo(MARGIN + width(doc), doc.y + 1)
        .lineWidth(s.memberId ? 0.6 : 1.2)
        .strokeColor(INK)
        .stroke();
      doc.y += 6;
    }
    for (const b of s.blocks) drawBlock(doc, b);
    doc.moveDown(0.6);
  });

  // Footer on every page: running title, page n of N, the caution.
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    // Writing inside the bottom margin would start a new page; lift the margin for the footer.
    doc.page.margins.bottom = 0;
    const y = doc.page.height - MARGIN - FOOTER_H + 8;
    doc.moveTo(MARGIN, y - 4).lineTo(MARGIN + width(doc), y - 4).lineWidth(0.5).strokeColor(RULE).stroke();
    doc.font('sans').fontSize(7).fillColor(SOFT);
    doc.text(book.runningTitle, MARGIN, y, { width: width(doc) - 80, lineBreak: false, ellipsis: true });
    doc.font('mono').text(`page ${i + 1 - range.start} of ${range.count}`, MARGIN + width(doc) - 80, y, { width: 80, align: 'right', lineBreak: false });
    doc.font('sans').fillColor(INK).text(book.caution, MARGIN, y + 10, { width: width(doc), lineBreak: false, ellipsis: true });
  }
  doc.end();
  return done;
}
