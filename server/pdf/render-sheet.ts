/**
 * Draws a SheetContent as a PDF with pdfkit. The same content and revision give the same bytes:
 * the metadata dates come from the revision's issue time (pdfkit would otherwise stamp "now"), and
 * pdfkit derives the trailer's file /ID from those metadata, so it is fixed too.
 */
import PDFDocument from 'pdfkit';
import type { SheetPaper } from '../../shared/schemas';
import { SHEET_LIMITS } from './cautions';
import { drawElevation, drawOriginMark, drawPlan, drawScaleBar, fitPlan, hatch, scaleBarFor, type SheetImages } from './draw-plan';
import { COVERED_FROM_PERCENT, PARTLY_FROM_PERCENT, bandColours, bandWords } from '../../shared/zone-verdict';
import { NO_DEFAULT_FONT, registerSheetFonts } from './fonts';
import { textWidth, writeText } from './text-runs';
import { BEACON, BEACON_SOFT, Flow, GLASS, INK, MUTED, PAPER, RULE, STOP, type Column } from './layout';
import { MOUNT_HEIGHT_LABEL, sheetFormat, type SheetContent, type SheetPlacement } from './sheet-model';
import { vehiclePages, vehicleSummaryBlock } from './vehicle-sheet';
import { drawApproval, drawNotApprovedBand, type SheetApproval } from './approval-mark';

export interface SheetRevisionInfo {
  number: number;
  contentHash: string;
  issuedAt: Date;
}

export const PAPER_SIZES: Record<SheetPaper, { name: string; pdfkit: string }> = {
  a4: { name: 'A4', pdfkit: 'A4' },
  letter: { name: 'US Letter', pdfkit: 'LETTER' },
};

export const defaultPaper = (units: SheetContent['units']): SheetPaper => (units === 'imperial' ? 'letter' : 'a4');

/** "2026-12-02" in UTC, so the printed date does not depend on the server's time zone. */
export const issueDate = (d: Date) => d.toISOString().slice(0, 10);
export const shortHash = (hash: string) => hash.slice(0, 12);

function collect(doc: PDFKit.PDFDocument): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
}

/** The height `cautionBox` takes, gap included. */
function cautionBoxHeight(flow: Flow, cautions: readonly string[], size = 9): number {
  const textW = flow.width - 2 * 8 - 14;
  return 2 * 8 + 14 + cautions.reduce((sum, c) => sum + flow.textHeight(c, 'regular', size, textW) + 3, 0) + 10;
}

/** The side view in words, for a screen reader. */
function elevationAlt(el: NonNullable<SheetPlacement['elevation']>, f: ReturnType<typeof sheetFormat>): string {
  return `Side view: the viewer's eye ${f.dist(el.eye.heightM)} high and ${f.dist(el.eye.distanceM)} from the mirror, the mirror ${f.dist(el.mirrorHeightM)} high, floor seen ${el.rangeCapped ? 'drawn to' : 'to where a standing adult is still recognised,'} ${f.range(el.rangeM)}.`;
}

function cautionBox(flow: Flow, cautions: readonly string[], title: string, size = 9): void {
  const doc = flow.doc;
  const pad = 8;
  const textW = flow.width - 2 * pad - 14;
  const heights = cautions.map((c) => flow.textHeight(c, 'regular', size, textW) + 3);
  const h = 2 * pad + 14 + heights.reduce((a, b) => a + b, 0);
  flow.ensure(h + 4);
  flow.artifact(() => {
    doc.rect(flow.left, flow.y, flow.width, h).fillColor(BEACON_SOFT).fill();
    doc.rect(flow.left, flow.y, 3, h).fillColor(BEACON).fill();
  });
  let y = flow.y + pad;
  flow.tag('H2', () => flow.style('semibold', 9.5, INK).text(title, flow.left + pad + 2, y, { lineBreak: false }));
  y += 14;
  // A numbered list to a screen reader: label and body of each item.
  flow.group('L', () =>
    cautions.forEach((c, i) => {
      flow.group('LI', () => {
        flow.tag('Lbl', () => flow.style('bold', size, INK).text(`${i + 1}`, flow.left + pad + 2, y, { lineBreak: false }));
        flow.tag('LBody', () => flow.style('regular', size, INK).text(c, flow.left + pad + 16, y, { width: textW, lineGap: 1 }));
      });
      y += heights[i];
    }),
  );
  flow.y += h + 6;
}

