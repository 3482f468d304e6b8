/**
 * Text in any script the app accepts, on a pdfkit page. Text that the requested Barlow (or mono)
 * face prints entirely goes straight to pdfkit, unchanged. Other text is set here:
 *
 * 1. each character gets the first face that has a glyph for it: the requested face, then Noto Sans
 *    (Latin, Greek, Cyrillic), Noto Sans Hebrew, Noto Sans Arabic, then the CJK faces (Japanese
 *    first when the text has kana);
 * 2. lines are broken in logical order (after spaces, and between CJK characters);
 * 3. each line is put in visual order with the Unicode Bidirectional Algorithm (bidi-js, UAX #9);
 * 4. each right-to-left word goes to pdfkit whole and in logical order: fontkit shapes it (Arabic
 *    joining forms and ligatures) and lays its glyphs out right to left itself.
 *
 * Pieces in different faces share the requested face's baseline and line height.
 */
import bidiFactory from 'bidi-js';
import { fontFace, selectFont, type AnyFont, type SheetFont } from './fonts';

const bidi = bidiFactory();

export interface TextOptions {
  width?: number;
  align?: 'left' | 'right' | 'center';
  lineGap?: number;
  lineBreak?: boolean;
  ellipsis?: boolean;
  characterSpacing?: number;
}

const KANA = /[\u3040-\u30ff\u31f0-\u31ff\uff66-\uff9f]/u;
const CJK = /[\p{Script=Han}\p{Script=Hiragana}\p{Script=Katakana}\u3000-\u303f\uff00-\uffef]/u;
const STRONG_RTL = /[\p{Script=Hebrew}\p{Script=Arabic}]/u;
const SPACE = /\s/u;
const MARK = /\p{M}/u;

/** The faces tried for a character, in order, when `face` was asked for. */
export function fallbackChain(face: SheetFont, text: string): AnyFont[] {
  const bold = face === 'semibold' || face === 'bold';
  const cjk: AnyFont[] = KANA.test(text) ? ['jp', 'sc'] : ['sc', 'jp'];
  return [face, bold ? 'latinBold' : 'latin', bold ? 'hebrewBold' : 'hebrew', bold ? 'arabicBold' : 'arabic', ...cjk];
}

/** True when `face` alone prints every character of `text` (line breaks aside). */
export function printsPlain(face: SheetFont, text: string): boolean {
  const f = fontFace(face);
  for (const ch of text) {
    if (ch === '\n' || ch === '\r') continue;
    if (!f.hasGlyphForCodePoint(ch.codePointAt(0)!)) return false;
  }
  return true;
}

/**
 * Whether pdfkit can set `text` by itself: the face has every character and fontkit lays it out
 * without failing (measured first, so a failure never leaves half a text op on the page).
 */
function plain(doc: PDFKit.PDFDocument, face: SheetFont, size: number, text: string): boolean {
  if (!printsPlain(face, text)) return false;
  try {
    doc.font(face).fontSize(size).widthOfString(text, withFeatures(FACE_FEATURES[face]));
    return true;
  } catch {
    return false;
  }
}

/** The face each character is set in; null where no shipped face has the character. */
export function facesFor(face: SheetFont, text: string): { ch: string; font: AnyFont | null }[] {
  const chain = fallbackChain(face, text);
  const out: { ch: string; font: AnyFont | null }[] = [];
  for (const ch of text) {
    const cp = ch.codePointAt(0)!;
    const prev = out[out.length - 1]?.font ?? null;
    // A space or combining mark stays in the face of the character before it when that face has it.
    if (prev && (SPACE.test(ch) || MARK.test(ch)) && fontFace(prev).hasGlyphForCodePoint(cp)) {
      out.push({ ch, font: prev });
      continue;
    }
    out.push({ ch, font: chain.find((f) => fontFace(f).hasGlyphForCodePoint(cp)) ?? null });
  }
  return out;
}

interface Char {
  ch: string;
  font: AnyFont;
  /** UTF-16 offset in the whole text. */
  at: number;
  level: number;
}

export interface Piece {
  text: string;
  font: AnyFont;
  width: number;
  /** OpenType features to set this piece with (see `measured`). */
  features?: PDFKit.Mixins.OpenTypeFeatures[];
}

export interface Line {
  pieces: Piece[];
  width: number;
}

type Features = PDFKit.Mixins.OpenTypeFeatures[];
/** pdfkit hands an object straight to fontkit, which reads it as feature → on/off. */
const featureSwitches = (switches: Record<string, boolean>) => switches as unknown as Features;

/**
 * Features switched per face. JetBrains Mono's contextual alternates make fontkit 2.0.4 throw
 * ("Offset is outside the bounds of the DataView" for "--", "->", "=="), and a catalogue code should
 * print its characters as typed, not as programming ligatures: the mono face prints without them.
 */
const FACE_FEATURES: Partial<Record<AnyFont, Features>> = { mono: featureSwitches({ calt: false, liga: false, clig: false }) };

