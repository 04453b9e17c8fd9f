// Reading an uploaded PDF's page count and page size on the server, with pdfjs-dist's
// legacy build (plain JavaScript for Node; no canvas needed to read structure). The file is
// never rendered here: the browser renders the chosen page. Scripting, eval and fonts stay off.
import { AppError } from '../errors/app-error';

/** More pages than this is a document set, not a plan sheet: refuse it (choose the sheet first). */
export const UNDERLAY_MAX_PDF_PAGES = 200;
/** A PDF that takes longer than this to open is refused rather than holding the server. */
const OPEN_TIMEOUT_MS = 15_000;

export interface PdfPageInfo {
  pageCount: number;
  pageNumber: number;
  /** Page size in PDF points (1/72 in) at scale 1, after the page's own rotation. */
  widthPt: number;
  heightPt: number;
}

type PdfJs = typeof import('pdfjs-dist/legacy/build/pdf.mjs');
let pdfjsPromise: Promise<PdfJs> | null = null;
const loadPdfJs = () => (pdfjsPromise ??= import('pdfjs-dist/legacy/build/pdf.mjs'));

function unprocessable(message: string, field: 'file' | 'page', fieldMessage = message): AppError {
  return new AppError(422, 'invalid_pdf', message, { fields: { [field]: fieldMessage } });
}

export function isPdf(buf: Buffer): boolean {
  return buf.toString('latin1', 0, 5) === '%PDF-';
}

/**
 * Opens the PDF and reads the page asked for (1-based). Refuses, with 422 naming the field:
 * a damaged file, a password-protected or otherwise encrypted one, no pages, more than
 * UNDERLAY_MAX_PDF_PAGES pages (file), a page out of range (page).
 */
export async function readPdfPage(buf: Buffer, pageNumber: number): Promise<PdfPageInfo> {
  const pdfjs = await loadPdfJs();
  const task = pdfjs.getDocument({
    data: new Uint8Array(buf), // a copy: pdfjs takes ownership of the bytes it is given
    isEvalSupported: false,
    disableFontFace: true,
    useSystemFonts: false,
    enableXfa: false,
    stopAtErrors: true,
    verbosity: 0,
  });
  let timer: ReturnType<typeof setTimeout> | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(unprocessable('The PDF took too long to open; it may be damaged. Save the drawing page as a new PDF and try again.', 'file')), OPEN_TIMEOUT_MS);
  });
  try {
    const doc = await Promise.race([task.promise, timeout]).catch((error: unknown) => {
      if (error instanceof AppError) throw error;
      const name = (error as { name?: string } | null)?.name;
      if (name === 'PasswordException') {
        throw unprocessable('The PDF is password-protected. Save an unprotected copy of the drawing and upload that.', 'file', 'Password-protected PDFs cannot be used');
      }
      throw unprocessable('The file starts like a PDF but could not be read; it may be damaged or incomplete.', 'file', 'Not a readable PDF');
    });
    const info = (await Promise.race([doc.getMetadata(), timeout]).catch(() => null)) as { info?: { EncryptFilterName?: string | null } } | null;
    if (info?.info?.EncryptFilterName) {
      throw unprocessable('The PDF is encrypted (it restricts what may be done with it). Save an unencrypted copy of the drawing and upload that.', 'file', 'Encrypted PDFs cannot be used');
    }
    const pageCount = doc.numPages;
    if (!Number.isInteger(pageCount) || pageCount < 1) throw unprocessable('The PDF has no pages.', 'file', 'The PDF has no pages');
    if (pageCount > UNDERLAY_MAX_PDF_PAGES) {
      throw unprocessable(
        `The PDF has ${pageCount} pages; at most ${UNDERLAY_MAX_PDF_PAGES} are accepted. Upload only the plan sheets you need.`,
        'file',
        `At most ${UNDERLAY_MAX_PDF_PAGES} pages`,
      );
    }
    if (!Number.isInteger(pageNumber) || pageNumber < 1 || pageNumber > pageCount) {
      throw unprocessable(`Page ${pageNumber} is not in this PDF, which has ${pageCount} page${pageCount === 1 ? '' : 's'}.`, 'page', `Choose a page from 1 to ${pageCount}`);
    }
    const page = await Promise.race([doc.getPage(pageNumber), timeout]).catch((error: unknown) => {
      if (error instanceof AppError) throw error;
      throw unprocessable(`Page ${pageNumber} of the PDF could not be read; it may be damaged.`, 'page', 'This page could not be read');
    });
    const viewport = page.getViewport({ scale: 1 });
    const widthPt = viewport.width;
    const heightPt = viewport.height;
    if (!(widthPt >= 1 && heightPt >= 1 && widthPt <= 14400 && heightPt <= 14400)) {
      throw unprocessable(`Page ${pageNumber} has an unusable size (${widthPt} × ${heightPt} pt).`, 'page', 'The page size is not usable');
    }
    return { pageCount, pageNumber, widthPt, heightPt };
  } finally {
    clearTimeout(timer);
    await task.destroy().catch(() => undefined);
  }
}
