/**
 * The one typed client for Sightfan's HTTP API, used by the app's hooks and by tests.
 * It knows the routes and the shapes (from shared/schemas); it does not know React.
 */
import type {
  AcceptInvitationBody,
  ApiErrorBody,
  InvitationDto,
  InviteBody,
  OutboxResponse,
  PatchUserBody,
  SignInBody,
  UpdateMeBody,
  UserResponse,
  UsersResponse,
} from './schemas';

/** An answer from the API that was not a success, carrying the server's sentence and field messages. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly fields: Record<string, string> = {},
    readonly retryAfterS?: number,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

export type FetchLike = (input: string, init?: RequestInit) => Promise<Response>;

export interface ApiClientOptions {
  /** '' for the same origin (the served app); e.g. http://localhost:8080 for the dev server. */
  baseUrl?: string;
  fetch?: FetchLike;
}

export function createApiClient(options: ApiClientOptions = {}) {
  const baseUrl = (options.baseUrl ?? '').replace(/\/$/, '');
  const doFetch: FetchLike = options.fetch ?? ((input, init) => fetch(input, init));

  async function request<T>(method: string, path: string, body?: unknown): Promise<T> {
    let res: Response;
    try {
      res = await doFetch(`${baseUrl}/api${path}`, {
        method,
        credentials: 'include',
        headers: body === undefined ? { Accept: 'application/json' } : { Accept: 'application/json', 'Content-Type': 'application/json' },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
    } catch {
      throw new ApiError(0, 'Sightfan cannot reach its server. Check the connection and try again; nothing you typed is lost.');
    }
    if (res.status === 204) return undefined as T;
    const text = await res.text();
    let data: unknown = undefined;
    if (text) {
      try {
        data = JSON.parse(text);
      } catch {
        data = undefined;
      }
    }
    if (!res.ok) {
      const errBody = (data ?? {}) as Partial<ApiErrorBody>;
      const retry = Number(res.headers.get('Retry-After'));
      throw new ApiError(
        res.status,
        typeof errBody.error === 'string' ? errBody.error : `The server answered ${res.status} without an explanation. Try again in a moment.`,
        errBody.fields ?? {},
        Number.isFinite(retry) && retry > 0 ? retry : undefined,
      );
    }
    return data as T;
  }

  return {
    auth: {
      signIn: (body: SignInBody) => request<UserResponse>('POST', '/auth/sign-in', body),
      signOut: () => request<void>('POST', '/auth/sign-out'),
      me: () => request<UserResponse>('GET', '/auth/me'),
      updateMe: (body: UpdateMeBody) => request<UserResponse>('PATCH', '/auth/me', body),
    },
    invitations: {
      get: (token: string) => request<{ invitation: InvitationDto }>('GET', `/invitations/${encodeURIComponent(token)}`),
      accept: (body: AcceptInvitationBody) => request<UserResponse>('POST', '/invitations/accept', body),
    },
    users: {
      list: () => request<UsersResponse>('GET', '/users'),
      invite: (body: InviteBody) => request<UserResponse>('POST', '/users', body),
      update: (id: number, body: PatchUserBody) => request<UserResponse>('PATCH', `/users/${id}`, body),
    },
    outbox: {
      list: () => request<OutboxResponse>('GET', '/outbox'),
    },
  };
}

export type ApiClient = ReturnType<typeof createApiClient>;
