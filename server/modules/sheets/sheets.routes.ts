import { Router, type Response } from 'express';
import { sheetEmailBody, sheetQuery, type SheetEmailResponse, type SheetStatusDto } from '../../../shared/schemas';
import type { Orm } from '../../db';
import { requireUser } from '../../middleware/auth';
import { parseOr400 } from '../../middleware/validate';
import { sheetFilename } from '../../pdf/sheet-model';
import { queueMail, type MailDispatcher } from '../mail/outbox';
import { SheetRevision } from './sheet-revision.entity';
import { issueAndRender, loadCurrentSheet, toRevisionDto } from './sheet-service';

function sendPdf(res: Response, pdf: Buffer, filename: string, revision: number): void {
  res.set({
    'Content-Type': 'application/pdf',
    'Content-Disposition': `attachment; filename="${filename}"`,
    'Content-Length': String(pdf.length),
    'X-Sheet-Revision': String(revision),
    'Access-Control-Expose-Headers': 'Content-Disposition, X-Sheet-Revision',
  });
  res.end(pdf);
}

/**
 * The specification sheet of a project. Anyone who can read the project (its installer, a reviewer
 * of its organisation, an admin) can download it or e-mail it to a buyer; others get 404.
 */
export function sheetsRoutes(deps: { orm: Orm; outbox: MailDispatcher }): Router {
  const { orm, outbox } = deps;
  const r = Router();
  r.use(requireUser);

  r.get('/:id/sheet', async (req, res) => {
    const em = orm.em.fork();
    const sheet = await loadCurrentSheet(em, req.user!, req.params.id);
    const revisions = await em.find(SheetRevision, { project: sheet.project.id }, { orderBy: { number: 'desc' }, populate: ['issuedBy'] });
    const latest = revisions[0];
    const changed = !latest || latest.contentHash !== sheet.hash;
    const number = changed ? (latest?.number ?? 0) + 1 : latest.number;
    const body: SheetStatusDto = {
      revisions: revisions.map(toRevisionDto),
      current: { number, contentHash: sheet.hash, changedSinceLast: changed },
      filename: sheetFilename(sheet.project.name, number),
    };
    res.json(body);
  });

  r.get('/:id/sheet.pdf', async (req, res) => {
    const q = parseOr400(sheetQuery, req.query, 'The address');
    const sheet = await issueAndRender(orm.em.fork(), req.user!, req.params.id, q.paper);
    sendPdf(res, sheet.pdf, sheet.filename, sheet.revision.number);
  });

  r.post('/:id/sheet/email', async (req, res) => {
    const em = orm.em.fork();
    // Check access before the body, so a stranger learns nothing about the project from a 400.
    await loadCurrentSheet(em, req.user!, req.params.id);
    const body = parseOr400(sheetEmailBody, req.body, 'The e-mail');
    const q = parseOr400(sheetQuery, req.query, 'The address');
    const sheet = await issueAndRender(em, req.user!, req.params.id, q.paper);
    const content = `${req.user!.name} sent you the Sightfan specification sheet for "${sheet.projectName}" (revision ${sheet.revision.number}), attached as a PDF.`;
    const note = body.message ? `\n\nTheir note:\n${body.message}` : '';
    const tail =
      '\n\nThe sheet lists what to buy (purchase lines), where each mirror goes, what it shows by calculation, and the cautions that apply. ' +
      'It is not a certificate of compliance; local codes and a licensed professional take precedence.';
    // Stored with the revision's e-mail in the outbox, then tried at once: the answer says truthfully
    // whether it left ("sent") or waits for a retry ("queued").
    const mail = queueMail(em, {
      organizationId: req.user!.organization.id,
      kind: 'sheet',
      to: body.to,
      subject: `Mirror specification sheet, revision ${sheet.revision.number}`,
      text: content + note + tail,
      attachments: [{ filename: sheet.filename, content: sheet.pdf, contentType: 'application/pdf' }],
    });
    await em.flush();
    const delivery = await outbox.deliver(mail.id);
    const out: SheetEmailResponse = { revision: toRevisionDto(sheet.revision), to: body.to, filename: sheet.filename, delivery: delivery === 'sent' ? 'sent' : 'queued' };
    res.json(out);
  });

  return r;
}
