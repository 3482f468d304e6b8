/**
 * A PDF plan's page drawn to a PNG, in a worker thread (pdf-pool.ts): pdfjs-dist reads the PDF and
 * @napi-rs/canvas (a prebuilt package, no system tools) draws it. Guards before any drawing: the
 * page count, and the page's size in inches (a 200 in square page is allowed by PDF, not by us).
 * The drawing's own time is bounded by the pool, which terminates this thread past its budget.
 */
import path from 'node:path';
import { createCanvas } from '@napi-rs/canvas';
import { FILE_LIMITS } from '../../shared/schemas/files';

export interface RasteriseTask {
  data: Uint8Array;
  /** 1-based page to draw. */
  page: number;
}

export type RasteriseResult =
  | { ok: true; png: Uint8Array; widthPx: number; heightPx: number; pages: number }
  | { ok: false; problem: 'unreadable' | 'pages' | 'pageMissing' | 'pageSize'; pages?: number };

/** Points per inch (PDF user space). */
const PT_PER_IN = 72;
/** The most detail a plan page is drawn at, dots per inch (fewer when the longest side would pass the stored limit). */
const MAX_DPI = 200;

type PdfJs = typeof import('pdfjs-dist/legacy/build/pdf.mjs');
let pdfjs: Promise<PdfJs> | undefined;
// pdfjs-dist is an ES module; this thread is plain Node (tsx's CommonJS hook), where import() loads it.
const loadPdfJs = () => (pdfjs ??= import('pdfjs-dist/legacy/build/pdf.mjs'));

export async function rasterise(task: RasteriseTask): Promise<RasteriseResult> {
  const lib = await loadPdfJs();
  const standardFontDataUrl = path.join(path.dirname(require.resolve('pdfjs-dist/package.json')), 'standard_fonts') + path.sep;
  const loading = lib.getDocument({
    data: task.data,
    isEvalSupported: false,
    disableFontFace: true,
    useSystemFonts: false,
    standardFontDataUrl,
    verbosity: 0,
  });
  let doc;
  try {
    doc = await loading.promise;
  } catch {
    await loading.destroy();
    return { ok: false, problem: 'unreadable' };
  }
  try {
    const pages = doc.numPages;
    if (pages > FILE_LIMITS.pdfPages) return { ok: false, problem: 'pages', pages };
    if (task.page > pages) return { ok: false, problem: 'pageMissing', pages };
    const page = await doc.getPage(task.page);
    // The viewport at scale 1 is in points, the page's UserUnit and /Rotate applied.
    const unit = page.getViewport({ scale: 1 });
    const longestIn = Math.max(unit.width, unit.height) / PT_PER_IN;
    if (!(longestIn > 0) || longestIn > FILE_LIMITS.pdfPageSideIn) return { ok: false, problem: 'pageSize', pages };
    const scale = Math.min(MAX_DPI / PT_PER_IN, FILE_LIMITS.storedSidePx / Math.max(unit.width, unit.height));
    const viewport = page.getViewport({ scale });
    const widthPx = Math.max(1, Math.floor(viewport.width));
    const heightPx = Math.max(1, Math.floor(viewport.height));
    const canvas = createCanvas(widthPx, heightPx);
    const context = canvas.getContext('2d');
    // A plan on white paper, as it would print (a PDF page has no background of its own).
    context.fillStyle = '#ffffff';
    context.fillRect(0, 0, widthPx, heightPx);
    // pdfjs-dist types its canvas as the DOM's; @napi-rs/canvas is the same drawing API in Node.
    await page.render({ canvasContext: context as never, canvas: canvas as never, viewport }).promise;
    const png = await canvas.encode('png');
    return { ok: true, png: new Uint8Array(png.buffer, png.byteOffset, png.byteLength), widthPx, heightPx, pages };
  } catch {
    return { ok: false, problem: 'unreadable' };
  } finally {
    await doc.destroy();
  }
}
