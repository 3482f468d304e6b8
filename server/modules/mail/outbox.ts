/**
 * The transactional outbox. `queueMail` adds a row to the caller's unit of work, so the e-mail is
 * stored in the same transaction as the change that causes it (an invitation, a reset link, a
 * sheet sent to a buyer). `MailDispatcher` delivers due rows from the database, retrying with
 * doubling delays; a row is claimed with a guarded update, so two instances never send it twice
 * at once, and a sender that dies mid-way leaves the row to be retried when its lease ends.
 */
import type { EntityManager } from '@mikro-orm/knex';
import type { Orm } from '../../db';
import type { Logger } from '../../logger';
import { redact } from '../../middleware/errors';
import type { Mailer } from './mailer';
import { OutgoingMail, type OutgoingMailKind } from './outgoing-mail.entity';

export interface QueuedMail {
  organizationId: number;
  kind: OutgoingMailKind;
  to: string;
  /** Where replies go (the sender of a sheet), when not to the product's own address. */
  replyTo?: string | null;
  subject: string;
  text: string;
  attachments?: { filename: string; content: Buffer; contentType: string }[];
}

/** Adds the e-mail to `em`'s unit of work; the caller's `flush()` commits it with the change. */
export function queueMail(em: EntityManager, mail: QueuedMail): OutgoingMail {
  return em.create(OutgoingMail, {
    organization: mail.organizationId,
    kind: mail.kind,
    toAddress: mail.to,
    replyTo: mail.replyTo ?? null,
    subject: mail.subject,
    text: mail.text,
    attachments: (mail.attachments ?? []).map((a) => ({
      filename: a.filename,
      contentType: a.contentType,
      content: a.content.toString('base64'),
    })),
    status: 'queued',
    attempts: 0,
    nextAttemptAt: new Date(),
  });
}

export interface OutboxOptions {
  /** How often the worker looks for due mail. */
  pollMs: number;
  /** The first retry's delay; each later one doubles, up to `maxDelayMs`. */
  firstRetryMs: number;
  maxDelayMs: number;
  /** After this many failed attempts the row is marked failed and left for an administrator. */
  maxAttempts: number;
  /** How long a claimed row is reserved for its sender. */
  leaseMs: number;
  /**
   * Blank a message's text and attachments once sent. One-time links are stored only as hashes;
   * a delivered e-mail kept whole would leave working links in the database. Off in demo mode,
   * where the admin reads the mail in the Outbox.
   */
  scrubAfterSend: boolean;
}

export const DEFAULT_OUTBOX_OPTIONS: OutboxOptions = {
  pollMs: 5000,
  firstRetryMs: 30_000,
  maxDelayMs: 60 * 60_000,
  maxAttempts: 10,
  leaseMs: 2 * 60_000,
  scrubAfterSend: true,
};
export const SCRUBBED_TEXT = 'Delivered. The content was removed after sending, as it may hold a one-time link.';

export type Delivery = 'sent' | 'queued' | 'failed';

export class MailDispatcher {
  private timer: NodeJS.Timeout | undefined;
  private running: Promise<void> | undefined;
  private stopped = false;

  constructor(
    private readonly orm: Orm,
    private readonly mailer: Mailer,
    private readonly log: Logger,
    readonly options: OutboxOptions = DEFAULT_OUTBOX_OPTIONS,
  ) {}

  /** The delay before attempt `attempts + 1`, after `attempts` failures (doubling, capped). */
  retryDelayMs(attempts: number): number {
    return Math.min(this.options.firstRetryMs * 2 ** Math.max(0, attempts - 1), this.options.maxDelayMs);
  }

  start(): void {
    this.stopped = false;
    this.schedule(0);
  }

  stop(): void {
    this.stopped = true;
    if (this.timer) clearTimeout(this.timer);
    this.timer = undefined;
  }

  /** Looks for due mail now rather than at the next poll. */
  kick(): void {
    if (!this.stopped) this.schedule(0);
  }

  private schedule(ms: number): void {
    if (this.stopped) return;
    if (this.timer) clearTimeout(this.timer);
    this.timer = setTimeout(() => {
      this.timer = undefined;
      void this.runOnce(true).finally(() => this.schedule(this.options.pollMs));
    }, ms);
    this.timer.unref();
  }

  /** Delivers every due row once; returns how many were sent (0 when a run is already going). */
  async runOnce(fromTimer = false): Promise<number> {
    if (this.running) return 0;
    let sent = 0;
    this.running = (async () => {
      const due = await this.orm.em
        .fork()
        .find(
          OutgoingMail,
          { status: { $in: ['queued', 'sending'] }, nextAttemptAt: { $lte: new Date() } },
          { orderBy: { id: 'asc' }, limit: 50, fields: ['id'] },
        );
      for (const row of due) {
        if (fromTimer && this.stopped) break;
        if ((await this.deliver(row.id)) === 'sent') sent++;
      }
    })().catch((e: unknown) => this.log.error('outbox run failed', e instanceof Error ? `${e.name}: ${redact(e.message)}` : e));
    try {
      await this.running;
    } finally {
      this.running = undefined;
    }
    return sent;
  }

  /**
   * Tries to send one row now if it is due (or still queued): claims it, sends, records the
   * outcome. Answers what is true afterwards: sent, queued for a retry, or failed for good.
   */
  async deliver(id: number): Promise<Delivery> {
    const em = this.orm.em.fork();
    const now = new Date();
    const claimed = await em.nativeUpdate(
      OutgoingMail,
      { id, status: { $in: ['queued', 'sending'] }, nextAttemptAt: { $lte: now } },
      { status: 'sending', nextAttemptAt: new Date(now.getTime() + this.options.leaseMs) },
    );
    if (claimed !== 1) {
      const row = await em.findOne(OutgoingMail, { id }, { fields: ['status'] });
      return row?.status === 'sent' ? 'sent' : row?.status === 'failed' ? 'failed' : 'queued';
    }
    const row = await em.findOneOrFail(OutgoingMail, { id }, { populate: ['attachments'] });
    try {
      await this.mailer.send({
        to: row.toAddress,
        // Read from the row, so a retry an hour later still answers to the sender.
        ...(row.replyTo ? { replyTo: row.replyTo } : {}),
        subject: row.subject,
        text: row.text,
        attachments: row.attachments.map((a) => ({
          filename: a.filename,
          contentType: a.contentType,
          content: Buffer.from(a.content, 'base64'),
        })),
      });
      const scrub = this.options.scrubAfterSend ? { text: SCRUBBED_TEXT, attachments: [] } : {};
      await em.nativeUpdate(
        OutgoingMail,
        { id },
        { status: 'sent', sentAt: new Date(), attempts: row.attempts + 1, lastError: null, ...scrub },
      );
      return 'sent';
    } catch (e) {
      const attempts = row.attempts + 1;
      const failed = attempts >= this.options.maxAttempts;
      // Duck-typed: errors from Node's sockets may come from another realm (Jest), failing instanceof.
      const err = (e ?? {}) as { code?: string; name?: string; message?: string };
      const reason = redact(`${err.code ?? err.name ?? 'Error'}: ${err.message ?? String(e)}`).slice(0, 300);
      await em.nativeUpdate(
        OutgoingMail,
        { id },
        {
          status: failed ? 'failed' : 'queued',
          attempts,
          lastError: reason,
          nextAttemptAt: new Date(Date.now() + this.retryDelayMs(attempts)),
        },
      );
      this.log.warn(`outbox: mail ${id} not delivered (attempt ${attempts}${failed ? ', giving up' : ''}): ${reason}`);
      return failed ? 'failed' : 'queued';
    }
  }
}