/**
 * An e-mail address as lines that break only before "@" or a dot, never at a hyphen (a reader would
 * copy "sightfan-" and "demo.example" as two words, and extraction drops the hyphen). A part longer
 * than the width stays whole on its own line.
 */
export function addressLines(address: string, width: number, measure: (text: string) => number): string[] {
  const parts = address.split(/(?=[@.])/);
  const lines: string[] = [];
  for (const part of parts) {
    const last = lines.length - 1;
    if (last >= 0 && measure(lines[last] + part) <= width) lines[last] += part;
    else lines.push(part);
  }
  return lines;
}

function headerBlock(flow: Flow, content: SheetContent, rev: SheetRevisionInfo, paperName: string): void {
  const doc = flow.doc;
  // Letters are not spaced out: extraction would read each letter as a word and "specification" could not be found.
  flow.tag('P', () =>
    flow.style('semibold', 8.5, GLASS).text('SIGHTFAN  ·  MIRROR SPECIFICATION SHEET', flow.left, flow.y, { lineBreak: false }),
  );
  flow.y += 14;
  const titleH = flow.textHeight(content.project.name, 'bold', 19, flow.width);
  flow.tag('H1', () => flow.write('bold', 19, INK, content.project.name, flow.left, flow.y, { width: flow.width, lineGap: 1 }));
  flow.y += titleH;
  flow.gap(6);
  const colW = (flow.width - 18) / 2;
  const left: [string, string][] = [
    ['Customer', content.project.customer || 'not stated'],
    ['Site', content.project.site || 'not stated'],
    ['Installer', `${content.installer.name}, ${content.installer.organization}`],
  ];
  const right: [string, string][] = [
    ['Revision', `${rev.number}`],
    ['Issued', issueDate(rev.issuedAt)],
    ['Content hash', shortHash(rev.contentHash)],
    ['Units · paper', `${content.units} · ${paperName}`],
  ];
  const h = Math.max(flow.rowsHeight(left, colW, 0.34), flow.rowsHeight(right, colW, 0.34));
  flow.rowsAt(left, flow.left, flow.y, colW, 0.34);
  flow.rowsAt(right, flow.left + colW + 18, flow.y, colW, 0.34);
  flow.y += h;
  // The address across the full width, broken (if at all) only before "@" or a dot.
  const labelW = colW * 0.34;
  const valueW = flow.width - labelW - 6;
  const address = addressLines(content.installer.email, valueW, (t) => textWidth(doc, 'medium', 9.5, t)).join('\n');
  flow.y += flow.rowsAt([['Installer e-mail', address]], flow.left, flow.y, labelW + 6 + valueW, labelW / (labelW + 6 + valueW));
  flow.y += 4;
  flow.artifact(() =>
    doc
      .moveTo(flow.left, flow.y)
      .lineTo(flow.left + flow.width, flow.y)
      .lineWidth(1.2)
      .strokeColor(INK)
      .stroke(),
  );
  flow.y += 8;
}

/** Room the approval block takes with its heading (drawApproval in approval-mark.ts: a 112 pt box, its heading and gaps). */
const APPROVAL_BLOCK_PT = 150;
const PURCHASE_COLUMNS: Column[] = [
  { title: 'Catalogue code', width: 0.17, font: 'mono' },
  { title: 'Description', width: 0.35 },
  { title: 'Qty', width: 0.07, align: 'right' },
  { title: 'Unit price', width: 0.15, align: 'right' },
  { title: 'Line total', width: 0.16, align: 'right' },
  { title: 'Currency', width: 0.1 },
];

