import PDFDocument from 'pdfkit';

// PDFs for the underlay tests, written by pdfkit in the test run (no stored binaries).

export interface TestPdfOptions {
  /** Page sizes in points (1/72 in); one entry per page. */
  pages?: [number, number][];
  userPassword?: string;
  ownerPassword?: string;
}

/** A PDF with a grid drawn on each page and "Sheet n" written on it. */
export function testPdf(options: TestPdfOptions = {}): Promise<Buffer> {
  const pages = options.pages ?? [[1224, 792]];
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({
      autoFirstPage: false,
      compress: false,
      ...(options.userPassword || options.ownerPassword ? { userPassword: options.userPassword, ownerPassword: options.ownerPassword ?? 'owner', pdfVersion: '1.7' as const } : {}),
    });
    const parts: Buffer[] = [];
    doc.on('data', (c: Buffer) => parts.push(c));
    doc.on('end', () => resolve(Buffer.concat(parts)));
    doc.on('error', reject);
    pages.forEach(([w, h], i) => {
      doc.addPage({ size: [w, h], margin: 0 });
      doc.lineWidth(2).strokeColor('#000000');
      for (let x = 72; x < w; x += 144) doc.moveTo(x, 36).lineTo(x, h - 36).stroke();
      for (let y = 72; y < h; y += 144) doc.moveTo(36, y).lineTo(w - 36, y).stroke();
      doc.fontSize(24).fillColor('#000000').text(`Sheet ${i + 1}`, 40, 40);
    });
    doc.end();
  });
}

/** `count` letter pages, no drawing (for the page-count limit). */
export function manyPagePdf(count: number): Promise<Buffer> {
  return testPdf({ pages: Array.from({ length: count }, () => [612, 792] as [number, number]) });
}
