/**
 * Sending one file to `POST /api/projects/:id/files` with XMLHttpRequest, because fetch reports no
 * upload progress. Pure of React: the hook (use-upload.ts) keeps the state. Checks a file on the
 * client first with the contract's own limits and sentences (shared/schemas/files.ts), so a phone
 * does not send 30 MB to hear "too large".
 */
import { ApiError } from '@/shared/api-client';
import { FILE_LIMITS, FILE_MESSAGES, fileDto, type FileDto, type FileKind } from '@/shared/schemas/files';

/** What the client knows of a chosen file (a browser `File` has all three). */
export interface ChosenFile {
  name: string;
  size: number;
  /** The browser's guess from the name; may be empty. The server decides from the bytes. */
  type: string;
}

/** Said when the connection drops while sending. Retrying makes sense. */
export const UPLOAD_DROPPED = 'The connection dropped while the file was being sent, so nothing was saved. Check the signal and try again.';
/** Said when the server answers something that is not the file it should have stored. */
export const UPLOAD_ODD_ANSWER = 'The server answered in a way Sightfan did not expect, so the file may not be saved. Try again.';

const TYPE_BY_EXTENSION: Record<string, string> = {
  png: 'image/png',
  jpg: 'image/jpeg',
  jpeg: 'image/jpeg',
  pdf: 'application/pdf',
};

/** The type the browser gave, or (when it gave none) the one the name's ending suggests. */
function claimedType(file: ChosenFile): string {
  if (file.type) return file.type.toLowerCase();
  const ext = /\.([a-z0-9]+)$/i.exec(file.name)?.[1]?.toLowerCase() ?? '';
  return TYPE_BY_EXTENSION[ext] ?? '';
}

/**
 * The sentence that stops this file before it is sent, or null when it may be sent. The same words
 * as the server's: a file the client lets through may still be refused from its bytes.
 */
export function checkBeforeUpload(file: ChosenFile, kind: FileKind): string | null {
  if (file.size === 0) return FILE_MESSAGES.empty;
  if (file.size > FILE_LIMITS.fileBytes) return FILE_MESSAGES.tooLarge;
  const type = claimedType(file);
  if (type === 'application/pdf') return kind === 'photo' ? FILE_MESSAGES.pdfPhoto : null;
  if (type === 'image/png' || type === 'image/jpeg') return null;
  return FILE_MESSAGES.wrongType;
}

/** Whether trying the same file again can help: a dropped connection or a server fault, not a refusal. */
export function retryHelps(error: unknown): boolean {
  if (!(error instanceof ApiError)) return false;
  return error.status === 0 || error.status === 408 || error.status === 429 || error.status >= 500;
}

/** The form the route reads: field `file`, `kind`, and for a photo its mirror, for a PDF plan its page. */
export function uploadForm(
  file: Blob,
  name: string,
  kind: FileKind,
  extra: { placementId?: number | null; page?: number | null } = {},
): FormData {
  const form = new FormData();
  form.append('kind', kind);
  if (kind === 'photo' && extra.placementId != null) form.append('placementId', String(extra.placementId));
  if (kind === 'plan' && extra.page != null) form.append('page', String(extra.page));
  form.append('file', file, name);
  return form;
}

/** The thrown error when the person cancels; not shown as a failure. */
export class UploadCancelled extends Error {
  constructor() {
    super('The upload was cancelled.');
    this.name = 'UploadCancelled';
  }
}

export interface SendOptions {
  url: string;
  form: FormData;
  /** Bytes sent so far and the request's whole size (the multipart body, a little more than the file). */
  onProgress?: (sent: number, total: number) => void;
  /** For tests: a stand-in for the browser's XMLHttpRequest. */
  makeRequest?: () => XMLHttpRequest;
}

export interface SentUpload {
  promise: Promise<FileDto>;
  /** Stops sending; the promise rejects with UploadCancelled and the server keeps nothing. */
  cancel: () => void;
}

/** A failure status with no sentence of the server's own: the contract's words where it has them. */
function fallbackSentence(status: number): string {
  if (status === 413) return FILE_MESSAGES.tooLarge;
  if (status === 415) return FILE_MESSAGES.wrongType;
  if (status === 422) return FILE_MESSAGES.unreadable;
  return `The server answered ${status} without an explanation. Try again in a moment.`;
}

function parseJson(text: string): unknown {
  try {
    return text ? JSON.parse(text) : undefined;
  } catch {
    return undefined;
  }
}

/** Sends the form; progress as it goes; resolves with the stored file's description (201). */
export function sendUpload({ url, form, onProgress, makeRequest }: SendOptions): SentUpload {
  const xhr = makeRequest ? makeRequest() : new XMLHttpRequest();
  const promise = new Promise<FileDto>((resolve, reject) => {
    xhr.open('POST', url);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.addEventListener('progress', (e) => {
      if (e.lengthComputable) onProgress?.(e.loaded, e.total);
    });
    xhr.addEventListener('error', () => reject(new ApiError(0, UPLOAD_DROPPED)));
    xhr.addEventListener('timeout', () => reject(new ApiError(0, UPLOAD_DROPPED)));
    xhr.addEventListener('abort', () => reject(new UploadCancelled()));
    xhr.addEventListener('load', () => {
      const body = parseJson(xhr.responseText) as { file?: unknown; error?: unknown; fields?: Record<string, string> } | undefined;
      if (xhr.status >= 200 && xhr.status < 300) {
        const parsed = fileDto.safeParse(body?.file);
        if (parsed.success) resolve(parsed.data);
        else reject(new ApiError(xhr.status, UPLOAD_ODD_ANSWER));
        return;
      }
      const fields = body?.fields ?? {};
      // The field's own sentence when the server put the reason there (e.g. `file` or `page`).
      const sentence = typeof body?.error === 'string' ? body.error : (Object.values(fields)[0] ?? fallbackSentence(xhr.status));
      const retry = Number(xhr.getResponseHeader('Retry-After'));
      reject(new ApiError(xhr.status, sentence, fields, Number.isFinite(retry) && retry > 0 ? retry : undefined));
    });
    xhr.send(form);
  });
  return { promise, cancel: () => xhr.abort() };
}