/**
 * The last resort when fontkit throws while shaping a run (it also fails in mark positioning for
 * some Arabic letters in Noto Sans Arabic, a null anchor, e.g. U+06A2 in final form): the run is set
 * again without mark positioning or contextual ligatures. Letters and dots still print, dots perhaps
 * a little off their ideal place, instead of the sheet failing.
 */
const SAFE_FEATURES = featureSwitches({ mark: false, mkmk: false, calt: false, liga: false, clig: false });

const withFeatures = (features: Features | undefined) => (features ? { features } : {});

function measured(doc: PDFKit.PDFDocument, font: AnyFont, size: number, text: string): { width: number; features?: Features } {
  const d = selectFont(doc, font).fontSize(size);
  const own = FACE_FEATURES[font];
  try {
    return { width: d.widthOfString(text, withFeatures(own)), features: own };
  } catch {
    return { width: d.widthOfString(text, { features: SAFE_FEATURES }), features: SAFE_FEATURES };
  }
}

function measure(doc: PDFKit.PDFDocument, font: AnyFont, size: number, text: string): number {
  return measured(doc, font, size, text).width;
}

/** Logical chars → runs of one face, measured. */
function widthOf(doc: PDFKit.PDFDocument, size: number, chars: readonly Char[]): number {
  let w = 0;
  let i = 0;
  while (i < chars.length) {
    let j = i + 1;
    while (j < chars.length && chars[j].font === chars[i].font) j++;
    w += measure(
      doc,
      chars[i].font,
      size,
      chars
        .slice(i, j)
        .map((c) => c.ch)
        .join(''),
    );
    i = j;
  }
  return w;
}

/** Break opportunities: after a space, before and after a CJK character, and at each line feed. */
function tokens(chars: readonly Char[]): Char[][] {
  const out: Char[][] = [];
  let cur: Char[] = [];
  // A combining mark belongs to the character before it: a break allowed after that character is
  // allowed after its marks instead.
  let base = '';
  chars.forEach((c, i) => {
    const next = chars[i + 1];
    if (c.ch === '\n') {
      out.push(cur, [c]);
      cur = [];
      base = '';
      return;
    }
    cur.push(c);
    if (!MARK.test(c.ch)) base = c.ch;
    const breakAfter = !next || SPACE.test(base) || CJK.test(base) || (next && CJK.test(next.ch) && !SPACE.test(next.ch));
    if (breakAfter && !(next && MARK.test(next.ch))) {
      out.push(cur);
      cur = [];
    }
  });
  if (cur.length) out.push(cur);
  return out.filter((t) => t.length);
}

/** Logical lines (each a slice of chars), broken greedily to `width`. */
function breakLines(doc: PDFKit.PDFDocument, size: number, chars: readonly Char[], width: number | undefined): Char[][] {
  const lines: Char[][] = [];
  let line: Char[] = [];
  let used = 0;
  const trimmed = (l: Char[]) => {
    let e = l.length;
    while (e > 0 && SPACE.test(l[e - 1].ch)) e--;
    return l.slice(0, e);
  };
  for (const tok of tokens(chars)) {
    if (tok[0].ch === '\n') {
      lines.push(line);
      line = [];
      used = 0;
      continue;
    }
    const w = widthOf(doc, size, tok);
    if (width !== undefined && line.length && used + widthOf(doc, size, trimmed(tok)) > width) {
      lines.push(line);
      line = [];
      used = 0;
      if (tok.every((c) => SPACE.test(c.ch))) continue;
    }
    line.push(...tok);
    used += w;
  }
  lines.push(line);
  return lines.map(trimmed);
}

/** One logical line → pieces in visual order (UAX #9 rule L2 through bidi-js). */
function visualPieces(doc: PDFKit.PDFDocument, size: number, text: string, line: readonly Char[]): Piece[] {
  if (!line.length) return [];
  const order = line.map((_, i) => i);
  const levels = bidi.getEmbeddingLevels(text);
  const first = line[0].at;
  const last = line[line.length - 1].at + line[line.length - 1].ch.length - 1;
  for (const [a, b] of bidi.getReorderSegments(text, levels, first, last)) {
    // Segments are UTF-16 offsets; reverse the chars whose offsets fall inside.
    const i = line.findIndex((c) => c.at >= a);
    let j = i;
    while (j + 1 < line.length && line[j + 1].at <= b) j++;
    if (i < 0 || j <= i) continue;
    const rev = order.slice(i, j + 1).reverse();
    order.splice(i, rev.length, ...rev);
  }
  const visual = order.map((k) => ({ ...line[k], level: levels.levels[line[k].at] }));
  const pieces: Piece[] = [];
  let k = 0;
  while (k < visual.length) {
    const start = visual[k];
    const odd = (start.level & 1) === 1;
    let e = k + 1;
    while (
      e < visual.length &&
      visual[e].font === start.font &&
      visual[e].level === start.level &&
      // Right-to-left text goes to pdfkit a word at a time: pdfkit lays words out left to right.
      !(odd && (SPACE.test(visual[e].ch) || SPACE.test(visual[e - 1].ch)))
    )
      e++;
    const chunk = visual.slice(k, e);
    let t: string;
    if (odd && chunk.some((c) => STRONG_RTL.test(c.ch))) {
      // Logical order: fontkit shapes the word and sets it right to left.
      t = [...chunk]
        .reverse()
        .map((c) => c.ch)
        .join('');
    } else if (odd) {
      // Neutral characters inside right-to-left text: already in visual order; brackets mirrored,
      // where the face has the mirrored glyph (U+2215 mirrors to U+29F5, which no shipped face has:
      // it is drawn unmirrored rather than as an empty box).
      t = chunk
        .map((c) => {
          const m = bidi.getMirroredCharacter(c.ch);
          return m && fontFace(c.font).hasGlyphForCodePoint(m.codePointAt(0)!) ? m : c.ch;
        })
        .join('');
    } else {
      t = chunk.map((c) => c.ch).join('');
    }
    pieces.push({ text: t, font: start.font, ...measured(doc, start.font, size, t) });
    k = e;
  }
  return pieces;
}

