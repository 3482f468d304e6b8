/**
 * Draws a SheetContent as a PDF with pdfkit. The same content and revision give the same bytes:
 * the metadata dates come from the revision's issue time (pdfkit would otherwise stamp "now"), and
 * pdfkit derives the trailer's file /ID from those metadata, so it is fixed too.
 */
import PDFDocument from 'pdfkit';
import type { SheetPaper } from '../../shared/schemas';
import { SHEET_LIMITS } from './cautions';
import { drawElevation, drawPlan, drawScaleBar, fitPlan, scaleBarFor } from './draw-plan';
import { NO_DEFAULT_FONT, registerSheetFonts } from './fonts';
import { writeText } from './text-runs';
import { BEACON, BEACON_SOFT, Flow, GLASS, INK, MUTED, RULE, STOP } from './layout';
import { sheetFormat, type SheetContent, type SheetPlacement } from './sheet-model';
import { vehiclePages } from './vehicle-sheet';

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

function cautionBox(flow: Flow, cautions: readonly string[], title: string, size = 9): void {
  const doc = flow.doc;
  const pad = 8;
  const textW = flow.width - 2 * pad - 14;
  const heights = cautions.map((c) => flow.textHeight(c, 'regular', size, textW) + 3);
  const h = 2 * pad + 14 + heights.reduce((a, b) => a + b, 0);
  flow.ensure(h + 4);
  doc.rect(flow.left, flow.y, flow.width, h).fillColor(BEACON_SOFT).fill();
  doc.rect(flow.left, flow.y, 3, h).fillColor(BEACON).fill();
  let y = flow.y + pad;
  flow.style('semibold', 9.5, INK).text(title, flow.left + pad + 2, y, { lineBreak: false });
  y += 14;
  cautions.forEach((c, i) => {
    flow.style('bold', size, INK).text(`${i + 1}`, flow.left + pad + 2, y, { lineBreak: false });
    flow.style('regular', size, INK).text(c, flow.left + pad + 16, y, { width: textW, lineGap: 1 });
    y += heights[i];
  });
  flow.y += h + 6;
}

function headerBlock(flow: Flow, content: SheetContent, rev: SheetRevisionInfo, paperName: string): void {
  const doc = flow.doc;
  flow
    .style('semibold', 8.5, GLASS)
    .text('SIGHTFAN  ·  MIRROR SPECIFICATION SHEET', flow.left, flow.y, { characterSpacing: 1, lineBreak: false });
  flow.y += 14;
  flow.paragraph(content.project.name, 'bold', 19, INK);
  flow.gap(6);
  const colW = (flow.width - 18) / 2;
  const left: [string, string][] = [
    ['Customer', content.project.customer || 'not stated'],
    ['Site', content.project.site || 'not stated'],
    ['Installer', `${content.installer.name}, ${content.installer.organization}`],
    ['Installer e-mail', content.installer.email],
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
  flow.y += h + 4;
  doc
    .moveTo(flow.left, flow.y)
    .lineTo(flow.left + flow.width, flow.y)
    .lineWidth(1.2)
    .strokeColor(INK)
    .stroke();
  flow.y += 8;
}

function approvalBlock(flow: Flow): void {
  const doc = flow.doc;
  const h = 112;
  flow.ensure(h + 26);
  flow.heading('Approval by the safety officer', h);
  doc.rect(flow.left, flow.y, flow.width, h).lineWidth(0.8).strokeColor(INK).stroke();
  flow.style('bold', 11, STOP).text('Not yet reviewed', flow.left + 10, flow.y + 9, { lineBreak: false });
  flow
    .style('regular', 8.5, MUTED)
    .text(
      'No safety officer has reviewed this revision. Do not treat it as approved until this block is completed and signed.',
      flow.left + 10,
      flow.y + 25,
      {
        width: flow.width - 20,
      },
    );
  const fields = ['Reviewer', 'Decision', 'Date', 'Signature'];
  const colW = (flow.width - 20) / 2;
  fields.forEach((f, i) => {
    const x = flow.left + 10 + (i % 2) * colW;
    const y = flow.y + 58 + Math.floor(i / 2) * 26;
    flow.style('regular', 8.5, MUTED).text(f, x, y, { lineBreak: false });
    doc
      .moveTo(x + 52, y + 10)
      .lineTo(x + colW - 16, y + 10)
      .lineWidth(0.6)
      .strokeColor(RULE)
      .stroke();
  });
  flow.y += h + 8;
}

function purchaseBlock(flow: Flow, content: SheetContent): void {
  const p = content.purchase;
  flow.heading('Purchase lines');
  const rows = p.lines.map((l) => [l.code, l.description, `${l.quantity}`, l.unitPrice, l.lineTotal, l.currency]);
  for (const t of p.totals) rows.push(['', p.totals.length > 1 ? `Total in ${t.currency}` : 'Total', '', '', t.total, t.currency]);
  if (!p.totals.length) rows.push(['', 'Total', '', '', 'nothing priced', '']);
  flow.table(
    [
      { title: 'Catalogue code', width: 0.17, font: 'mono' },
      { title: 'Description', width: 0.35 },
      { title: 'Qty', width: 0.07, align: 'right' },
      { title: 'Unit price', width: 0.15, align: 'right' },
      { title: 'Line total', width: 0.16, align: 'right' },
      { title: 'Currency', width: 0.1 },
    ],
    rows,
    { boldLast: p.totals.length <= 1 },
  );
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
      p.mounting[1][1],
      p.numbers ? `${p.numbers.floorArea}, ${p.numbers.floorSpread}` : '—',
      p.numbers?.rangeAdultDetect ?? '—',
      p.numbers?.rangeAdultRecognise ?? '—',
    ]),
  );
}

