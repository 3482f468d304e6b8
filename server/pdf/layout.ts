/**
 * A small flowing-layout helper over pdfkit: a cursor `y`, page breaks we decide ourselves (pdfkit's
 * own would split a table row), headings, label/value grids and tables.
 *
 * Tagged PDF: given a structure root, every piece of text it writes becomes a structure element
 * (H1/H2/H3, P, Table/TR/TH/TD) in the order written, and rules and fills are marked as artifacts,
 * so a screen reader reads the sheet as a document. pdfkit closes any open structure content when an
 * artifact starts, so artifacts are only ever drawn outside `tag` closures.
 */
import type { SheetFont } from './fonts';
import { textHeight, writeText, type TextOptions } from './text-runs';

import { palette } from '../../shared/palette';

// The sheet's names for the one palette (shared/palette.ts), which the screens use too.
export const INK: string = palette.asphalt;
export const MUTED: string = palette.haze;
export const RULE: string = palette.rule;
export const RULE_SOFT: string = palette.ruleSoft;
export const GLASS: string = palette.glass;
export const GLASS_SOFT: string = palette.glassSoft;
export const BEACON: string = palette.beaconPressed;
export const BEACON_SOFT: string = palette.beaconSoft;
export const STOP: string = palette.stop;
export const PAPER: string = palette.card;

export interface Column {
  title: string;
  /** Fraction of the table width. */
  width: number;
  align?: 'left' | 'right';
  font?: SheetFont;
}

/** Structure element options pdfkit understands; `scope` marks a TH as heading its row or column. */
export interface StructOptions {
  title?: string;
  lang?: string;
  alt?: string;
  scope?: 'Row' | 'Column';
}
type StructArg = Parameters<PDFKit.PDFDocument['struct']>[1];

export class Flow {
  y: number;
  /** Open structure elements, innermost last; empty when the document is not tagged. */
  private readonly parents: PDFKit.PDFStructureElement[] = [];
  constructor(
    readonly doc: PDFKit.PDFDocument,
    private readonly onNewPage: (flow: Flow) => void,
    root?: PDFKit.PDFStructureElement,
  ) {
    this.y = doc.page.margins.top;
    if (root) this.parents.push(root);
  }

  /** What `draw` writes becomes one `type` element (P, H1, TD …) under the open element. */
  tag(type: string, draw: () => void, options: StructOptions = {}): void {
    const parent = this.parents[this.parents.length - 1];
    if (!parent) {
      draw();
      return;
    }
    // Added to an attached parent, the element runs `draw` at once, inside its marked content.
    parent.add(this.doc.struct(type, options as StructArg, draw));
  }

  /** A container element (Sect, Table, TR, L …): what `build` tags goes inside it. */
  group(type: string, build: () => void, options: StructOptions = {}): void {
    const parent = this.parents[this.parents.length - 1];
    if (!parent) {
      build();
      return;
    }
    const el = this.doc.struct(type, options as StructArg);
    parent.add(el);
    this.parents.push(el);
    try {
      build();
    } finally {
      this.parents.pop();
      el.end();
    }
  }

  /** Drawing that carries no content of its own (rules, fills, repeated headers): skipped by screen readers. */
  artifact(draw: () => void): void {
    if (!this.parents.length) {
      draw();
      return;
    }
    this.doc.markContent('Artifact');
    draw();
    this.doc.endMarkedContent();
  }

  get left(): number {
    return this.doc.page.margins.left;
  }
  get width(): number {
    return this.doc.page.width - this.doc.page.margins.left - this.doc.page.margins.right;
  }
  get bottom(): number {
    return this.doc.page.height - this.doc.page.margins.bottom;
  }
  get room(): number {
    return this.bottom - this.y;
  }

  newPage(): void {
    this.doc.addPage();
    this.y = this.doc.page.margins.top;
    this.onNewPage(this);
  }

  /** Starts a new page unless `height` points still fit on this one. */
  ensure(height: number): void {
    if (this.y + height > this.bottom) this.newPage();
  }

  gap(points: number): void {
    this.y += points;
  }

  style(font: SheetFont, size: number, color = INK): PDFKit.PDFDocument {
    return this.doc.font(font).fontSize(size).fillColor(color);
  }

