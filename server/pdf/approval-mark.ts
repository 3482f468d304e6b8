/**
 * The approval on the sheet: the block that says who approved which revision, and the band that
 * marks every page of a sheet that is not the approved version. Kept apart from the sheet's
 * document structure (render-sheet.ts calls these two functions and nothing else of the review).
 */
import { INK, MUTED, RULE, STOP, type Flow } from './layout';
import { writeText } from './text-runs';

/** What the sheet says about approval; plain data, so it crosses to the worker thread as is. */
export type SheetApproval =
  | {
      approved: true;
      reviewerName: string;
      /** Already in words ("Safety officer"). */
      reviewerRole: string;
      /** ISO date and time of the approval. */
      approvedAt: string;
      revision: number;
      contentHash: string;
    }
  | { approved: false; reason: string };

/** The band's words, first on every page of a sheet that does not carry the approval. */
export const NOT_APPROVED_MARK = 'NOT APPROVED';

/** "2026-12-02 16:40 UTC": the approval's date and time, independent of the server's time zone. */
export const approvalTime = (iso: string) => `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`;

/**
 * The block on the first page (replaces the empty "Approval by the safety officer" form when approved).
 * Tagged like the rest of the sheet: its title and reason are paragraphs, the approval's facts a
 * table whose labels head their rows; the box and the signature lines are artifacts, each drawn
 * between tags, never inside one (pdfkit ends the open structure content when an artifact starts).
 */
export function drawApproval(flow: Flow, approval: SheetApproval): void {
  const doc = flow.doc;
  const h = 112;
  flow.ensure(h + 26);
  flow.heading('Approval by the safety officer', h);
  const top = flow.y;
  flow.artifact(() =>
    doc
      .rect(flow.left, top, flow.width, h)
      .lineWidth(0.8)
      .strokeColor(approval.approved ? INK : STOP)
      .stroke(),
  );
  const x = flow.left + 10;
  const w = flow.width - 20;
  if (approval.approved) {
    flow.tag('P', () => flow.style('bold', 11, INK).text(`Approved: revision ${approval.revision}`, x, top + 9, { lineBreak: false }));
    const rows: [string, string][] = [
      ['Approved by', approval.reviewerName],
      ['Role', approval.reviewerRole],
      ['Date and time', approvalTime(approval.approvedAt)],
      ['Revision', `${approval.revision}`],
      ['Content hash', approval.contentHash],
    ];
    flow.group('Table', () => {
      rows.forEach(([label, value], i) => {
        const y = top + 28 + i * 15;
        flow.group('TR', () => {
          flow.tag('TH', () => flow.style('regular', 8.5, MUTED).text(label, x, y, { lineBreak: false }), { scope: 'Row' });
          flow.tag('TD', () => {
            doc.fillColor(INK);
            writeText(doc, label === 'Content hash' ? 'mono' : 'regular', 8.5, value, x + 90, y, {
              width: w - 90,
              lineBreak: false,
              ellipsis: true,
            });
          });
        });
      });
    });
  } else {
    flow.tag('P', () => flow.style('bold', 11, STOP).text('Not approved', x, top + 9, { lineBreak: false }));
    flow.tag('P', () => flow.style('regular', 8.5, MUTED).text(approval.reason, x, top + 25, { width: w }));
    const fields = ['Reviewer', 'Decision', 'Date', 'Signature'];
    const colW = w / 2;
    fields.forEach((f, i) => {
      const fx = x + (i % 2) * colW;
      const fy = top + 58 + Math.floor(i / 2) * 26;
      // A blank to fill in by hand: its label is read, its line is drawing.
      flow.tag('P', () => flow.style('regular', 8.5, MUTED).text(f, fx, fy, { lineBreak: false }));
      flow.artifact(() =>
        doc
          .moveTo(fx + 52, fy + 10)
          .lineTo(fx + colW - 16, fy + 10)
          .lineWidth(0.6)
          .strokeColor(RULE)
          .stroke(),
      );
    });
  }
  flow.y = top + h + 8;
}

/** A red band across the top margin of the current page, unless the sheet carries the approval. */
export function drawNotApprovedBand(doc: PDFKit.PDFDocument, approval: SheetApproval): void {
  if (approval.approved) return;
  const top = doc.page.margins.top;
  doc.page.margins.top = 0;
  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;
  // Repeated on every page like a running header, so a pagination artifact: the approval block on the
  // first page says the same in the document's structure, where a screen reader meets it once.
  doc.markContent('Artifact', { type: 'Pagination' });
  doc.rect(left, 10, width, 26).fillColor(STOP).fill();
  // Our own words only (no names or notes), so pdfkit's plain path prints them.
  doc
    .font('bold')
    .fontSize(8.5)
    .fillColor('#FFFFFF')
    .text(`${NOT_APPROVED_MARK} — ${approval.reason}`, left + 8, 14, { width: width - 16, height: 22, lineGap: 0, ellipsis: true });
  doc.endMarkedContent();
  doc.page.margins.top = top;
}
