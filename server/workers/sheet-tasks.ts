/**
 * The sheet's heavy work, run inside a worker thread (see sheet-pool.ts): hashing a project's input,
 * the engine's evaluation of the whole project (buildSheetContent) and the pdfkit render. Content
 * crosses threads as JSON text, so the request thread never walks, parses or serialises it: for the
 * largest accepted project that alone held the request thread for a tenth of a second.
 */
import { createHash } from 'node:crypto';
import type { SheetPaper } from '../../shared/schemas';
import type { SheetApproval } from '../pdf/approval-mark';
import { defaultPaper, renderSheet, type SheetRevisionInfo } from '../pdf/render-sheet';
import type { SheetImages } from '../pdf/draw-plan';
import { engineeringHash } from '../modules/review/content-hash';
import { buildSheetContent, canonicalJson, contentHash, type SheetContent, type SheetInput } from '../pdf/sheet-model';

/**
 * Part of every evaluation cache key. Raise it whenever the sheet model or the engine changes what a
 * sheet says for the same input (the cache is also emptied when the server starts).
 */
export const SHEET_MODEL_VERSION = 6;

export function inputHash(input: SheetInput): string {
  return createHash('sha256')
    .update(canonicalJson({ v: SHEET_MODEL_VERSION, input }))
    .digest('hex');
}

export interface InputHashes {
  /** Keys the evaluation cache (everything the sheet is built from, units included). */
  inputHash: string;
  /** The content hash: the engineering content only (review/content-hash.ts). */
  contentHash: string;
}

/** Both hashes of one input in one task: the input crosses to the thread once. */
export function hashes(input: SheetInput): InputHashes {
  return { inputHash: inputHash(input), contentHash: engineeringHash(input) };
}

/** The content hash alone (the withdrawal check of a write to an approved job). */
export function engineeringHashTask(input: SheetInput): string {
  return engineeringHash(input);
}

export interface BuiltContent {
  contentJson: string;
  hash: string;
}

export function build(input: SheetInput): BuiltContent {
  const { content } = buildSheetContent(input);
  return { contentJson: JSON.stringify(content), hash: contentHash(content) };
}

export interface RenderTask {
  contentJson: string;
  rev: SheetRevisionInfo;
  paper?: SheetPaper;
  approval?: SheetApproval;
  /** The plan underlay's and photos' bytes (JPEG for print), by file id. */
  images?: SheetImages;
}

export interface RenderedPdf {
  pdf: Uint8Array;
  /** The paper printed on: the one asked for, else the content's default. */
  paper: SheetPaper;
}

export async function render(task: RenderTask): Promise<RenderedPdf> {
  const content = JSON.parse(task.contentJson) as SheetContent;
  const paper = task.paper ?? defaultPaper(content.units);
  return { pdf: await renderSheet(content, task.rev, paper, task.approval, task.images), paper };
}