  /** Text that may hold any script the app accepts (names, notes): see text-runs.ts. */
  write(font: SheetFont, size: number, color: string, text: string, x: number, y: number, opts: TextOptions = {}): void {
    this.doc.fillColor(color);
    writeText(this.doc, font, size, text, x, y, opts);
  }

  /** Heights already measured on this document, by font, size, width and text (tables measure each cell twice). */
  private readonly heights = new Map<string, number>();

  textHeight(text: string, font: SheetFont, size: number, width: number): number {
    const key = `${font}\u0000${size}\u0000${width}\u0000${text}`;
    const known = this.heights.get(key);
    if (known !== undefined) return known;
    const h = textHeight(this.doc, font, size, text, width, 1);
    this.heights.set(key, h);
    return h;
  }

  /** Text at the cursor across `width` (default the full width); moves the cursor below it. */
  paragraph(text: string, font: SheetFont = 'regular', size = 9.5, color = INK, opts: { x?: number; width?: number } = {}): void {
    const width = opts.width ?? this.width;
    const h = this.textHeight(text, font, size, width);
    this.ensure(h);
    this.tag('P', () => this.write(font, size, color, text, opts.x ?? this.left, this.y, { width, lineGap: 1 }));
    this.y += h;
  }

  heading(text: string, keepWith = 60, level: 'H1' | 'H2' | 'H3' = 'H2'): void {
    this.ensure(22 + keepWith);
    this.gap(6);
    this.tag(level, () => this.style('semibold', 12.5, INK).text(text, this.left, this.y, { width: this.width, lineBreak: false }));
    this.y += 17;
    this.artifact(() =>
      this.doc
        .moveTo(this.left, this.y)
        .lineTo(this.left + this.width, this.y)
        .lineWidth(0.6)
        .strokeColor(RULE)
        .stroke(),
    );
    this.y += 5;
  }

  /** Label/value rows in a block of `width` at `x`, starting at `y`; returns the height used. */
  rowsAt(rows: readonly (readonly [string, string])[], x: number, y: number, width: number, labelShare = 0.42): number {
    const lw = width * labelShare;
    const vw = width - lw - 6;
    let dy = 0;
    // A label/value grid is a two-column table to a screen reader: the label heads its row.
    this.group('Table', () => {
      for (const [label, value] of rows) {
        const h = Math.max(this.textHeight(label, 'regular', 8.5, lw), this.textHeight(value, 'medium', 9.5, vw)) + 4;
        this.group('TR', () => {
          this.tag('TH', () => this.write('regular', 8.5, MUTED, label, x, y + dy + 1, { width: lw, lineGap: 1 }), { scope: 'Row' });
          this.tag('TD', () => this.write('medium', 9.5, INK, value, x + lw + 6, y + dy, { width: vw, lineGap: 1 }));
        });
        dy += h;
        this.artifact(() =>
          this.doc
            .moveTo(x, y + dy - 2)
            .lineTo(x + width, y + dy - 2)
            .lineWidth(0.3)
            .strokeColor(RULE_SOFT)
            .stroke(),
        );
      }
    });
    return dy;
  }

  rowsHeight(rows: readonly (readonly [string, string])[], width: number, labelShare = 0.42): number {
    const lw = width * labelShare;
    const vw = width - lw - 6;
    return rows.reduce(
      (sum, [l, v]) => sum + Math.max(this.textHeight(l, 'regular', 8.5, lw), this.textHeight(v, 'medium', 9.5, vw)) + 4,
      0,
    );
  }

  /** Label/value rows across the full width. */
  rows(rows: readonly (readonly [string, string])[], labelShare = 0.42): void {
    this.ensure(this.rowsHeight(rows, this.width, labelShare));
    this.y += this.rowsAt(rows, this.left, this.y, this.width, labelShare);
  }

