import { Router, type Response } from 'express';
import {
  sheetEmailBody,
  sheetPdfQuery,
  sheetQuery,
  sheetRecipientQuery,
  type SheetEmailResponse,
  type SheetRecipientDto,
  type SheetIssueResponse,
  type SheetStatusDto,
} from '../../../shared/schemas';
import { HttpError } from '../../http-error';
import { requireUser } from '../../middleware/auth';
import { parseOr400 } from '../../middleware/validate';
import { sheetFilename } from '../../pdf/sheet-model';
import type { SheetWork } from '../../workers/sheet-pool';
import { queueMail, type MailDispatcher } from '../mail/outbox';
import { recordEvent } from '../review/audit';
import type { User } from '../users/user.entity';
import { isOutsideOrganisation, outsideSheetsSince } from './recipients';
import { SheetRevision } from './sheet-revision.entity';
import { findVisibleProject } from '../projects/project-access';
import type { FileStorage } from '../files/storage';
import { currentContent, currentPaper, issueRevision, latestRevision, renderRevision, toRevisionDto } from './sheet-service';
import { requestEm } from '../../middleware/request-context';

/**
 * "Mirror specification sheet: Cold store aisles (demo), revision 3". A buyer's inbox holds sheets
 * of many jobs; the project and the revision say which one this is. Line breaks and tabs in a name
 * would break the header, so any run of whitespace becomes one space.
 */
export function sheetMailSubject(projectName: string, revision: number): string {
  return `Mirror specification sheet: ${projectName.replace(/\s+/g, ' ').trim()}, revision ${revision}`;
}

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
 * of its organisation, an admin) can issue a revision, download an issued one or e-mail the sheet to
 * a buyer; others get 404. GET requests change nothing: a revision is issued only by POST.
 */
