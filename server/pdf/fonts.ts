import fs from 'node:fs';
import path from 'node:path';
import * as fontkit from 'fontkit';

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

/**
 * Faces for the scripts Barlow lacks, used per text run (text-runs.ts). One weight of the CJK faces
 * only (each is megabytes): bold Chinese or Japanese prints in the regular weight.
 */
export const FALLBACK_FONTS = {
  latin: 'NotoSans-Regular.ttf',
  latinBold: 'NotoSans-Bold.ttf',
  hebrew: 'NotoSansHebrew-Regular.ttf',
  hebrewBold: 'NotoSansHebrew-Bold.ttf',
  arabic: 'NotoSansArabic-Regular.ttf',
  arabicBold: 'NotoSansArabic-Bold.ttf',
  jp: 'NotoSansJP-Regular.ttf',
  sc: 'NotoSansSC-Regular.ttf',
} as const;
export type FallbackFont = keyof typeof FALLBACK_FONTS;
export type AnyFont = SheetFont | FallbackFont;
export const ALL_FONTS: Record<AnyFont, string> = { ...SHEET_FONTS, ...FALLBACK_FONTS };

export const FONTS_DIR = path.resolve(__dirname, '..', '..', 'fonts');

const files = new Map<AnyFont, Buffer>();

/** One face's file, read once per process (each worker thread reads its own). */
export function fontFile(name: AnyFont): Buffer {
  let buf = files.get(name);
  if (!buf) {
    buf = fs.readFileSync(path.join(FONTS_DIR, ALL_FONTS[name]));
    files.set(name, buf);
  }
  return buf;
}

export function sheetFontFiles(): Record<SheetFont, Buffer> {
  return {
    regular: fontFile('regular'),
    medium: fontFile('medium'),
    semibold: fontFile('semibold'),
    bold: fontFile('bold'),
    mono: fontFile('mono'),
  };
}

const parsed = new Map<AnyFont, fontkit.Font>();

/** A face parsed by fontkit (the parser pdfkit uses), to ask which characters it has a glyph for. */
export function fontFace(name: AnyFont): fontkit.Font {
  let face = parsed.get(name);
  if (!face) {
    face = fontkit.create(fontFile(name)) as fontkit.Font;
    parsed.set(name, face);
  }
  return face;
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

const registered = new WeakMap<PDFKit.PDFDocument, Set<AnyFont>>();

/**
 * Selects a face on a document, registering a fallback face first if this document has not used it
 * yet: a fallback file (megabytes for CJK) is read only by the first sheet that needs it.
 */
export function selectFont(doc: PDFKit.PDFDocument, name: AnyFont): PDFKit.PDFDocument {
  if (name in FALLBACK_FONTS) {
    let set = registered.get(doc);
    if (!set) registered.set(doc, (set = new Set()));
    if (!set.has(name)) {
      doc.registerFont(name, fontFile(name));
      set.add(name);
    }
  }
  return doc.font(name);
}
