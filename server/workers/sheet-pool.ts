/**
 * Runs the sheet's heavy work (evaluation and PDF render) on a pool of worker threads (piscina), so
 * the request thread keeps answering everyone else while one large project is worked out. Each task
 * has a time budget: past it the task is aborted (piscina terminates the thread running it) and the
 * request gets 503 with a sentence and `Retry-After`. A full queue and a worker that ran out of memory
 * are 503s too; nothing of this reaches the main thread's heap.
 */
import os from 'node:os';
import path from 'node:path';
import Piscina from 'piscina';
import type { SheetPaper } from '../../shared/schemas';
import { HttpError } from '../http-error';
import type { SheetApproval } from '../pdf/approval-mark';
import type { SheetImages } from '../pdf/draw-plan';
import type { SheetRevisionInfo } from '../pdf/render-sheet';
import type { SheetInput } from '../pdf/sheet-model';
import type { BuiltContent, InputHashes, RenderTask, RenderedPdf } from './sheet-tasks';

export interface SheetWorkOptions {
  /** Milliseconds one task may take, waiting in the queue included. */
  budgetMs: number;
  /** Worker threads; default one fewer than the cores, at least one. */
  threads?: number;
}

export interface SheetWork {
  /** The SHA-256 that keys the evaluation cache (hashing the largest input takes ~0.1 s, so not on the request thread). */
  inputHash(input: SheetInput): Promise<string>;
  /** The cache key and the content hash together (the input is copied to the thread once). */
  hashes(input: SheetInput): Promise<InputHashes>;
  /** The content hash (engineering content only); ~0.1 s for the largest job, so not on the request thread. */
  contentHash(input: SheetInput): Promise<string>;
  build(input: SheetInput): Promise<BuiltContent>;
  /** `paper` unset: the content's default (US Letter for imperial, else A4). */
  render(
    contentJson: string,
    rev: SheetRevisionInfo,
    paper?: SheetPaper,
    approval?: SheetApproval,
    /** The plan underlay's and photos' bytes by file id (absent: the sheet is drawn without them). */
    images?: SheetImages,
  ): Promise<{ pdf: Buffer; paper: SheetPaper }>;
  close(): Promise<void>;
}

/** Seconds a client is asked to wait after a 503 from the pool. */
export const SHEET_RETRY_AFTER_S = 30;
/** A worker's own heap limit: a runaway project kills that thread, not the server. */
const WORKER_HEAP_MB = 768;
const WORKER_NICE = 10;

const busy = (sentence: string) => new HttpError(503, sentence, undefined, { 'Retry-After': String(SHEET_RETRY_AFTER_S) });

export function createSheetWork(opts: SheetWorkOptions): SheetWork {
  const threads = opts.threads ?? Math.max(1, (os.availableParallelism?.() ?? os.cpus().length) - 1);
  const pool = new Piscina({
    filename: path.join(__dirname, 'sheet-worker.cjs'),
    minThreads: 0,
    maxThreads: threads,
    // Kept alive a while after a task: starting a thread costs the TypeScript loader and the engine's imports.
    idleTimeout: 5 * 60_000,
    maxQueue: threads * 8,
    resourceLimits: { maxOldGenerationSizeMb: WORKER_HEAP_MB },
    // Sheet threads run at a lower priority than the request thread: when the cores are busy, the
    // scheduler serves requests first and the sheet waits.
    niceIncrement: WORKER_NICE,
  });
  const seconds = Math.round(opts.budgetMs / 1000);

  async function run<T>(name: 'inputHash' | 'hashes' | 'engineeringHashTask' | 'build' | 'render', arg: unknown): Promise<T> {
    const abort = new AbortController();
    const timer = setTimeout(() => abort.abort(), opts.budgetMs);
    try {
      return (await pool.run(arg, { name, signal: abort.signal })) as T;
    } catch (e) {
      if (abort.signal.aborted) {
        throw busy(
          `Working out this sheet took longer than ${seconds || 1} s, so it was stopped to keep Sightfan answering everyone else. Try again in a minute; if it happens again, the project may be too large for one sheet — split it into smaller projects.`,
        );
      }
      const err = e as { code?: string; message?: string };
      if (err.code === 'ERR_WORKER_OUT_OF_MEMORY') {
        throw busy('This project needs more memory than one sheet may use, so it was stopped. Split it into smaller projects.');
      }
      if (err.message?.includes('Task queue is at limit')) {
        throw busy('Sightfan is preparing many sheets right now. Try again in a minute.');
      }
      throw e;
    } finally {
      clearTimeout(timer);
    }
  }

  return {
    inputHash: (input) => run<string>('inputHash', input),
    hashes: (input) => run<InputHashes>('hashes', input),
    contentHash: (input) => run<string>('engineeringHashTask', input),
    build: (input) => run<BuiltContent>('build', input),
    async render(contentJson, rev, paper, approval, images) {
      const out = await run<RenderedPdf>('render', { contentJson, rev, paper, approval, images } satisfies RenderTask);
      return { pdf: Buffer.from(out.pdf.buffer, out.pdf.byteOffset, out.pdf.byteLength), paper: out.paper };
    },
    close: () => pool.destroy(),
  };
}
