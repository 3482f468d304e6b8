import fs from 'node:fs';
import path from 'node:path';

/**
 * The shipped TTF files (fonts/, OFL), read once per process. pdfkit embeds only the glyphs a
 * document uses (a subset), so the sheet stays small. The built-in Helvetica is never used: it is
 * not embedded, and a sheet must print the same on every machine.
 */
export const SHEET_FONTS = {
  regular: 'Barlow-Regular.ttf',
  medium: 'Barlow-Medium.ttf',
  semibold: 'Barlow-SemiBold.ttf',
  bold: 'Barlow-Bold.ttf',
  mono: 'JetBrainsMono-Regular.ttf',
} as const;
export type SheetFont = keyof typeof SHEET_FONTS;

export const FONTS_DIR = path.resolve(__dirname, '..', '..', 'fonts');

let cache: Record<SheetFont, Buffer> | null = null;

export function sheetFontFiles(): Record<SheetFont, Buffer> {
  if (!cache) {
    const read = (f: string) => fs.readFileSync(path.join(FONTS_DIR, f));
    cache = {
      regular: read(SHEET_FONTS.regular),
      medium: read(SHEET_FONTS.medium),
      semibold: read(SHEET_FONTS.semibold),
      bold: read(SHEET_FONTS.bold),
      mono: read(SHEET_FONTS.mono),
    };
  }
  return cache;
}

/**
 * The `font` option for `new PDFDocument`: none. Left unset, pdfkit would load Helvetica (and list it
 * in the file); given a path, it loads that face under the path's name, and then every later
 * `doc.font('regular')` parses the same TTF again, because pdfkit caches a registered name only when
 * no face with the same PostScript name is open yet (measured: most of the render time went there).
 * An empty string makes pdfkit open nothing; `registerSheetFonts` then selects the regular face.
 */
export const NO_DEFAULT_FONT = '';

/**
 * Registers the sheet's fonts on a document under the names in SHEET_FONTS' keys and selects
 * 'regular'. Each face is parsed once per document, on its first use; a face never used is neither
 * parsed nor embedded.
 */
export function registerSheetFonts(doc: PDFKit.PDFDocument): void {
  const files = sheetFontFiles();
  for (const name of Object.keys(files) as SheetFont[]) doc.registerFont(name, files[name]);
  doc.font('regular');
}
