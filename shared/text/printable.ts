/**
 * Which characters the specification sheet can print: those some shipped face draws (Latin, Greek,
 * Cyrillic, Hebrew, Arabic, Chinese, Japanese, common punctuation and symbols), never emoji. Names
 * and notes that will be printed are checked against this list when they are saved, so a sheet never
 * shows an empty box where a character should be.
 */
import { PRINTABLE_RANGES } from './printable-ranges';

let table: Uint32Array | null = null;

/** [start0, end0, start1, end1, …], decoded once from the generated list. */
function ranges(): Uint32Array {
  if (!table) {
    const parts = PRINTABLE_RANGES.split(',');
    table = new Uint32Array(parts.length * 2);
    let prev = -1;
    parts.forEach((p, i) => {
      const [gap, len] = p.split('.').map((n) => parseInt(n, 36));
      const start = prev + 1 + gap;
      table![2 * i] = start;
      table![2 * i + 1] = start + len;
      prev = start + len;
    });
  }
  return table;
}

export function isPrintable(codePoint: number): boolean {
  const t = ranges();
  let lo = 0;
  let hi = t.length / 2 - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    if (codePoint < t[2 * mid]) hi = mid - 1;
    else if (codePoint > t[2 * mid + 1]) lo = mid + 1;
    else return true;
  }
  return false;
}

const EMOJI = /\p{Extended_Pictographic}/u;

/** The distinct characters of `text` the sheet cannot print; line breaks are allowed where `multiline`. */
export function unprintable(text: string, multiline = false): string[] {
  const bad = new Set<string>();
  for (const ch of text) {
    if (multiline && (ch === '\n' || ch === '\r' || ch === '\t')) continue;
    if (!isPrintable(ch.codePointAt(0)!)) bad.add(ch);
  }
  return [...bad];
}

const codeOf = (ch: string) => `U+${ch.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}`;

/** The sentence for a field holding characters the sheet cannot print, or null when all print. */
export function unprintableMessage(text: string, multiline = false): string | null {
  const bad = unprintable(text, multiline);
  if (!bad.length) return null;
  if (bad.some((ch) => EMOJI.test(ch))) return 'Emoji cannot be printed on the specification sheet; use words instead.';
  const shown = bad.slice(0, 3).map((ch) => (/[\p{C}\p{Z}]/u.test(ch) ? codeOf(ch) : `"${ch}" (${codeOf(ch)})`));
  return `The specification sheet cannot print ${shown.join(', ')}${bad.length > 3 ? ' and others' : ''}; use letters, digits and punctuation (Latin, Greek, Cyrillic, Hebrew, Arabic, Chinese or Japanese script).`;
}
