import { PDFParse } from 'pdf-parse';
import type { Response } from 'supertest';

/** supertest parser that keeps a response body as raw bytes (PDF downloads). */
export const binary = (res: Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

/** The text of each page of a PDF, extracted with pdf-parse. */
export async function pdfPages(body: Buffer): Promise<string[]> {
  const parser = new PDFParse({ data: new Uint8Array(body) });
  const { pages } = await parser.getText();
  await parser.destroy();
  return pages.map((p) => p.text);
}
