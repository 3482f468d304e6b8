import { Router, type Request } from 'express';
import {
  changePasswordBody,
  FORGOT_PASSWORD_ANSWER,
  forgotPasswordBody,
  signInBody,
  updateMeBody,
  type ForgotPasswordResponse,
} from '../../../shared/schemas';
import { HttpError } from '../../http-error';
import { loadUserDetails, requireUser } from '../../middleware/auth';
import { parseOr400 } from '../../middleware/validate';
import { User } from '../users/user.entity';
import { toUserDto } from '../users/user.dto';
import { hashPassword, verifyPassword } from './passwords';
import { queueMail, type MailDispatcher } from '../mail/outbox';
import type { OrmSessionStore } from '../sessions/orm-session-store';
import { Invitation } from '../users/invitation.entity';
import { createInvitation, passwordChangedEmail, resetEmail } from '../users/invitations';
import type { SignInLimiter } from './sign-in-limiter';
import type { Orm } from '../../db';
import { DbRateLimiter } from '../limits/db-rate-limiter';
import { requestEm } from '../../middleware/request-context';

const WRONG = 'That e-mail address and password do not match an account. Check both and try again.';

/** Starts a fresh session for the user (a new id defeats session fixation). */
export async function startSession(req: Request, userId: number): Promise<void> {
  await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
  req.session.userId = userId;
  await new Promise<void>((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
}

export interface AuthDeps {
  /** For the shared rate-limit counters (the database), not for request work: that is `requestEm()`. */
  orm: Orm;
  limiter: SignInLimiter;
  store: OrmSessionStore;
  outbox: MailDispatcher;
  bcryptCost: number;
  publicUrl: (host: string) => string;
}

export function authRoutes(deps: AuthDeps): Router {
  const { limiter } = deps;
  const r = Router();
  // "Forgot password" mail per address and per client: enough for a person, too few to mail-bomb anyone.
  const resetsPerEmail = new DbRateLimiter(deps.orm, { keyPrefix: 'reset-mail', points: 3, duration: 60 * 60 });
  const resetsPerAddress = new DbRateLimiter(deps.orm, { keyPrefix: 'reset-addr', points: 20, duration: 60 * 60 });

  r.post('/sign-in', async (req, res) => {
    const body = parseOr400(signInBody, req.body, 'Sign-in');
    // req.ip honours X-Forwarded-For only for the configured number of trusted proxy hops.
    const address = req.ip ?? req.socket.remoteAddress ?? 'unknown';
    const admission = await limiter.admit(body.email, address);
    if (!admission.ok) {
      throw new HttpError(429, 'Too many sign-in attempts for now.', undefined, { 'Retry-After': String(admission.retryAfterS) });
    }
    const em = requestEm();
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

  // The app's start-up probe: a signed-out visitor is expected, so it is a 200 with no user
  // (a 401 here put a failed request in every visitor's browser console).
  r.get('/session', async (req, res) => {
    if (req.user) await loadUserDetails(req.user);
    res.json({ user: req.user ? toUserDto(req.user) : null });
  });

  r.get('/me', requireUser, async (req, res) => {
    await loadUserDetails(req.user!);
    res.json({ user: toUserDto(req.user!) });
  });

  r.patch('/me', requireUser, async (req, res) => {
    const body = parseOr400(updateMeBody, req.body, 'Your settings');
    const em = requestEm();
    // loadUser found the user through this request's entity manager: change it and flush.
    const user = req.user!;
    if (body.units) user.units = body.units;
    if (body.name) user.name = body.name;
    await em.flush();
    await loadUserDetails(user);
    res.json({ user: toUserDto(user) });
  });

  /** Change my password: the current one is required; my other sessions end, this one stays. */
  r.post('/password', requireUser, async (req, res) => {
    const body = parseOr400(changePasswordBody, req.body, 'The new password');
    const me = req.user!;
    const admission = await limiter.admit(me.email, req.ip ?? 'unknown');
    if (!admission.ok)
      throw new HttpError(429, 'Too many password attempts for now.', undefined, { 'Retry-After': String(admission.retryAfterS) });
    const em = requestEm();
    const user = me;
    await loadUserDetails(user);
    if (!(await verifyPassword(body.currentPassword, user.passwordHash))) {
      await admission.release(false);
      throw new HttpError(400, 'Your current password is not right; nothing was changed.', {
        currentPassword: 'This is not your current password.',
      });
    }
    await admission.release(true);
    user.passwordHash = await hashPassword(body.password, deps.bcryptCost);
    queueMail(em, {
      organizationId: user.organization.id,
      kind: 'password-changed',
      to: user.email,
      ...passwordChangedEmail({ name: user.name }),
    });
    await em.flush();
    await deps.store.destroyForUser(user.id, req.sessionID);
    deps.outbox.kick();
    res.json({ user: toUserDto(user) });
  });

  /**
   * Forgot password: e-mails a one-time link when the address has an active account. The answer
   * is the same either way, so it tells nobody which addresses have accounts.
   */
  r.post('/password-reset', async (req, res) => {
    const body = parseOr400(forgotPasswordBody, req.body, 'The request');
    const answer: ForgotPasswordResponse = { message: FORGOT_PASSWORD_ANSWER };
    const allowed = await Promise.all([resetsPerEmail.consume(body.email), resetsPerAddress.consume(req.ip ?? 'unknown')]).then(
      () => true,
      () => false,
    );
    const em = requestEm();
    const user = allowed ? await em.findOne(User, { email: body.email, disabled: false }, { populate: ['organization'] }) : null;
    if (user) {
      // Earlier reset links stop working; only the newest one counts.
      await em.nativeUpdate(Invitation, { user: user.id, purpose: 'reset', usedAt: null }, { usedAt: new Date() });
      const { token } = createInvitation(em, user, new Date(), 'reset');
      const link = `${deps.publicUrl(req.get('host') ?? 'localhost')}/set-password?token=${token}`;
      queueMail(em, {
        organizationId: user.organization.id,
        kind: 'password-reset',
        to: user.email,
        ...resetEmail({ name: user.name, link }),
      });
      await em.flush();
      deps.outbox.kick();
    }
    res.status(202).json(answer);
  });

  return r;
}
