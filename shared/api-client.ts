/**
 * The one typed client for Sightfan's HTTP API, used by the app's hooks and by tests.
 * It knows the routes and the shapes (from shared/schemas); it does not know React.
 */
import type {
  CatalogueItemDto,
  CreateCatalogueItemBody,
  CreatePlacementBody,
  CreateProjectBody,
  PatchCatalogueItemBody,
  PatchPlacementBody,
  PatchProjectBody,
  PlacementRemoveResponse,
  PlacementWriteResponse,
  ProjectDto,
  ProjectSummaryDto,
  AcceptInvitationBody,
  ChangePasswordBody,
  ForgotPasswordBody,
  ForgotPasswordResponse,
  ApiErrorBody,
  InvitationDto,
  InviteBody,
  OutboxResponse,
  PatchUserBody,
  SignInBody,
  UpdateMeBody,
  SessionResponse,
  UserResponse,
  UsersResponse,
  SheetEmailBody,
  SheetEmailResponse,
  SheetRecipientDto,
  SheetIssueResponse,
  SheetPaper,
  SheetStatusDto,
  ApproveProjectBody,
  CommentResponse,
  CommentsResponse,
  CreateCommentBody,
  PatchCommentBody,
  ProjectEventsResponse,
  ReturnProjectBody,
  ReviewersResponse,
  SendProjectBody,
} from './schemas';