function purchaseRows(content: SheetContent): string[][] {
  const p = content.purchase;
  const rows = p.lines.map((l) => [l.code, l.description, `${l.quantity}`, l.unitPrice, l.lineTotal, l.currency]);
  for (const t of p.totals) rows.push(['', p.totals.length > 1 ? `Total in ${t.currency}` : 'Total', '', '', t.total, t.currency]);
  if (!p.totals.length) rows.push(['', 'Total', '', '', 'nothing priced', '']);
  return rows;
}

/**
 * The approval block never stands alone on a page: when the purchase lines fit this page but the
 * approval block after them would not, both start on the next page together.
 */
function keepPurchaseWithApproval(flow: Flow, content: SheetContent): void {
  const rows = purchaseRows(content);
  const purchaseH = 28 + flow.tableHeight(PURCHASE_COLUMNS, rows, { boldLast: content.purchase.totals.length <= 1 }) + 16;
  const pageH = flow.bottom - flow.doc.page.margins.top;
  if (purchaseH <= flow.room && purchaseH + APPROVAL_BLOCK_PT > flow.room && purchaseH + APPROVAL_BLOCK_PT <= pageH) flow.newPage();
}

function purchaseBlock(flow: Flow, content: SheetContent): void {
  const p = content.purchase;
  flow.heading('Purchase lines');
  flow.table(PURCHASE_COLUMNS, purchaseRows(content), { boldLast: p.totals.length <= 1 });
  if (p.onRequest > 0) {
    flow.gap(3);
    flow.paragraph(
      `${p.onRequest} custom mirror${p.onRequest === 1 ? ' is' : 's are'} priced on request and not included in the total.`,
      'regular',
      8.5,
      MUTED,
    );
  }
}

function zonesBlock(flow: Flow, content: SheetContent): void {
  flow.heading('Zones that must be seen');
  if (!content.zones.length) {
    flow.paragraph('No zones are drawn on this plan, so no coverage share is stated.', 'regular', 9, MUTED);
    return;
  }
  flow.table(
    [
      { title: 'Zone', width: 0.34 },
      { title: 'Who must be seen', width: 0.2 },
      { title: 'Criterion', width: 0.14 },
      { title: 'Share seen', width: 0.15, align: 'right' },
      { title: 'Area seen', width: 0.17, align: 'right' },
    ],
    content.zones.map((z) => [z.name, z.target, z.criterion, z.covered, z.area]),
  );
  flow.gap(3);
  flow.paragraph(
    `Share seen: floor some mirror shows, walls included, out to where that person meets the zone\u2019s criterion. Detect: ${content.criteria.detect}; recognise: ${content.criteria.recognise} (${content.criteria.basis}).`,
    'regular',
    8,
    MUTED,
  );
}

function summaryBlock(flow: Flow, content: SheetContent): void {
  flow.heading('Mirrors at a glance');
  flow.table(
    [
      { title: 'Mirror', width: 0.14 },
      { title: 'Product', width: 0.3 },
      { title: 'Height', width: 0.09, align: 'right' },
      { title: 'Floor seen', width: 0.15, align: 'right' },
      { title: 'Adult detected', width: 0.16, align: 'right' },
      { title: 'Adult recognised', width: 0.16, align: 'right' },
    ],
    content.placements.map((p) => [
      p.label,
      p.mirror[0][1],
      (p.mounting.find(([label]) => label === MOUNT_HEIGHT_LABEL) ?? p.mounting[1])[1],
      p.numbers ? `${p.numbers.floorArea}, ${p.numbers.floorSpread}` : '—',
      p.numbers?.rangeAdultDetect ?? '—',
      p.numbers?.rangeAdultRecognise ?? '—',
    ]),
  );
}

const SETTING_OUT_COLUMNS: Column[] = [
  { title: 'Mirror', width: 0.18 },
  { title: 'Set out from', width: 0.33 },
  { title: 'and from', width: 0.33 },
  { title: 'Height of centre', width: 0.16, align: 'right' },
];

/** Each mirror's two setting-out dimensions and height; empty for content issued before they were kept. */
function settingOutRows(content: SheetContent): string[][] {
  return content.plan.mirrors.flatMap((m, i) => {
    const dims = m.dimensions;
    if (!dims?.length) return [];
    const height = content.placements[i]?.mounting.find(([label]) => label === MOUNT_HEIGHT_LABEL)?.[1] ?? '—';
    return [[m.label, dims[0]?.text ?? '—', dims[1]?.text ?? '—', height]];
  });
}

