import PDFDocument from 'pdfkit';
import type { SheetDocument, SheetPrimitive, SheetTone, SheetFill } from '../../shared/drafting/sheet-primitives.drafting';
import { sheetFonts } from './sheet-fonts.pdf';

// Draws sheet documents (shared/drafting) into one PDF, a page per sheet, at the sheet's own
// size in points. The in-app SVG draws the same primitives (src/features/plan-sheet).

const INK = '#000000';
const SOFT = '#5a5f64';
const PAPER = '#ffffff';

const toneColour = (tone: SheetTone | undefined) => (tone === 'soft' ? SOFT : INK);
const fillColour = (fill: SheetFill) => (fill === 'ink' ? INK : PAPER);

export interface PdfInfo {
  title: string;
  author: string;
  subject?: string;
}

function draw(doc: PDFKit.PDFDocument, p: SheetPrimitive): void {
  switch (p.type) {
    case 'line': {
      doc.save().lineWidth(p.weight).strokeColor(toneColour(p.tone)).lineCap('butt');
      // pdfkit takes a whole dash array at run time; its typings only declare a number.
      if (p.dash) doc.dash(p.dash as unknown as number, {});
      doc.moveTo(p.x1, p.y1).lineTo(p.x2, p.y2).stroke().restore();
      return;
    }
    case 'polygon': {
      doc.save().lineWidth(p.weight).strokeColor(toneColour(p.tone));
      p.points.forEach(([x, y], i) => (i === 0 ? doc.moveTo(x, y) : doc.lineTo(x, y)));
      if (p.closed) doc.closePath();
      if (p.fill === 'none') doc.stroke();
      else doc.fillColor(fillColour(p.fill)).fillAndStroke();
      doc.restore();
      return;
    }
    case 'circle': {
      doc.save().lineWidth(p.weight).strokeColor(toneColour(p.tone)).circle(p.cx, p.cy, p.r);
      if (p.fill === 'none') doc.stroke();
      else doc.fillColor(fillColour(p.fill)).fillAndStroke();
      doc.restore();
      return;
    }
    case 'rect': {
      doc.save().lineWidth(p.weight).strokeColor(toneColour(p.tone)).rect(p.x, p.y, p.w, p.h);
      if (p.fill === 'none') doc.stroke();
      else doc.fillColor(fillColour(p.fill)).fillAndStroke();
      doc.restore();
      return;
    }
    case 'text': {
      doc.save().font(p.font).fontSize(p.size).fillColor(toneColour(p.tone));
      if (p.rotate) doc.rotate(p.rotate, { origin: [p.x, p.y] });
      const width = doc.widthOfString(p.text);
      const x = p.anchor === 'middle' ? p.x - width / 2 : p.anchor === 'end' ? p.x - width : p.x;
      doc.text(p.text, x, p.y, { lineBreak: false, baseline: 'alphabetic' });
      doc.restore();
      return;
    }
  }
}

/** One PDF with a page per sheet. */
export function renderSheetsPdf(sheets: readonly SheetDocument[], info: PdfInfo): Promise<Buffer> {
  const doc = new PDFDocument({
    size: sheets.length > 0 ? [sheets[0].width_pt, sheets[0].height_pt] : 'TABLOID',
    margin: 0,
    autoFirstPage: false,
    info: { Title: info.title, Author: info.author, Subject: info.subject ?? '', Creator: 'Baywright', Producer: 'Baywright' },
  });
  for (const f of sheetFonts()) {
    if (f.data) doc.registerFont(f.font, f.data);
    else doc.registerFont(f.font, f.standard);
  }
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  for (const sheet of sheets) {
    doc.addPage({ size: [sheet.width_pt, sheet.height_pt], margin: 0 });
    for (const p of sheet.primitives) draw(doc, p);
  }
  if (sheets.length === 0) doc.addPage();
  doc.end();
  return done;
}