/** An answer from the API that was not a success, carrying the server's sentence and field messages. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly fields: Record<string, string> = {},
    readonly retryAfterS?: number,
    /** On 409, the record as it now stands on the server. */
    readonly current?: unknown,
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
        typeof errBody.error === 'string'
          ? errBody.error
          : `The server answered ${res.status} without an explanation. Try again in a moment.`,
        errBody.fields ?? {},
        Number.isFinite(retry) && retry > 0 ? retry : undefined,
        (data as { current?: unknown } | undefined)?.current,
      );
    }
    return data as T;
  }

  /** A file from the API (the sheet PDF): its bytes, the server's filename and its revision. */
  async function download(path: string, fallbackName: string): Promise<{ blob: Blob; filename: string; revision: number | null }> {
    let res: Response;
    try {
      res = await doFetch(`${baseUrl}/api${path}`, { method: 'GET', credentials: 'include', headers: { Accept: 'application/pdf' } });
    } catch {
      throw new ApiError(0, 'Sightfan cannot reach its server. Check the connection and try again.');
    }
    if (!res.ok) {
      let body: Partial<ApiErrorBody> = {};
      try {
        body = (await res.json()) as Partial<ApiErrorBody>;
      } catch {
        body = {};
      }
      throw new ApiError(
        res.status,
        typeof body.error === 'string' ? body.error : `The server answered ${res.status} without an explanation. Try again in a moment.`,
        body.fields ?? {},
      );
    }
    const disposition = res.headers.get('Content-Disposition') ?? '';
    const filename = /filename="([^"]+)"/.exec(disposition)?.[1] ?? fallbackName;
    const revision = Number(res.headers.get('X-Sheet-Revision'));
    return { blob: await res.blob(), filename, revision: Number.isInteger(revision) && revision > 0 ? revision : null };
  }

  return {
    auth: {
      signIn: (body: SignInBody) => request<UserResponse>('POST', '/auth/sign-in', body),
      signOut: () => request<void>('POST', '/auth/sign-out'),
      me: () => request<UserResponse>('GET', '/auth/me'),
      /** Who is signed in, or `{ user: null }`: never a 401. */
      session: () => request<SessionResponse>('GET', '/auth/session'),
      updateMe: (body: UpdateMeBody) => request<UserResponse>('PATCH', '/auth/me', body),
      /** Needs the current password; the server ends this person's other sessions. */
      changePassword: (body: ChangePasswordBody) => request<UserResponse>('POST', '/auth/password', body),
      /** Always the same answer, whether or not the address has an account. */
      forgotPassword: (body: ForgotPasswordBody) => request<ForgotPasswordResponse>('POST', '/auth/password-reset', body),
    },
    invitations: {
      get: (token: string) => request<{ invitation: InvitationDto }>('GET', `/invitations/${encodeURIComponent(token)}`),
      accept: (body: AcceptInvitationBody) => request<UserResponse>('POST', '/invitations/accept', body),
    },
    users: {
      list: () => request<UsersResponse>('GET', '/users'),
      invite: (body: InviteBody) => request<UserResponse>('POST', '/users', body),
      update: (id: number, body: PatchUserBody) => request<UserResponse>('PATCH', `/users/${id}`, body),
      /** A new invitation link for someone who has not chosen a password; earlier links stop working. */
      reinvite: (id: number) => request<UserResponse>('POST', `/users/${id}/invitation`),
    },
    outbox: {
      list: () => request<OutboxResponse>('GET', '/outbox'),
      /** An attachment of a message in the outbox (a sheet PDF), as a file. */
      attachment: (id: number, index: number) => download(`/outbox/${id}/attachments/${index}`, `attachment-${id}-${index}.pdf`),
    },
    catalogue: {
      list: () => request<{ items: CatalogueItemDto[] }>('GET', '/catalogue'),
      create: (body: CreateCatalogueItemBody) => request<{ item: CatalogueItemDto }>('POST', '/catalogue', body),
      update: (id: number, body: PatchCatalogueItemBody) => request<{ item: CatalogueItemDto }>('PATCH', `/catalogue/${id}`, body),
    },
    projects: {
      list: (params: { q?: string; sort?: 'updated' | 'name' | 'customer' } = {}) => {
        const qs = new URLSearchParams();
        if (params.q) qs.set('q', params.q);
        if (params.sort) qs.set('sort', params.sort);
        const suffix = qs.toString() ? `?${qs.toString()}` : '';
        return request<{ projects: ProjectSummaryDto[] }>('GET', `/projects${suffix}`);
      },
      get: (id: number) => request<{ project: ProjectDto }>('GET', `/projects/${id}`),
      create: (body: CreateProjectBody) => request<{ project: ProjectDto }>('POST', '/projects', body),
      update: (id: number, body: PatchProjectBody) => request<{ project: ProjectDto }>('PATCH', `/projects/${id}`, body),
      remove: (id: number) => request<void>('DELETE', `/projects/${id}`),
      addPlacement: (id: number, body: CreatePlacementBody) => request<PlacementWriteResponse>('POST', `/projects/${id}/placements`, body),
      updatePlacement: (id: number, placementId: number, body: PatchPlacementBody) =>
        request<PlacementWriteResponse>('PATCH', `/projects/${id}/placements/${placementId}`, body),
      removePlacement: (id: number, placementId: number) =>
        request<PlacementRemoveResponse>('DELETE', `/projects/${id}/placements/${placementId}`),
      /** The owning installer sends the job for review (optionally to a named reviewer); an admin reassigns a job waiting for review. */
      send: (id: number, body: SendProjectBody) => request<{ project: ProjectDto }>('POST', `/projects/${id}/send`, body),
      /** A reviewer or admin approves the version they loaded (a stale version is 409). */
      approve: (id: number, body: ApproveProjectBody) => request<{ project: ProjectDto }>('POST', `/projects/${id}/approve`, body),
      /** A reviewer or admin returns the job with a reason (kept as a comment). */
      return: (id: number, body: ReturnProjectBody) => request<{ project: ProjectDto }>('POST', `/projects/${id}/return`, body),
      /** The read-only audit trail, oldest first. */
      events: (id: number) => request<ProjectEventsResponse>('GET', `/projects/${id}/events`),
    },
    comments: {
      list: (projectId: number) => request<CommentsResponse>('GET', `/projects/${projectId}/comments`),
      create: (projectId: number, body: CreateCommentBody) => request<CommentResponse>('POST', `/projects/${projectId}/comments`, body),
      /** The owning installer marks a thread resolved (or open again). */
      patch: (projectId: number, commentId: number, body: PatchCommentBody) =>
        request<CommentResponse>('PATCH', `/projects/${projectId}/comments/${commentId}`, body),
    },
    reviewers: {
      /** Reviewers and admins of the caller's organisation (whom a job can be sent to). */
      list: () => request<ReviewersResponse>('GET', '/reviewers'),
    },
    sheets: {
      status: (projectId: number) => request<SheetStatusDto>('GET', `/projects/${projectId}/sheet`),
      /** Issues a revision with the project's current content (or returns the latest, if unchanged). The only call that issues one. */
      issue: (projectId: number) => request<SheetIssueResponse>('POST', `/projects/${projectId}/sheet/revisions`),
      /** The address of an issued revision's PDF (a GET: it changes nothing). */
      pdfPath: (projectId: number, revision: number, paper?: SheetPaper) => `${baseUrl}/api${sheetPdfPath(projectId, revision, paper)}`,
      download: (projectId: number, revision: number, paper?: SheetPaper) =>
        download(sheetPdfPath(projectId, revision, paper), `sightfan-project-${projectId}-rev${revision}.pdf`),
      email: (projectId: number, body: SheetEmailBody) => request<SheetEmailResponse>('POST', `/projects/${projectId}/sheet/email`, body),
      recipient: (projectId: number, to: string) =>
        request<SheetRecipientDto>('GET', `/projects/${projectId}/sheet/recipient?to=${encodeURIComponent(to)}`),
    },
  };
}

export type ApiClient = ReturnType<typeof createApiClient>;

function sheetPdfPath(projectId: number, revision: number, paper?: SheetPaper): string {
  return `/projects/${projectId}/sheet.pdf?revision=${revision}${paper ? `&paper=${paper}` : ''}`;
}