interface LegendItem {
  text: string;
  swatch: (doc: PDFKit.PDFDocument, x: number, y: number) => void;
}

function legendItems(): LegendItem[] {
  const line = (color: string, width: number, dash?: number) => (doc: PDFKit.PDFDocument, x: number, y: number) => {
    doc
      .moveTo(x, y + 4.5)
      .lineTo(x + 18, y + 4.5)
      .lineWidth(width);
    if (dash) doc.dash(dash, { space: dash * 0.6 });
    doc.strokeColor(color).stroke().undash();
  };
  const zone = (band: 'good' | 'partial' | 'poor') => line(bandColours[band].stroke, 1.3, 4);
  return [
    {
      text: 'Floor seen in a mirror, out to where a standing adult is still recognised',
      swatch: (doc, x, y) => doc.rect(x, y, 18, 9).fillOpacity(0.2).fillColor(GLASS).fill().fillOpacity(1),
    },
    {
      text: 'Part of a zone no mirror shows (gap)',
      swatch: (doc, x, y) =>
        hatch(
          doc,
          [
            [
              [
                [0, 0],
                [18, 0],
                [18, 9],
                [0, 9],
              ],
            ],
          ],
          (p) => [x + p[0], y + p[1]],
          3,
        ),
    },
    { text: `Zone ${bandWords.good}: ${COVERED_FROM_PERCENT} % or more seen`, swatch: zone('good') },
    { text: `Zone ${bandWords.partial}: ${PARTLY_FROM_PERCENT}–${COVERED_FROM_PERCENT - 1} % seen`, swatch: zone('partial') },
    { text: `Zone with a ${bandWords.poor}: under ${PARTLY_FROM_PERCENT} % seen`, swatch: zone('poor') },
    { text: 'Wall', swatch: line(INK, 2) },
    { text: 'Racking', swatch: line(MUTED, 1) },
    { text: 'Doorway', swatch: line(MUTED, 1, 2) },
    {
      text: 'Mirror, with a tick toward its aim',
      swatch: (doc, x, y) => {
        doc
          .rect(x + 3, y + 1.5, 6, 6)
          .fillColor(GLASS)
          .fill();
        doc
          .moveTo(x + 6, y + 4.5)
          .lineTo(x + 18, y + 4.5)
          .lineWidth(0.9)
          .strokeColor(GLASS)
          .stroke();
      },
    },
    {
      text: 'Viewer\u2019s eye position',
      swatch: (doc, x, y) => {
        doc
          .circle(x + 9, y + 4.5, 3.2)
          .lineWidth(1)
          .fillColor(PAPER)
          .strokeColor(INK)
          .fillAndStroke();
        doc
          .circle(x + 9, y + 4.5, 1.2)
          .fillColor(INK)
          .fill();
      },
    },
    {
      text: 'Origin 0, 0 of the plan: x to the east (right), y to the north (up)',
      swatch: (doc, x, y) => drawOriginMark(doc, x + 9, y + 4.5),
    },
    {
      text: 'Setting-out dimension, square to a named face (W wall, R racking) or a grid line through the origin',
      swatch: (doc, x, y) => {
        doc
          .moveTo(x, y + 4.5)
          .lineTo(x + 18, y + 4.5)
          .lineWidth(0.5)
          .dash(1.5, { space: 1.5 })
          .strokeColor(INK)
          .stroke()
          .undash();
        doc
          .moveTo(x + 18, y + 1.5)
          .lineTo(x + 18, y + 7.5)
          .lineWidth(0.8)
          .strokeColor(INK)
          .stroke();
      },
    },
  ];
}

const LEGEND_TEXT_PT = 7.5;

function legendHeight(flow: Flow): number {
  const colW = (flow.width - 16) / 2;
  const items = legendItems();
  let h = 14;
  for (let i = 0; i < items.length; i += 2) {
    const a = flow.textHeight(items[i].text, 'regular', LEGEND_TEXT_PT, colW - 24);
    const b = items[i + 1] ? flow.textHeight(items[i + 1].text, 'regular', LEGEND_TEXT_PT, colW - 24) : 0;
    h += Math.max(a, b, 9) + 3;
  }
  return h;
}

