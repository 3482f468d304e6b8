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
    const address = req.ip ?? 'unknown';
    const wait = await limiter.waitSeconds(body.email, address);
    if (wait > 0) {
      throw new HttpError(429, 'Too many sign-in attempts for now.', undefined, { 'Retry-After': String(wait) });
    }
    const em = orm.em.fork();
    const user = await em.findOne(User, { email: body.email }, { populate: ['organization', 'passwordHash'] });
    const ok = await verifyPassword(body.password, user?.passwordHash);
    if (!user || !ok) {
      await limiter.recordFailure(body.email, address);
      throw new HttpError(401, WRONG);
    }
    await limiter.recordSuccess(body.email);
    if (user.disabled) throw new HttpError(403, 'This account has been turned off. Ask your administrator to turn it back on.');
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
