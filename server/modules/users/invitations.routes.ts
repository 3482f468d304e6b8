import { Router } from 'express';
import { acceptInvitationBody, invitationToken } from '../../../shared/schemas';
import { HttpError } from '../../http-error';
import { parseOr400 } from '../../middleware/validate';
import { hashPassword } from '../auth/passwords';
import { startSession } from '../auth/auth.routes';
import { Invitation } from './invitation.entity';
import { hashToken } from './invitations';
import { toUserDto } from './user.dto';
import type { EntityManager } from '@mikro-orm/knex';
import type { OrmSessionStore } from '../sessions/orm-session-store';
import { requestEm } from '../../middleware/request-context';

async function usableInvitation(em: EntityManager, token: string): Promise<Invitation> {
  const inv = await em.findOne(Invitation, { tokenHash: hashToken(token) }, { populate: ['user', 'user.organization'] });
  if (!inv)
    throw new HttpError(
      404,
      'This link is not valid. Ask your administrator for a new invitation, or ask for a new password from the sign-in page.',
    );
  const again = inv.purpose === 'reset' ? 'ask for a new link from the sign-in page' : 'ask your administrator for a new invitation';
  if (inv.usedAt)
    throw new HttpError(
      410,
      `This link has already been used or replaced by a newer one. Sign in with the password you chose, or ${again}.`,
    );
  if (inv.expiresAt.getTime() <= Date.now()) throw new HttpError(410, `This link has expired. Please ${again}.`);
  if (inv.user.disabled) throw new HttpError(410, 'This account has been turned off. Ask your administrator.');
  return inv;
}

export function invitationsRoutes(bcryptCost: number, store: OrmSessionStore): Router {
  const r = Router();

  r.get('/:token', async (req, res) => {
    const token = parseOr400(invitationToken, req.params.token, 'The link');
    const inv = await usableInvitation(requestEm(), token);
    res.json({
      invitation: { email: inv.user.email, name: inv.user.name, organizationName: inv.user.organization.name, purpose: inv.purpose },
    });
  });

  r.post('/accept', async (req, res) => {
    const body = parseOr400(acceptInvitationBody, req.body, 'The new password');
    const em = requestEm();
    const inv = await usableInvitation(em, body.token);
    const hash = await hashPassword(body.password, bcryptCost);
    // Mark used and set the password in one guarded update, so two clicks cannot both succeed.
    const claimed = await em.nativeUpdate(Invitation, { id: inv.id, usedAt: null }, { usedAt: new Date() });
    if (claimed !== 1) throw new HttpError(410, 'This link has already been used. Sign in with the password you chose.');
    inv.user.passwordHash = hash;
    await em.flush();
    // A reset ends every session the account had: whoever knew the old password is signed out.
    if (inv.purpose === 'reset') await store.destroyForUser(inv.user.id);
    await startSession(req, inv.user.id);
    res.json({ user: toUserDto(inv.user) });
  });

  return r;
}