/** The plan's legend: a swatch drawn as on the plan beside each item, in two columns, read row by row. */
function legendBlock(flow: Flow): void {
  const doc = flow.doc;
  const colW = (flow.width - 16) / 2;
  flow.ensure(legendHeight(flow));
  flow.tag('H3', () => flow.style('semibold', 8.5, INK).text('Legend', flow.left, flow.y, { lineBreak: false }));
  flow.y += 14;
  const items = legendItems();
  flow.group('L', () => {
    for (let i = 0; i < items.length; i += 2) {
      const pair = items.slice(i, i + 2);
      const h = Math.max(9, ...pair.map((it) => flow.textHeight(it.text, 'regular', LEGEND_TEXT_PT, colW - 24)));
      pair.forEach((it, k) => {
        const x = flow.left + k * (colW + 16);
        const y = flow.y;
        flow.artifact(() => {
          doc.save();
          it.swatch(doc, x, y);
          doc.restore();
        });
        flow.tag('LI', () => flow.write('regular', LEGEND_TEXT_PT, INK, it.text, x + 24, y + 0.5, { width: colW - 24, lineGap: 1 }));
      });
      flow.y += h + 3;
    }
  });
}

/** The plan in words, for a screen reader. */
function planAlt(content: SheetContent, denominator: number): string {
  const zones = content.plan.zones.map((z) => `${z.name}, ${z.covered} seen`).join('; ');
  const under = content.plan.underlay ? ', drawn over the uploaded plan image' : '';
  return `Site plan at 1:${denominator}${under} with ${content.plan.mirrors.length} mirror(s) and the floor each shows${zones ? `; zones: ${zones}` : ''}. Each mirror's place is given in words in the setting-out table.`;
}

/** The sentence under the plan saying what the faded image under it is, and how it was scaled. */
function underlayNote(content: SheetContent, shown: boolean): string | null {
  const u = content.plan.underlay;
  if (!u) return null;
  const f = sheetFormat(content.units);
  if (!shown) return 'The uploaded plan image could not be read for this sheet; the plan is drawn without it.';
  return `Under the drawing, faded: the uploaded plan image, scaled from its calibration (${f.dist(u.calibration.distanceM)} between two marked points). Check one known distance on site before relying on it.`;
}

const SETTING_OUT_NOTE =
  'Each dimension is taken square to the named face of a wall (W) or racking (R) numbered on the plan, or from a grid line through the origin; heights are to the mirror\u2019s centre, above the floor.';

