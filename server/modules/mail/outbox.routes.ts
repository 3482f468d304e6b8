import { Router } from 'express';
import { HttpError } from '../../http-error';
import { outboxAttachmentParams } from '../../../shared/schemas';
import { requireRole } from '../../middleware/auth';
import { parseOr400 } from '../../middleware/validate';
import { OutgoingMail } from './outgoing-mail.entity';
import { requestEm } from '../../middleware/request-context';

/**
 * Admin, demo mode only: the e-mail Sightfan owes or has sent for the admin's own organisation,
 * newest first, with its delivery status, and each message's attachments to open. Other organisations' mail (with live invitation links)
 * never shows here.
 */
export function outboxRoutes(demoMode: boolean, from: string): Router {
  const r = Router();
  r.use(requireRole('admin'));
  r.get('/', async (req, res) => {
    if (!demoMode) throw new HttpError(404, 'The outbox exists only in demo mode; real mail goes to your mail server.');
    const rows = await requestEm().find(
      OutgoingMail,
      { organization: req.user!.organization.id },
      { orderBy: { id: 'desc' }, limit: 200, populate: ['attachments'] },
    );
    res.json({
      demo: true,
      messages: rows.map((m) => ({
        id: m.id,
        from,
        to: [m.toAddress],
        subject: m.subject,
        text: m.text,
        attachments: m.attachments.map((a) => ({
          filename: a.filename,
          contentType: a.contentType,
          size: Math.floor((a.content.length * 3) / 4),
        })),
        receivedAt: m.createdAt.toISOString(),
        status: m.status,
        attempts: m.attempts,
        sentAt: m.sentAt ? m.sentAt.toISOString() : null,
      })),
    });
  });
  /** One attachment of a message (a sheet PDF), so the admin can open what a buyer received. */
  r.get('/:id/attachments/:index', async (req, res) => {
    if (!demoMode) throw new HttpError(404, 'The outbox exists only in demo mode; real mail goes to your mail server.');
    const p = parseOr400(outboxAttachmentParams, req.params, 'The address');
    const row = await requestEm().findOne(
      OutgoingMail,
      { id: p.id, organization: req.user!.organization.id },
      { populate: ['attachments'] },
    );
    const file = row?.attachments[p.index];
    if (!file) throw new HttpError(404, 'That e-mail or attachment is not in your outbox.');
    const bytes = Buffer.from(file.content, 'base64');
    res.set({
      'Content-Type': file.contentType,
      // Our own file names (letters, digits, dashes, dots); quotes and line breaks could not reach a header anyway.
      'Content-Disposition': `attachment; filename="${file.filename.replace(/["\r\n\\]/g, '_')}"`,
      'Content-Length': String(bytes.length),
      'Access-Control-Expose-Headers': 'Content-Disposition',
    });
    res.end(bytes);
  });
  return r;
}
