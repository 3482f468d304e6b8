/**
 * Draws PDF plan pages on one worker thread (piscina), so a heavy page never holds the request
 * thread. Each page has a time budget (`FILE_LIMITS.pdfRenderMs`): past it the thread is terminated
 * and the upload is refused with a sentence. The thread's heap is capped and it runs at a lower
 * priority than requests.
 */
import path from 'node:path';
import Piscina from 'piscina';
import { FILE_LIMITS, FILE_MESSAGES } from '../../shared/schemas/files';
import { HttpError } from '../http-error';
import type { RasteriseResult, RasteriseTask } from './pdf-tasks';

export interface PdfWork {
  rasterise(data: Buffer, page: number): Promise<Extract<RasteriseResult, { ok: true }>>;
  close(): Promise<void>;
}

export function createPdfWork(opts: { budgetMs?: number } = {}): PdfWork {
  const budgetMs = opts.budgetMs ?? FILE_LIMITS.pdfRenderMs;
  const pool = new Piscina({
    filename: path.join(__dirname, 'pdf-worker.cjs'),
    minThreads: 0,
    maxThreads: 1,
    idleTimeout: 60_000,
    maxQueue: 8,
    resourceLimits: { maxOldGenerationSizeMb: 512 },
    niceIncrement: 10,
  });
  return {
    async rasterise(data, page) {
      const abort = new AbortController();
      const timer = setTimeout(() => abort.abort(), budgetMs);
      let out: RasteriseResult;
      try {
        const task: RasteriseTask = { data: new Uint8Array(data.buffer, data.byteOffset, data.byteLength), page };
        out = (await pool.run(task, { name: 'rasterise', signal: abort.signal })) as RasteriseResult;
      } catch (e) {
        if (abort.signal.aborted) throw new HttpError(422, FILE_MESSAGES.pdfSlow, { file: FILE_MESSAGES.pdfSlow });
        const err = e as { code?: string; message?: string };
        if (err.code === 'ERR_WORKER_OUT_OF_MEMORY') throw new HttpError(422, FILE_MESSAGES.pdfSlow, { file: FILE_MESSAGES.pdfSlow });
        if (err.message?.includes('Task queue is at limit'))
          throw new HttpError(503, 'Sightfan is reading many PDF plans right now. Try again in a minute.', undefined, {
            'Retry-After': '30',
          });
        throw e;
      } finally {
        clearTimeout(timer);
      }
      if (out.ok) return out;
      const [status, sentence] =
        out.problem === 'pages'
          ? [413, FILE_MESSAGES.pdfPages]
          : out.problem === 'pageSize'
            ? [413, FILE_MESSAGES.pdfPageSize]
            : out.problem === 'pageMissing'
              ? [400, `${FILE_MESSAGES.pdfPageMissing} It has ${out.pages} page${out.pages === 1 ? '' : 's'}.`]
              : [422, FILE_MESSAGES.unreadable];
      throw new HttpError(status, sentence, { [out.problem === 'pageMissing' ? 'page' : 'file']: sentence });
    },
    close: () => pool.destroy(),
  };
}
