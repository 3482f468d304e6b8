import { Router } from 'express';
import { HttpError } from '../../http-error';
import { requireRole } from '../../middleware/auth';
import { OutgoingMail } from './outgoing-mail.entity';
import { requestEm } from '../../middleware/request-context';

/**
 * Admin, demo mode only: the e-mail Sightfan owes or has sent for the admin's own organisation,
 * newest first, with its delivery status. Other organisations' mail (with live invitation links)
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
  return r;
}
