import crypto from 'node:crypto';
import type { EntityManager } from '@mikro-orm/knex';
import { Invitation, type LinkPurpose } from './invitation.entity';
import type { User } from './user.entity';

export const INVITATION_LIFETIME_MS = 7 * 24 * 60 * 60 * 1000;
/** A reset link is short-lived: it grants the account to whoever reads the mailbox. */
export const RESET_LIFETIME_MS = 60 * 60 * 1000;

export const hashToken = (token: string) => crypto.createHash('sha256').update(token).digest('hex');

/** Makes a one-time token for a user; only its hash is stored, the token itself goes in the e-mail. */
export function createInvitation(
  em: EntityManager,
  user: User,
  now = new Date(),
  purpose: LinkPurpose = 'invite',
): { invitation: Invitation; token: string } {
  const token = crypto.randomBytes(32).toString('base64url');
  const invitation = em.create(Invitation, {
    user,
    purpose,
    tokenHash: hashToken(token),
    expiresAt: new Date(now.getTime() + (purpose === 'reset' ? RESET_LIFETIME_MS : INVITATION_LIFETIME_MS)),
    usedAt: null,
    createdAt: now,
    updatedAt: now,
  });
  return { invitation, token };
}

export function invitationEmail(opts: { name: string; inviter: string; organization: string; link: string }): {
  subject: string;
  text: string;
} {
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

export function resetEmail(opts: { name: string; link: string }): { subject: string; text: string } {
  return {
    subject: 'Choose a new Sightfan password',
    text: [
      `Hello ${opts.name},`,
      '',
      'Someone (we hope you) asked to choose a new password for your Sightfan account.',
      'Choose it with this link (it works once and for 1 hour):',
      '',
      opts.link,
      '',
      'If you did not ask, ignore this message: your password stays as it is.',
    ].join('\n'),
  };
}

export function passwordChangedEmail(opts: { name: string }): { subject: string; text: string } {
  return {
    subject: 'Your Sightfan password was changed',
    text: [
      `Hello ${opts.name},`,
      '',
      'The password of your Sightfan account was just changed, and your other sessions were signed out.',
      'If this was not you, ask for a new password from the sign-in page at once and tell your administrator.',
    ].join('\n'),
  };
}