export function sheetsRoutes(deps: { outbox: MailDispatcher; work: SheetWork; outsidePerHour: number; storage?: FileStorage }): Router {
  const { outbox, work } = deps;
  const r = Router();
  r.use(requireUser);

  r.get('/:id/sheet', async (req, res) => {
    const em = requestEm();
    const project = await findVisibleProject(em, req.user!, req.params.id);
    const sheet = await currentContent(em, project, work);
    const revisions = await em.find(SheetRevision, { project: project.id }, { orderBy: { number: 'desc' }, populate: ['issuedBy'] });
    const latest = revisions[0];
    const changed = !latest || latest.contentHash !== sheet.hash;
    const number = changed ? (latest?.number ?? 0) + 1 : latest.number;
    const body: SheetStatusDto = {
      revisions: revisions.map(toRevisionDto),
      current: {
        number,
        contentHash: sheet.hash,
        changedSinceLast: changed,
        approved: project.state === 'approved' && project.approvedHash === sheet.hash,
      },
      filename: sheetFilename(project.name, number, currentPaper(project)),
    };
    res.json(body);
  });

  /** Issues a revision holding the project's current content (or answers with the latest, if that already does). */
  r.post('/:id/sheet/revisions', async (req, res) => {
    const em = requestEm();
    const project = await findVisibleProject(em, req.user!, req.params.id);
    const { revision, created } = await issueRevision(em, await currentContent(em, project, work), req.user!);
    if (created) {
      issuedEvent(em, project.id, req.user!, revision);
      await em.flush();
    }
    const body: SheetIssueResponse = {
      revision: toRevisionDto(revision),
      created,
      filename: sheetFilename(project.name, revision.number, currentPaper(project)),
    };
    res.status(created ? 201 : 200).json(body);
  });

  /** The PDF of an issued revision: `?revision=n`, or the latest issued. Never issues one. */
  r.get('/:id/sheet.pdf', async (req, res) => {
    const em = requestEm();
    const project = await findVisibleProject(em, req.user!, req.params.id);
    const q = parseOr400(sheetPdfQuery, req.query, 'The address');
    const revision = q.revision
      ? await em.findOne(SheetRevision, { project: project.id, number: q.revision }, { populate: ['issuedBy'] })
      : await latestRevision(em, project);
    if (!revision) {
      throw new HttpError(
        404,
        q.revision
          ? `This project has no revision ${q.revision}.`
          : 'No sheet has been issued for this project yet. Issue one first (the app\u2019s Download sheet does).',
      );
    }
    const sheet = await renderRevision(em, project, revision, work, q.paper, undefined, deps.storage);
    sendPdf(res, sheet.pdf, sheet.filename, revision.number);
  });

  /** Whether e-mailing the sheet to `?to=` leaves the organisation, by the rule the hourly limit counts by. */
  r.get('/:id/sheet/recipient', async (req, res) => {
    const em = requestEm();
    const project = await findVisibleProject(em, req.user!, req.params.id);
    const q = parseOr400(sheetRecipientQuery, req.query, 'The address');
    const body: SheetRecipientDto = { outsideOrganisation: await isOutsideOrganisation(em, project.organization.id, q.to) };
    res.json(body);
  });

  r.post('/:id/sheet/email', async (req, res) => {
    const em = requestEm();
    // Check access before the body, so a stranger learns nothing about the project from a 400.
    const project = await findVisibleProject(em, req.user!, req.params.id);
    const body = parseOr400(sheetEmailBody, req.body, 'The e-mail');
    const q = parseOr400(sheetQuery, req.query, 'The address');
    // An address that is not a user of the organisation is limited per sender and hour (counted in the audit log).
    const outside = await isOutsideOrganisation(em, project.organization.id, body.to);
    if (outside) {
      if ((await outsideSheetsSince(em, req.user!.id, new Date(Date.now() - 3600_000))) >= deps.outsidePerHour) {
        throw new HttpError(
          429,
          `You have sent ${deps.outsidePerHour} sheets to addresses outside your organisation in the last hour, the most Sightfan allows. Try again later, or send it to a colleague's address.`,
          undefined,
          { 'Retry-After': '3600' },
        );
      }
    }
    // The project is evaluated (or found in the cache) once: issuing and printing share it.
    const current = await currentContent(em, project, work);
    const { revision, created } = await issueRevision(em, current, req.user!);
    const sheet = await renderRevision(em, project, revision, work, q.paper, current, deps.storage);
    const approved = project.state === 'approved' && project.approvedHash === revision.contentHash;
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
      // The buyer answers the person who sent the sheet, not the product's address.
      replyTo: req.user!.email,
      subject: sheetMailSubject(sheet.projectName, sheet.revision.number),
      text: content + note + tail,
      attachments: [{ filename: sheet.filename, content: sheet.pdf, contentType: 'application/pdf' }],
    });
    if (created) issuedEvent(em, project.id, req.user!, revision);
    recordEvent(em, {
      projectId: project.id,
      kind: 'sheet_emailed',
      actor: req.user!,
      summary: `E-mailed sheet revision ${revision.number} to ${body.to}${approved ? '' : ' (not approved)'}.`,
      detail: { to: body.to, revision: revision.number, outside: outside ? 1 : 0, approved: approved ? 1 : 0 },
    });
    await em.flush();
    const delivery = await outbox.deliver(mail.id);
    const out: SheetEmailResponse = {
      revision: toRevisionDto(sheet.revision),
      to: body.to,
      filename: sheet.filename,
      delivery: delivery === 'sent' ? 'sent' : 'queued',
      approved,
      outsideOrganisation: outside,
    };
    res.json(out);
  });

  return r;
}

function issuedEvent(em: Parameters<typeof recordEvent>[0], projectId: number, user: User, revision: SheetRevision): void {
  recordEvent(em, {
    projectId,
    kind: 'sheet_issued',
    actor: user,
    summary: `Issued sheet revision ${revision.number}.`,
    detail: { revision: revision.number, contentHash: revision.contentHash },
  });
}
