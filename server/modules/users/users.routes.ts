import { Router } from 'express';
import { idParam, inviteBody, patchUserBody } from '../../../shared/schemas';
import type { Orm } from '../../db';
import { HttpError, notFound } from '../../http-error';
import { requireRole } from '../../middleware/auth';
import { parseOr400 } from '../../middleware/validate';
import type { Mailer } from '../mail/mailer';
import type { OrmSessionStore } from '../sessions/orm-session-store';
import { createInvitation, invitationEmail } from './invitations';
import { User } from './user.entity';
import { onDuplicate } from '../../write-conflicts';

onDuplicate('user.email', () => new HttpError(409, 'Someone already has an account with this e-mail address.', { email: 'This e-mail address already has an account.' }));
import { toUserDto } from './user.dto';

export function usersRoutes(deps: { orm: Orm; mailer: Mailer; store: OrmSessionStore; publicUrl: (host: string) => string }): Router {
  const { orm, mailer, store } = deps;
  const r = Router();
  r.use(requireRole('admin'));

  r.get('/', async (req, res) => {
    const users = await orm.em.fork().find(
      User,
      { organization: req.user!.organization.id },
      { populate: ['organization', 'passwordHash'], orderBy: { name: 'asc', id: 'asc' } },
    );
    res.json({ users: users.map(toUserDto) });
  });

  r.post('/', async (req, res) => {
    const body = parseOr400(inviteBody, req.body, 'The invitation');
    const em = orm.em.fork();
    const user = em.create(User, {
      organization: req.user!.organization.id,
      email: body.email,
      name: body.name,
      role: body.role,
      passwordHash: null,
      disabled: false,
      units: 'metric',
    });
    const { token } = createInvitation(em, user);
    await em.flush();
    await em.populate(user, ['organization']);
    const link = `${deps.publicUrl(req.get('host') ?? 'localhost')}/set-password?token=${token}`;
    const mail = invitationEmail({ name: user.name, inviter: req.user!.name, organization: user.organization.name, link });
    try {
      await mailer.send({ to: user.email, ...mail });
    } catch {
      // The account exists; the admin can see it and invite again, so nothing is lost.
      throw new HttpError(502, `The account for ${user.email} was created, but the invitation e-mail could not be sent. Check the mail settings, then invite again.`);
    }
    res.status(201).json({ user: toUserDto(user) });
  });

  r.patch('/:id', async (req, res) => {
    const id = parseOr400(idParam, req.params.id, 'The address');
    const body = parseOr400(patchUserBody, req.body, 'The change');
    const em = orm.em.fork();
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