/** Lines of pieces in visual order, as writeText would set them (exported for the tests). */
export function layout(doc: PDFKit.PDFDocument, face: SheetFont, size: number, text: string, opts: TextOptions): Line[] {
  let at = 0;
  // Line breaks stay line breaks; a tab or carriage return is a space (no face draws them).
  const clean = text.replace(/\r\n?/g, '\n').replace(/[\t\r]/g, ' ');
  const chars: Char[] = facesFor(face, clean).map(({ ch, font }) => {
    // A character no shipped face has: the schemas refuse these; older data prints a visible marker.
    const c = ch === '\n' || font ? { ch, font: font ?? face, at, level: 0 } : { ch: '?', font: face, at, level: 0 };
    at += ch.length;
    return c;
  });
  const shown = chars.map((c) => c.ch).join('');
  const wrap = opts.lineBreak !== false ? opts.width : undefined;
  let lines = breakLines(doc, size, chars, wrap);
  if (opts.lineBreak === false) lines = lines.slice(0, 1);
  return lines.map((l) => {
    let pieces = visualPieces(doc, size, shown, l);
    let width = pieces.reduce((s, p) => s + p.width, 0);
    if (opts.ellipsis && opts.width !== undefined && width > opts.width) {
      let cut = l.length;
      while (cut > 0 && width > opts.width) {
        cut--;
        pieces = [...visualPieces(doc, size, shown, l.slice(0, cut)), { text: '…', font: face, width: measure(doc, face, size, '…') }];
        width = pieces.reduce((s, p) => s + p.width, 0);
      }
    }
    return { pieces, width };
  });
}

function lineHeight(doc: PDFKit.PDFDocument, face: SheetFont, size: number, lineGap: number): number {
  return selectFont(doc, face).fontSize(size).currentLineHeight(true) + lineGap;
}

/** The height `text` takes at `width` (what pdfkit's heightOfString gives for plain text). */
export function textHeight(doc: PDFKit.PDFDocument, face: SheetFont, size: number, text: string, width: number, lineGap = 1): number {
  if (plain(doc, face, size, text)) {
    doc.font(face).fontSize(size);
    return doc.heightOfString(text, { width, lineGap, ...withFeatures(FACE_FEATURES[face]) });
  }
  return layout(doc, face, size, text, { width, lineGap }).length * lineHeight(doc, face, size, lineGap);
}

/** The width of `text` on one line. */
export function textWidth(doc: PDFKit.PDFDocument, face: SheetFont, size: number, text: string): number {
  if (plain(doc, face, size, text)) return doc.font(face).fontSize(size).widthOfString(text, withFeatures(FACE_FEATURES[face]));
  return Math.max(0, ...layout(doc, face, size, text, { lineBreak: false }).map((l) => l.width));
}

/**
 * Writes `text` at (x, y) (y is the top of the first line, as in pdfkit) in the current fill colour.
 * Leaves `face` at `size` selected.
 */
export function writeText(
  doc: PDFKit.PDFDocument,
  face: SheetFont,
  size: number,
  text: string,
  x: number,
  y: number,
  opts: TextOptions = {},
): void {
  if (plain(doc, face, size, text)) {
    doc
      .font(face)
      .fontSize(size)
      .text(text, x, y, { ...opts, ...withFeatures(FACE_FEATURES[face]) });
    return;
  }
  const lineGap = opts.lineGap ?? 0;
  const lh = lineHeight(doc, face, size, lineGap);
  const ascent = (fontFace(face).ascent / fontFace(face).unitsPerEm) * size;
  layout(doc, face, size, text, opts).forEach((line, i) => {
    const room = opts.width ?? line.width;
    let cx = x + (opts.align === 'right' ? room - line.width : opts.align === 'center' ? (room - line.width) / 2 : 0);
    const baseline = y + i * lh + ascent;
    for (const p of line.pieces) {
      selectFont(doc, p.font)
        .fontSize(size)
        .text(p.text, cx, baseline, { lineBreak: false, baseline: 'alphabetic', ...(p.features ? { features: p.features } : {}) });
      cx += p.width;
    }
  });
  doc.font(face).fontSize(size);
}
