import crypto from 'node:crypto';
import type { EntityManager } from '@mikro-orm/sqlite';
import { Invitation } from './invitation.entity';
import type { User } from './user.entity';

export const INVITATION_LIFETIME_MS = 7 * 24 * 60 * 60 * 1000;

export const hashToken = (token: string) => crypto.createHash('sha256').update(token).digest('hex');

/** Makes a one-time token for a user; only its hash is stored, the token itself goes in the e-mail. */
export function createInvitation(em: EntityManager, user: User, now = new Date()): { invitation: Invitation; token: string } {
  const token = crypto.randomBytes(32).toString('base64url');
  const invitation = em.create(Invitation, {
    user,
    tokenHash: hashToken(token),
    expiresAt: new Date(now.getTime() + INVITATION_LIFETIME_MS),
    usedAt: null,
    createdAt: now,
    updatedAt: now,
  });
  return { invitation, token };
}

export function invitationEmail(opts: { name: string; inviter: string; organization: string; link: string }): { subject: string; text: string } {
  return {
    subject: `${opts.inviter} invited you to Sightfan`,
    text: [
      `Hello ${opts.name},`,
      '',
      `${opts.inviter} has given you a Sightfan account at ${opts.organization}.`,
      'Choose your password with this link (it works once and for 7 days):',
      '',
      opts.link,
      '',
      'If you did not expect this, you can ignore this message; no account is usable until a password is set.',
    ].join('\n'),
  };
}
