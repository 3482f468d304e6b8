/**
 * The sheet's heavy work, run inside a worker thread (see sheet-pool.ts): the engine's evaluation of
 * a whole project (buildSheetContent) and the pdfkit render. Both take plain data and return plain
 * data, because everything crossing a thread is copied by structured clone.
 */
import type { SheetPaper } from '../../shared/schemas';
import { renderSheet, type SheetRevisionInfo } from '../pdf/render-sheet';
import { buildSheetContent, contentHash, type SheetContent, type SheetInput } from '../pdf/sheet-model';

export interface BuiltContent {
  content: SheetContent;
  hash: string;
}

export function build(input: SheetInput): BuiltContent {
  const { content } = buildSheetContent(input);
  return { content, hash: contentHash(content) };
}

export interface RenderTask {
  content: SheetContent;
  rev: SheetRevisionInfo;
  paper: SheetPaper;
}

export async function render(task: RenderTask): Promise<Uint8Array> {
  return renderSheet(task.content, task.rev, task.paper);
}