function planPage(flow: Flow, content: SheetContent, paperName: string, images: SheetImages): void {
  flow.newPage();
  flow.heading('Plan: what each mirror shows on the floor', 200);
  const rows = settingOutRows(content);
  // Heading, table, gap and note, as written below.
  const tableH = rows.length
    ? 28 + flow.tableHeight(SETTING_OUT_COLUMNS, rows) + 3 + flow.textHeight(SETTING_OUT_NOTE, 'regular', 7.5, flow.width)
    : 0;
  // Plan gap and scale line (8 + 26), legend, table, gap and the cautions (with the room their `ensure` asks).
  const note = underlayNote(content, !!content.plan.underlay && !!images[content.plan.underlay.fileId]);
  const noteH = note ? flow.textHeight(note, 'regular', 7.5, flow.width) + 4 : 0;
  const below = 34 + noteH + legendHeight(flow) + tableH + 6 + cautionBoxHeight(flow, content.cautions, 8) + 4;
  // The plan takes what the rest leaves, but never less than 40 % of the page (the rest then flows on).
  const pageH = flow.bottom - flow.doc.page.margins.top;
  const most = { x: flow.left, y: flow.y, w: flow.width, h: Math.min(Math.max(flow.room - below, pageH * 0.4), flow.width * 1.1) };
  // Frame only the drawn scene: the box shrinks to the scene's height at the chosen scale.
  const box = { ...most, h: Math.min(most.h, fitPlan(content.plan, most).heightPt + 24) };
  let fit = fitPlan(content.plan, box);
  flow.tag('Figure', () => (fit = drawPlan(flow.doc, content.plan, box, images)), { alt: planAlt(content, fit.denominator) });
  flow.y += box.h + 8;
  const bar = scaleBarFor(fit, content.units, flow.width * 0.28);
  let barLen = 0;
  flow.artifact(() => (barLen = drawScaleBar(flow.doc, fit, bar, flow.left + 2, flow.y + 2)));
  flow.tag('P', () =>
    flow
      .style('semibold', 9, INK)
      .text(`Scale 1:${fit.denominator} on ${paperName} printed at 100 %`, flow.left + barLen + 24, flow.y, { lineBreak: false }),
  );
  flow.tag('P', () =>
    flow
      .style('regular', 7.5, MUTED)
      .text('Plan x to the right (east), plan y up (north), from the origin mark.', flow.left + barLen + 24, flow.y + 12, {
        lineBreak: false,
      }),
  );
  flow.y += 26;
  if (note) {
    flow.paragraph(note, 'regular', 7.5, MUTED);
    flow.gap(4);
  }
  legendBlock(flow);
  if (rows.length) {
    flow.heading('Setting out: where each mirror goes', 40);
    flow.table(SETTING_OUT_COLUMNS, rows);
    flow.gap(3);
    flow.paragraph(SETTING_OUT_NOTE, 'regular', 7.5, MUTED);
  }
  flow.gap(6);
  cautionBox(flow, content.cautions, 'Read with this plan', 8);
}

/** The mirror's numbers, with its newest photo beside them when it has one. */
function numbersWithPhoto(flow: Flow, p: SheetPlacement, rows: [string, string][], images: SheetImages): void {
  const image = p.photo ? images[p.photo.fileId] : undefined;
  if (!p.photo || !image) {
    flow.rows(rows, 0.5);
    if (p.photo)
      flow.paragraph(`Photo "${p.photo.name}" (uploaded ${p.photo.takenOn}) could not be read for this sheet.`, 'regular', 8, MUTED);
    return;
  }
  const photo = p.photo;
  const rowsW = flow.width * 0.6;
  const rowsH = flow.rowsHeight(rows, rowsW, 0.5);
  const boxW = flow.width * 0.37;
  const scale = Math.min(boxW / photo.widthPx, Math.max(rowsH, 120) / photo.heightPx);
  const w = photo.widthPx * scale;
  const h = photo.heightPx * scale;
  flow.ensure(Math.max(rowsH, h));
  const top = flow.y;
  flow.rowsAt(rows, flow.left, top, rowsW, 0.5);
  const x = flow.left + flow.width - boxW + (boxW - w) / 2;
  flow.tag(
    'Figure',
    () => {
      flow.doc.image(Buffer.from(image.buffer, image.byteOffset, image.byteLength), x, top, { width: w, height: h });
    },
    { alt: `Photo of mirror ${p.label} as mounted (${photo.name}, uploaded ${photo.takenOn}).` },
  );
  flow.artifact(() => flow.doc.rect(x, top, w, h).lineWidth(0.4).strokeColor(RULE).stroke());
  flow.y = top + Math.max(rowsH, h) + 2;
  flow.paragraph(`Photo beside: ${photo.name}, uploaded ${photo.takenOn}.`, 'regular', 7.5, MUTED);
}

