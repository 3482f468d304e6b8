import { Router } from 'express';
import type { Orm } from '../../db';
import { HttpError } from '../../http-error';
import { requireRole } from '../../middleware/auth';
import { MailMessage } from './mail-message.entity';

/** Admin, demo mode only: what the local fake mail server has received, newest first. */
export function outboxRoutes(orm: Orm, demoMode: boolean): Router {
  const r = Router();
  r.use(requireRole('admin'));
  r.get('/', async (_req, res) => {
    if (!demoMode) throw new HttpError(404, 'The outbox exists only in demo mode; real mail goes to your mail server.');
    const rows = await orm.em.fork().find(MailMessage, {}, { orderBy: { id: 'desc' }, limit: 200 });
    res.json({
      demo: true,
      messages: rows.map((m) => ({
        id: m.id,
        from: m.fromAddress,
        to: m.toAddresses,
        subject: m.subject,
        text: m.text,
        attachments: m.attachments,
        receivedAt: m.receivedAt.toISOString(),
      })),
    });
  });
  return r;
}
