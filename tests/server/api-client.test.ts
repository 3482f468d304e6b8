import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { ApiError, createApiClient } from '../../shared/api-client';
import { describeError } from '../../shared/errors';
import { EMAIL, PASSWORD, startHarness, type Harness } from './harness';

// The shared client against the real app over real HTTP (Node's fetch; it keeps no cookies,
// so each call here is a fresh, signed-out client unless it carries the cookie by hand).
let h: Harness;
let server: Server;
let baseUrl: string;
beforeAll(async () => {
  h = await startHarness();
  server = h.app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  await new Promise((r) => server.close(r));
  await h.close();
});

describe('the typed API client', () => {
  it('returns the user on a good sign-in', async () => {
    const api = createApiClient({ baseUrl });
    const { user } = await api.auth.signIn({ email: EMAIL.installer, password: PASSWORD });
    expect(user.role).toBe('installer');
  });

  it('throws an ApiError carrying the server sentence and field messages', async () => {
    const api = createApiClient({ baseUrl });
    const err = await api.auth.signIn({ email: 'bad', password: '' }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ApiError);
    expect((err as ApiError).status).toBe(400);
    expect((err as ApiError).fields.password).toBe('Enter your password.');
  });

  it('throws 401 for /me when no cookie is sent, with a sentence a person can act on', async () => {
    const err = await createApiClient({ baseUrl })
      .auth.me()
      .catch((e: unknown) => e);
    expect((err as ApiError).status).toBe(401);
    expect(describeError(err)).toBe('You are signed out. Sign in to continue.');
  });

  it('turns an unreachable server into a sentence rather than a TypeError', async () => {
    const err = await createApiClient({ baseUrl: 'http://127.0.0.1:9' })
      .auth.me()
      .catch((e: unknown) => e);
    expect((err as ApiError).status).toBe(0);
    expect(describeError(err)).toMatch(/cannot reach its server/);
  });

  it('adds the wait to a 429 message', () => {
    expect(describeError(new ApiError(429, 'Too many sign-in attempts for now.', {}, 120))).toBe(
      'Too many sign-in attempts for now. Try again in 2 minutes.',
    );
    expect(describeError(new ApiError(429, 'Too many sign-in attempts for now.', {}, 30))).toBe(
      'Too many sign-in attempts for now. Try again in 30 seconds.',
    );
  });
});
