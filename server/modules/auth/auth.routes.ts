import { Router, type Request } from 'express';
import { signInBody, updateMeBody } from '../../../shared/schemas';
import type { Orm } from '../../db';
import { HttpError } from '../../http-error';
import { requireUser } from '../../middleware/auth';
import { parseOr400 } from '../../middleware/validate';
import { User } from '../users/user.entity';
import { toUserDto } from '../users/user.dto';
import { verifyPassword } from './passwords';
import type { SignInLimiter } from './sign-in-limiter';

const WRONG = 'That e-mail address and password do not match an account. Check both and try again.';

/** Starts a fresh session for the user (a new id defeats session fixation). */
export async function startSession(req: Request, userId: number): Promise<void> {
  await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
  req.session.userId = userId;
  await new Promise<void>((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
}

export function authRoutes(orm: Orm, limiter: SignInLimiter): Router {
  const r = Router();

  r.post('/sign-in', async (req, res) => {
    const body = parseOr400(signInBody, req.body, 'Sign-in');
    // req.ip honours X-Forwarded-For only for the configured number of trusted proxy hops.
    const address = req.ip ?? req.socket.remoteAddress ?? 'unknown';
    const admission = await limiter.admit(body.email, address);
    if (!admission.ok) {
      throw new HttpError(429, 'Too many sign-in attempts for now.', undefined, { 'Retry-After': String(admission.retryAfterS) });
    }
    const em = orm.em.fork();
    const user = await em.findOne(User, { email: body.email }, { populate: ['organization', 'passwordHash'] });
    const ok = await verifyPassword(body.password, user?.passwordHash);
    // A turned-off account answers exactly as a wrong password does, right password or not, so a
    // guesser cannot use it to confirm a password.
    if (!user || !ok || user.disabled) {
      await admission.release(false);
      throw new HttpError(401, WRONG);
    }
    await admission.release(true);
    await startSession(req, user.id);
    res.json({ user: toUserDto(user) });
  });

  r.post('/sign-out', async (req, res) => {
    await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
    res.clearCookie('sightfan.sid', { path: '/' });
    res.status(204).end();
  });

  r.get('/me', requireUser, (req, res) => {
    res.json({ user: toUserDto(req.user!) });
  });

  r.patch('/me', requireUser, async (req, res) => {
    const body = parseOr400(updateMeBody, req.body, 'Your settings');
    const em = orm.em.fork();
    const user = await em.findOneOrFail(User, { id: req.user!.id }, { populate: ['organization', 'passwordHash'] });
    if (body.units) user.units = body.units;
    if (body.name) user.name = body.name;
    await em.flush();
    res.json({ user: toUserDto(user) });
  });

  return r;
}
