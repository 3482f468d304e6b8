/**
 * Reading a sheet back as a reader's tools would: fetching the PDF through the API as the app's
 * Download does, and poppler's command-line tools (Debian's poppler-utils in /usr/bin) on it.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import type request from 'supertest';

type Agent = ReturnType<typeof request.agent>;

/** supertest's parser for a binary body (a PDF): the whole response as one Buffer. */
export const binary = (res: request.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

/** Whitespace folded to single spaces: pdftotext breaks lines wherever the layout does. */
export const flat = (s: string) => s.replace(/\s+/g, ' ');

export type PopplerTool = 'pdftotext' | 'pdfinfo' | 'pdffonts';

/** Runs one of poppler's tools on a PDF file; pdftotext is told to write to standard output. */
export function poppler(cmd: PopplerTool, file: string, args: string[] = []): string {
  return execFileSync(`/usr/bin/${cmd}`, [...args, file, ...(cmd === 'pdftotext' ? ['-'] : [])], { encoding: 'utf8' });
}

let written = 0;
/** The PDF written to a file of its own in `dir` (poppler reads files). */
export function pdfFile(pdf: Buffer, dir: string): string {
  const file = path.join(dir, `sheet-${++written}.pdf`);
  fs.writeFileSync(file, pdf);
  return file;
}

/** A tool's output for a PDF in memory (written to `dir` first). */
export const popplerOn = (cmd: PopplerTool, pdf: Buffer, dir: string, args: string[] = []) => poppler(cmd, pdfFile(pdf, dir), args);

/** The page count pdfinfo reports. */
export const pageCount = (file: string) => Number(/Pages:\s+(\d+)/.exec(poppler('pdfinfo', file))?.[1]);

/** Each page's text with the layout kept, whitespace folded (pdftotext ends each page with a form feed). */
export function pagesText(pdf: Buffer, dir: string): string[] {
  return popplerOn('pdftotext', pdf, dir, ['-layout'])
    .split('\f')
    .map((p) => flat(p).trim())
    .filter(Boolean);
}

/**
 * What the app's Download does: issue the sheet (POST a revision, or get the one already issued for
 * the same content), then fetch that revision's PDF. `params` are further query parameters
 * ("paper=letter").
 */
export async function issueSheet(
  agent: Agent,
  projectId: number,
  params = '',
): Promise<{ pdf: Buffer; res: request.Response; revision: number; created: boolean }> {
  const issued = await agent.post(`/api/projects/${projectId}/sheet/revisions`);
  if (issued.status !== 200 && issued.status !== 201) throw new Error(`issuing failed: ${issued.status} ${JSON.stringify(issued.body)}`);
  const revision = issued.body.revision.number as number;
  const res = await agent
    .get(`/api/projects/${projectId}/sheet.pdf?revision=${revision}${params ? `&${params}` : ''}`)
    .buffer(true)
    .parse(binary);
  return { pdf: res.body as Buffer, res, revision, created: issued.body.created as boolean };
}