function placementPage(flow: Flow, content: SheetContent, p: SheetPlacement, index: number, images: SheetImages): void {
  const f = sheetFormat(content.units);
  flow.newPage();
  flow.tag('P', () =>
    flow.style('semibold', 8.5, GLASS).text(`MIRROR ${index + 1} OF ${content.placements.length}`, flow.left, flow.y, { lineBreak: false }),
  );
  flow.y += 13;
  const titleH = flow.textHeight(p.label, 'bold', 16, flow.width);
  flow.tag('H2', () => flow.write('bold', 16, INK, p.label, flow.left, flow.y, { width: flow.width, lineGap: 1 }));
  flow.y += titleH;
  flow.gap(6);
  flow.stackedBlocks([
    { title: 'Where it goes', rows: p.mounting },
    { title: 'The mirror', rows: p.mirror },
  ]);
  if (p.notes) flow.paragraph(`Installer's note: ${p.notes}`, 'regular', 8.5, MUTED);

  flow.heading('What it shows (computed)');
  // Said before the numbers, so a range is never read without the doubt that goes with it.
  for (const doubt of p.plausibility ?? []) flow.paragraph(`Check: ${doubt}`, 'medium', 9, STOP);
  if (!p.numbers) {
    flow.paragraph(`No numbers for this mirror: ${p.problem ?? 'its optics cannot be computed.'}`, 'medium', 9.5, STOP);
    if (p.photo) numbersWithPhoto(flow, p, [], images);
  } else {
    const n = p.numbers;
    if (p.problem) flow.paragraph(`Coverage could not be computed: ${p.problem}`, 'medium', 9, STOP);
    numbersWithPhoto(
      flow,
      p,
      [
        ['Viewer\u2019s eye to mirror', n.eyeDistance],
        ['Viewer\u2019s eye off the mirror\u2019s axis', n.eyeOffAxis],
        ['Floor area seen by this viewer', n.floorArea],
        ['Spread of that floor around the mirror', n.floorSpread],
        ['Nearest to farthest floor seen, from the mirror', n.floorReach],
        ['Standing adult detected up to', n.rangeAdultDetect],
        ['Standing adult recognised up to', n.rangeAdultRecognise],
        ['Child-height target detected up to', n.rangeChildDetect],
        ['Child-height target recognised up to', n.rangeChildRecognise],
        ['Field of view on axis (eye on the mirror\u2019s axis), across × up-down', `${n.fovOnAxisHorizontal} × ${n.fovOnAxisVertical}`],
        ['Size at the rim compared with the centre (rim squeeze)', n.rimSqueeze],
      ],
      images,
    );
    flow.gap(2);
    flow.paragraph(
      `Floor seen: with walls and racking, out to the distance at which a standing adult is still recognised. Detect: ${content.criteria.detect}; recognise: ${content.criteria.recognise}. The on-axis field of view assumes the eye on the mirror\u2019s axis; this viewer\u2019s eye is ${n.eyeOffAxis} off it.`,
      'regular',
      8,
      MUTED,
    );
    flow.gap(6);
    flow.paragraph('How big and how far things look, at three distances from the mirror', 'semibold', 9.5, INK);
    flow.gap(2);
    flow.table(
      [
        { title: 'Object to mirror', width: 0.18, align: 'right' },
        { title: 'Shown at', width: 0.14, align: 'right' },
        { title: 'True distance, eye to object via the mirror', width: 0.26, align: 'right' },
        { title: 'Looks as far away as', width: 0.24, align: 'right' },
        { title: 'Looks farther by', width: 0.18, align: 'right' },
      ],
      n.references.map((r) => [r.objectDistance, r.magnification, r.trueDistance, r.sizeCueDistance, r.ratio]),
    );
    flow.gap(2);
    flow.paragraph(
      '"Looks as far away as": the distance at which the object, seen directly, would look as small as it does in the mirror.',
      'regular',
      8,
      MUTED,
    );
  }

  // The side view and the cautions stay together, so the cautions never stand alone on a page.
  const cautionsH = cautionBoxHeight(flow, content.cautions, 8) + 10;
  if (p.elevation) {
    const caption =
      'Drawn unfolded about the mirror: the viewer on the left, the reflected rays from the nearest and farthest edge of the view on the right. One scale both ways.';
    const captionH = flow.textHeight(caption, 'regular', 7.5, flow.width) + 3;
    // At least 110 pt of drawing here, or a new page (where it may grow to 170 pt).
    flow.ensure(28 + 110 + captionH + cautionsH);
    const h = Math.min(170, Math.max(110, flow.room - 28 - captionH - cautionsH));
    flow.heading('Side view: eye, mirror and sightlines', h + captionH);
    const box = { x: flow.left, y: flow.y, w: flow.width, h };
    flow.tag('Figure', () => drawElevation(flow.doc, p.elevation!, box, f), { alt: elevationAlt(p.elevation, f) });
    flow.y += h + 3;
    flow.paragraph(caption, 'regular', 7.5, MUTED);
  } else {
    flow.ensure(cautionsH);
  }
  flow.gap(6);
  cautionBox(flow, content.cautions, 'Read with these numbers', 8);
}

