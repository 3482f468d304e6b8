import { Router } from 'express';
import type { EntityManager } from '@mikro-orm/knex';
import { idParam, inviteBody, patchUserBody } from '../../../shared/schemas';
import { HttpError, notFound } from '../../http-error';
import { loadUserDetails, requireRole } from '../../middleware/auth';
import { parseOr400 } from '../../middleware/validate';
import type { MailDispatcher } from '../mail/outbox';
import { queueMail } from '../mail/outbox';
import type { OrmSessionStore } from '../sessions/orm-session-store';
import { createInvitation, invitationEmail } from './invitations';
import { Invitation } from './invitation.entity';
import { User } from './user.entity';
import { onDuplicate } from '../../write-conflicts';
import { requestEm } from '../../middleware/request-context';
import { toUserDto } from './user.dto';

onDuplicate(
  'user.email',
  () =>
    new HttpError(409, 'Someone already has an account with this e-mail address.', {
      email: 'This e-mail address already has an account.',
    }),
);

/** Adds an invitation and the e-mail carrying its link to `em`'s unit of work. */
function queueInvitation(em: EntityManager, user: User, inviter: User, baseUrl: string): void {
  const { token } = createInvitation(em, user);
  const link = `${baseUrl}/set-password?token=${token}`;
  const mail = invitationEmail({ name: user.name, inviter: inviter.name, organization: inviter.organization.name, link });
  queueMail(em, { organizationId: inviter.organization.id, kind: 'invitation', to: user.email, ...mail });
}

export function usersRoutes(deps: { outbox: MailDispatcher; store: OrmSessionStore; publicUrl: (host: string) => string }): Router {
  const { outbox, store } = deps;
  const r = Router();
  r.use(requireRole('admin'));
  // Answers name the organisation (the inviter's, a new user's): loadUser reads only its id.
  r.use(async (req, _res, next) => {
    await loadUserDetails(req.user!);
    next();
  });

  r.get('/', async (req, res) => {
    const users = await requestEm().find(
      User,
      { organization: req.user!.organization.id },
      { populate: ['organization', 'passwordHash'], orderBy: { name: 'asc', id: 'asc' } },
    );
    res.json({ users: users.map(toUserDto) });
  });

  r.post('/', async (req, res) => {
    const body = parseOr400(inviteBody, req.body, 'The invitation');
    const em = requestEm();
    const existing = await em.findOne(User, { email: body.email }, { populate: ['passwordHash'] });
    if (existing && existing.organization.id === req.user!.organization.id && !existing.passwordHash && !existing.disabled) {
      throw new HttpError(
        409,
        `${existing.name} is already invited and has not chosen a password yet. Use "Invite again" in the list to send a new link.`,
        {
          email: 'Already invited: use "Invite again" in the list.',
        },
      );
    }
    if (existing) {
      throw new HttpError(409, 'Someone already has an account with this e-mail address.', {
        email: 'This e-mail address already has an account.',
      });
    }
    const user = em.create(User, {
      organization: req.user!.organization.id,
      email: body.email,
      name: body.name,
      role: body.role,
      passwordHash: null,
      disabled: false,
      units: 'metric',
    });
    const inviter = req.user!;
    queueInvitation(em, user, inviter, deps.publicUrl(req.get('host') ?? 'localhost'));
    // One transaction: the account, its invitation and the e-mail carrying the link. Two admins
    // inviting the same address at once: the unique index answers, mapped to 409 above.
    await em.flush();
    outbox.kick();
    res.status(201).json({ user: toUserDto(user) });
  });

  /** A new invitation for someone who has not set a password yet; earlier links stop working. */
  r.post('/:id/invitation', async (req, res) => {
    const id = parseOr400(idParam, req.params.id, 'The address');
    const em = requestEm();
    const user = await em.findOne(User, { id, organization: req.user!.organization.id }, { populate: ['organization', 'passwordHash'] });
    if (!user) throw notFound('That user');
    if (user.passwordHash) {
      throw new HttpError(
        409,
        `${user.name} has already chosen a password. If they forgot it, they can ask for a reset link on the sign-in page.`,
      );
    }
    if (user.disabled) throw new HttpError(409, `${user.name}'s account is turned off; turn it on before inviting them again.`);
    await em.nativeUpdate(Invitation, { user: user.id, usedAt: null }, { usedAt: new Date() });
    queueInvitation(em, user, req.user!, deps.publicUrl(req.get('host') ?? 'localhost'));
    await em.flush();
    outbox.kick();
    res.status(201).json({ user: toUserDto(user) });
  });

  r.patch('/:id', async (req, res) => {
    const id = parseOr400(idParam, req.params.id, 'The address');
    const body = parseOr400(patchUserBody, req.body, 'The change');
    const em = requestEm();
    const user = await em.findOne(User, { id, organization: req.user!.organization.id }, { populate: ['organization', 'passwordHash'] });
    if (!user) throw notFound('That user');
    if (user.id === req.user!.id && (body.disabled === true || (body.role && body.role !== 'admin'))) {
      throw new HttpError(409, 'You cannot turn off or demote your own account; ask another administrator.', {
        [body.disabled === true ? 'disabled' : 'role']: 'Not for your own account.',
      });
    }
    if (body.role) user.role = body.role;
    if (body.disabled !== undefined) user.disabled = body.disabled;
    await em.flush();
    if (user.disabled) await store.destroyForUser(user.id);
    res.json({ user: toUserDto(user) });
  });

  return r;
}
