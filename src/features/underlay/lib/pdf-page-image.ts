// A PDF underlay's page as an image: pdfjs-dist renders the chosen page in the browser to a
// canvas, which becomes an object URL that the plan canvas and the calibration dialog use
// exactly like an uploaded PNG. pdfjs and its worker load only when a PDF is shown; Vite
// serves the worker as an asset of the build (no CDN, nothing fetched from elsewhere).

/** The rendered page's longest side, px: sharp enough to trace, small enough for any canvas. */
export const PDF_RENDER_MAX_SIDE_PX = 4096;
/** At most this many device px per PDF point (4 = 288 dpi on the sheet). */
export const PDF_RENDER_MAX_SCALE = 4;

/** The render scale for a page of width × height points. */
export function pdfRenderScale(widthPt: number, heightPt: number): number {
  const longest = Math.max(widthPt, heightPt, 1);
  return Math.min(PDF_RENDER_MAX_SCALE, PDF_RENDER_MAX_SIDE_PX / longest);
}

type PdfJs = typeof import('pdfjs-dist');
let pdfjsPromise: Promise<PdfJs> | null = null;

async function loadPdfJs(): Promise<PdfJs> {
  pdfjsPromise ??= Promise.all([import('pdfjs-dist'), import('pdfjs-dist/build/pdf.worker.min.mjs?url')]).then(([pdfjs, worker]) => {
    pdfjs.GlobalWorkerOptions.workerSrc = worker.default;
    return pdfjs;
  });
  return pdfjsPromise;
}

const rendered = new Map<string, Promise<string>>();

/**
 * An object URL of `page` of the PDF at `fileUrl`, rendered once per file and page (the same
 * promise for every caller). Rejects with a message for people when the page cannot be drawn.
 */
export function pdfPageImageUrl(fileUrl: string, page: number): Promise<string> {
  const key = `${fileUrl}#${page}`;
  let url = rendered.get(key);
  if (!url) {
    url = renderPage(fileUrl, page);
    rendered.set(key, url);
    url.catch(() => rendered.delete(key));
  }
  return url;
}

async function renderPage(fileUrl: string, pageNumber: number): Promise<string> {
  const pdfjs = await loadPdfJs();
  const response = await fetch(fileUrl, { credentials: 'same-origin' });
  if (!response.ok) throw new Error(`The PDF could not be fetched (the server answered ${response.status}).`);
  const data = new Uint8Array(await response.arrayBuffer());
  const task = pdfjs.getDocument({ data, isEvalSupported: false, enableXfa: false });
  try {
    const doc = await task.promise;
    const page = await doc.getPage(pageNumber);
    const base = page.getViewport({ scale: 1 });
    const viewport = page.getViewport({ scale: pdfRenderScale(base.width, base.height) });
    const canvas = document.createElement('canvas');
    canvas.width = Math.max(1, Math.floor(viewport.width));
    canvas.height = Math.max(1, Math.floor(viewport.height));
    const context = canvas.getContext('2d');
    if (!context) throw new Error('This browser could not make a canvas to draw the PDF page on.');
    // White paper under the drawing: a PDF page is transparent where nothing is drawn.
    context.fillStyle = '#ffffff';
    context.fillRect(0, 0, canvas.width, canvas.height);
    await page.render({ canvasContext: context, canvas, viewport }).promise;
    const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/png'));
    if (!blob) throw new Error('The PDF page could not be turned into an image.');
    return URL.createObjectURL(blob);
  } finally {
    await task.destroy();
  }
}