  /**
   * Label/value blocks one under the other, each with a small title. Not side by side: text
   * extraction (and so search and copy) reads side-by-side blocks line by line across both.
   */
  stackedBlocks(blocks: readonly { title: string; rows: readonly (readonly [string, string])[] }[], labelShare = 0.34): void {
    for (const block of blocks) {
      const h = this.rowsHeight(block.rows, this.width, labelShare) + 14;
      this.ensure(Math.min(h, 14 + 3 * 16));
      // Letters are not spaced out: extraction would read each letter as a word.
      this.tag('H3', () =>
        this.style('semibold', 8, GLASS).text(block.title.toUpperCase(), this.left, this.y, { width: this.width, lineBreak: false }),
      );
      this.y += 13;
      this.rows(block.rows, labelShare);
      this.y += 4;
    }
  }

  /** A table with a header row; rows never split across pages and the header repeats after a break. */
  table(columns: readonly Column[], rows: readonly (readonly string[])[], opts: { boldLast?: boolean } = {}): void {
    const widths = columns.map((c) => c.width * this.width);
    const pad = 3;
    const cellH = (text: string, i: number, font: SheetFont) => this.textHeight(text, font, 8.8, widths[i] - 2 * pad);
    /** The header row: tagged the first time, an artifact when repeated after a page break. */
    const header = (repeated: boolean) => {
      const h = Math.max(...columns.map((c, i) => cellH(c.title, i, 'semibold'))) + 2 * pad;
      this.artifact(() => this.doc.rect(this.left, this.y, this.width, h).fillColor(GLASS_SOFT).fill());
      const cells = () => {
        let x = this.left;
        columns.forEach((c, i) => {
          const cx = x;
          const draw = () =>
            this.style('semibold', 8.8, INK).text(c.title, cx + pad, this.y + pad, {
              width: widths[i] - 2 * pad,
              align: c.align ?? 'left',
              lineGap: 1,
            });
          if (repeated) draw();
          else this.tag('TH', draw, { scope: 'Column' });
          x += widths[i];
        });
      };
      if (repeated) this.artifact(cells);
      else this.group('TR', cells);
      this.y += h;
    };
    const headerH = Math.max(...columns.map((c, i) => cellH(c.title, i, 'semibold'))) + 2 * pad;
    const firstRowH = rows.length ? Math.max(...rows[0].map((t, i) => cellH(t, i, columns[i].font ?? 'regular'))) + 2 * pad : 0;
    this.ensure(headerH + firstRowH);
    this.group('Table', () => {
      header(false);
      rows.forEach((row, r) => {
        const last = opts.boldLast && r === rows.length - 1;
        const fontOf = (i: number): SheetFont => (last ? 'bold' : (columns[i].font ?? 'regular'));
        const h = Math.max(...row.map((t, i) => cellH(t, i, fontOf(i)))) + 2 * pad;
        if (this.y + h > this.bottom) {
          this.newPage();
          header(true);
        }
        this.group('TR', () => {
          let x = this.left;
          row.forEach((text, i) => {
            const cx = x;
            this.tag('TD', () =>
              this.write(fontOf(i), 8.8, INK, text, cx + pad, this.y + pad, {
                width: widths[i] - 2 * pad,
                align: columns[i].align ?? 'left',
                lineGap: 1,
              }),
            );
            x += widths[i];
          });
        });
        this.y += h;
        this.artifact(() =>
          this.doc
            .moveTo(this.left, this.y)
            .lineTo(this.left + this.width, this.y)
            .lineWidth(last ? 0.9 : 0.3)
            .strokeColor(last ? INK : RULE_SOFT)
            .stroke(),
        );
      });
    });
  }

  /** The height `table` would take for these rows, without a page break: to keep a block with the next. */
  tableHeight(columns: readonly Column[], rows: readonly (readonly string[])[], opts: { boldLast?: boolean } = {}): number {
    const widths = columns.map((c) => c.width * this.width);
    const pad = 3;
    const cellH = (text: string, i: number, font: SheetFont) => this.textHeight(text, font, 8.8, widths[i] - 2 * pad);
    const headerH = Math.max(...columns.map((c, i) => cellH(c.title, i, 'semibold'))) + 2 * pad;
    return rows.reduce((sum, row, r) => {
      const last = opts.boldLast && r === rows.length - 1;
      return sum + Math.max(...row.map((t, i) => cellH(t, i, last ? 'bold' : (columns[i].font ?? 'regular')))) + 2 * pad;
    }, headerH);
  }
}