/** A sheet rendered without an approval says it is not approved, on every page. */
const NO_APPROVAL: SheetApproval = { approved: false, reason: 'no safety officer has approved this job.' };

export async function renderSheet(
  content: SheetContent,
  rev: SheetRevisionInfo,
  paper: SheetPaper,
  approval: SheetApproval = NO_APPROVAL,
  images: SheetImages = {},
): Promise<Buffer> {
  const issued = new Date(Math.floor(rev.issuedAt.getTime() / 1000) * 1000);
  const paperSpec = PAPER_SIZES[paper];
  const doc = new PDFDocument({
    size: paperSpec.pdfkit,
    margins: { top: 44, bottom: 54, left: 46, right: 46 },
    bufferPages: true,
    autoFirstPage: true,
    pdfVersion: '1.7',
    font: NO_DEFAULT_FONT,
    // Tagged PDF with a language, and viewers show the title rather than the file name.
    tagged: true,
    lang: 'en',
    displayTitle: true,
    info: {
      Title: `Specification sheet — ${content.project.name} — revision ${rev.number}`,
      Author: content.installer.name,
      Subject: `Convex mirror specification, content hash ${rev.contentHash}`,
      Creator: 'Sightfan',
      Producer: 'Sightfan',
      CreationDate: issued,
      ModDate: issued,
    },
  });
  const done = collect(doc);
  registerSheetFonts(doc);
  const root = doc.struct('Document');
  doc.addStructure(root);
  const flow = new Flow(doc, () => undefined, root);

  headerBlock(flow, content, rev, paperSpec.name);
  cautionBox(flow, content.cautions, 'Read before relying on this sheet');
  flow.paragraph(SHEET_LIMITS, 'regular', 8.5, MUTED);
  if (content.vehicle) vehicleSummaryBlock(flow, content.vehicle);
  else zonesBlock(flow, content);
  summaryBlock(flow, content);
  keepPurchaseWithApproval(flow, content);
  purchaseBlock(flow, content);
  drawApproval(flow, approval);
  if (content.vehicle)
    vehiclePages(flow, content, content.vehicle, paperSpec.name, (fl) => cautionBox(fl, content.cautions, 'Read with these fields', 8));
  else planPage(flow, content, paperSpec.name, images);
  content.placements.forEach((p, i) => placementPage(flow, content, p, i, images));

  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    drawNotApprovedBand(doc, approval);
    const bottom = doc.page.margins.bottom;
    // Writing inside the bottom margin would make pdfkit start a new page.
    doc.page.margins.bottom = 0;
    // The running footer is pagination, not content: an artifact a screen reader skips.
    doc.markContent('Artifact', { type: 'Pagination' });
    const y = doc.page.height - 34;
    const left = doc.page.margins.left;
    const width = doc.page.width - left - doc.page.margins.right;
    doc
      .moveTo(left, y - 6)
      .lineTo(left + width, y - 6)
      .lineWidth(0.4)
      .strokeColor(RULE)
      .stroke();
    doc.fillColor(MUTED);
    writeText(
      doc,
      'regular',
      7.5,
      `Sightfan · ${content.project.name} · revision ${rev.number} · ${issueDate(issued)} · hash ${shortHash(rev.contentHash)}`,
      left,
      y,
      { width: width - 90, lineBreak: false, ellipsis: true },
    );
    doc
      .font('semibold')
      .fontSize(8)
      .fillColor(INK)
      .text(`Page ${i - range.start + 1} of ${range.count}`, left + width - 90, y, { width: 90, align: 'right', lineBreak: false });
    doc.endMarkedContent();
    doc.page.margins.bottom = bottom;
  }
  root.end();
  doc.end();
  return done;
}