function planPage(flow: Flow, content: SheetContent, paperName: string): void {
  flow.newPage();
  flow.heading('Plan: what each mirror shows on the floor', 200);
  const legendH = 58;
  const most = { x: flow.left, y: flow.y, w: flow.width, h: Math.min(flow.room - legendH, flow.width * 1.1) };
  // Frame only the drawn scene: the box shrinks to the scene's height at the chosen scale.
  const box = { ...most, h: Math.min(most.h, fitPlan(content.plan, most).heightPt + 24) };
  const fit = drawPlan(flow.doc, content.plan, box);
  flow.y += box.h + 8;
  const bar = scaleBarFor(fit, content.units, flow.width * 0.28);
  const barLen = drawScaleBar(flow.doc, fit, bar, flow.left + 2, flow.y + 2);
  flow
    .style('semibold', 9, INK)
    .text(`Scale 1:${fit.denominator} on ${paperName} printed at 100 %`, flow.left + barLen + 24, flow.y, { lineBreak: false });
  flow
    .style('regular', 7.5, MUTED)
    .text('Plan x to the right, plan y up; positions in the tables are in these coordinates.', flow.left + barLen + 24, flow.y + 12, {
      lineBreak: false,
    });
  flow.y += 26;
  const legend =
    'Legend: blue shading — floor seen in a mirror, within the distance at which a standing adult is still recognised; red dashed outline — zone that must be seen, with its share seen; thick black line — wall; grey line — racking; blue square with a tick — mirror and its aim; ringed dot — viewer\u2019s eye position.';
  flow.paragraph(legend, 'regular', 8, INK);
}

function placementPage(flow: Flow, content: SheetContent, p: SheetPlacement, index: number): void {
  const f = sheetFormat(content.units);
  flow.newPage();
  flow
    .style('semibold', 8.5, GLASS)
    .text(`MIRROR ${index + 1} OF ${content.placements.length}`, flow.left, flow.y, { characterSpacing: 1, lineBreak: false });
  flow.y += 13;
  flow.paragraph(p.label, 'bold', 16, INK);
  flow.gap(6);
  flow.twoBlocks({ title: 'The mirror', rows: p.mirror }, { title: 'Where it goes', rows: p.mounting });
  if (p.notes) flow.paragraph(`Installer's note: ${p.notes}`, 'regular', 8.5, MUTED);

  flow.heading('What it shows (computed)');
  if (!p.numbers) {
    flow.paragraph(`No numbers for this mirror: ${p.problem ?? 'its optics cannot be computed.'}`, 'medium', 9.5, STOP);
  } else {
    const n = p.numbers;
    if (p.problem) flow.paragraph(`Coverage could not be computed: ${p.problem}`, 'medium', 9, STOP);
    flow.rows(
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
      0.5,
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

  if (p.elevation) {
    flow.heading('Side view: eye, mirror and sightlines', 150);
    const h = Math.min(170, Math.max(110, flow.room - 150));
    flow.ensure(h + 14);
    drawElevation(flow.doc, p.elevation, { x: flow.left, y: flow.y, w: flow.width, h }, f);
    flow.y += h + 3;
    flow.paragraph(
      'Drawn unfolded about the mirror: the viewer on the left, the reflected rays from the nearest and farthest edge of the view on the right. One scale both ways.',
      'regular',
      7.5,
      MUTED,
    );
  }
  flow.gap(6);
  cautionBox(flow, content.cautions, 'Read with these numbers', 8);
}

export async function renderSheet(content: SheetContent, rev: SheetRevisionInfo, paper: SheetPaper): Promise<Buffer> {
  const issued = new Date(Math.floor(rev.issuedAt.getTime() / 1000) * 1000);
  const paperSpec = PAPER_SIZES[paper];
  const doc = new PDFDocument({
    size: paperSpec.pdfkit,
    margins: { top: 44, bottom: 54, left: 46, right: 46 },
    bufferPages: true,
    autoFirstPage: true,
    pdfVersion: '1.7',
    font: NO_DEFAULT_FONT,
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
  const flow = new Flow(doc, () => undefined);

  headerBlock(flow, content, rev, paperSpec.name);
  cautionBox(flow, content.cautions, 'Read before relying on this sheet');
  flow.paragraph(SHEET_LIMITS, 'regular', 8.5, MUTED);
  if (!content.vehicle) zonesBlock(flow, content);
  summaryBlock(flow, content);
  purchaseBlock(flow, content);
  approvalBlock(flow);
  if (content.vehicle)
    vehiclePages(flow, content, content.vehicle, paperSpec.name, (fl) => cautionBox(fl, content.cautions, 'Read with these fields', 8));
  else planPage(flow, content, paperSpec.name);
  content.placements.forEach((p, i) => placementPage(flow, content, p, i));

  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const bottom = doc.page.margins.bottom;
    // Writing inside the bottom margin would make pdfkit start a new page.
    doc.page.margins.bottom = 0;
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
    doc.page.margins.bottom = bottom;
  }
  doc.end();
  return done;
}
