/**
 * One upload control's state: checked on the client, sending (with the share sent), cancelled,
 * failed (with the server's sentence and whether trying again can help), or done. The chosen file
 * is kept until the next choice so "Try again" sends the same file after a dropped connection.
 * An upload outlives its control: leaving the screen does not cancel it.
 */
import { useCallback, useEffect, useRef, useState } from 'react';
import { uploadAddress } from '@/hooks/use-files';
import { describeError } from '@/shared/errors';
import type { FileDto, FileKind } from '@/shared/schemas/files';
import { checkBeforeUpload, retryHelps, sendUpload, uploadForm, UploadCancelled, type SendOptions } from './upload-request';

export type UploadState =
  | { phase: 'idle' }
  | { phase: 'sending'; name: string; sent: number; total: number }
  | { phase: 'cancelled'; name: string }
  | { phase: 'failed'; name: string; message: string; canRetry: boolean }
  | { phase: 'done'; name: string };

export interface UseUploadOptions {
  projectId: number;
  kind: FileKind;
  placementId?: number | null;
  /** For a PDF plan: the page to take (1 when absent). */
  page?: number | null;
  onUploaded: (file: FileDto) => void;
  /** For tests: a stand-in for XMLHttpRequest. */
  makeRequest?: SendOptions['makeRequest'];
}

export function useUpload({ projectId, kind, placementId, page, onUploaded, makeRequest }: UseUploadOptions) {
  const [state, setState] = useState<UploadState>({ phase: 'idle' });
  const chosen = useRef<File | null>(null);
  const cancelRef = useRef<(() => void) | null>(null);
  const alive = useRef(true);
  useEffect(() => {
    alive.current = true;
    return () => {
      // The control may leave the screen while sending (the phone's drawer folds, another mirror is
      // picked): the upload goes on and its file still lands (`onUploaded` runs); only the bar is gone.
      alive.current = false;
    };
  }, []);

  const send = useCallback(
    (file: File) => {
      const problem = checkBeforeUpload(file, kind);
      if (problem) {
        setState({ phase: 'failed', name: file.name, message: problem, canRetry: false });
        return;
      }
      setState({ phase: 'sending', name: file.name, sent: 0, total: file.size });
      const sent = sendUpload({
        url: uploadAddress(projectId),
        form: uploadForm(file, file.name, kind, { placementId, page }),
        onProgress: (loaded, total) => {
          if (alive.current) setState({ phase: 'sending', name: file.name, sent: loaded, total });
        },
        makeRequest,
      });
      cancelRef.current = sent.cancel;
      sent.promise.then(
        (stored) => {
          cancelRef.current = null;
          if (alive.current) setState({ phase: 'done', name: stored.name || file.name });
          onUploaded(stored);
        },
        (e: unknown) => {
          cancelRef.current = null;
          if (!alive.current) return;
          if (e instanceof UploadCancelled) setState({ phase: 'cancelled', name: file.name });
          else setState({ phase: 'failed', name: file.name, message: describeError(e), canRetry: retryHelps(e) });
        },
      );
    },
    [kind, projectId, placementId, page, onUploaded, makeRequest],
  );

  /** A file chosen by the person: kept for a retry, then sent. */
  const start = useCallback(
    (file: File) => {
      chosen.current = file;
      send(file);
    },
    [send],
  );
  const retry = useCallback(() => {
    if (chosen.current) send(chosen.current);
  }, [send]);
  const cancel = useCallback(() => cancelRef.current?.(), []);
  const reset = useCallback(() => setState({ phase: 'idle' }), []);

  return { state, start, retry, cancel, reset };
}
