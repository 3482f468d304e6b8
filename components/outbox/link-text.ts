export type TextPart = { kind: 'text'; text: string } | { kind: 'link'; url: string };

/** http(s) URLs up to the next whitespace, minus trailing punctuation that ends a sentence. */
const URL_PATTERN = /https?:\/\/[^\s<>"]+/g;

/** Splits an e-mail's plain text so its links (the invitation link) can be drawn as links. */
export function splitLinks(text: string): TextPart[] {
  const parts: TextPart[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const start = match.index ?? 0;
    let url = match[0];
    const trailing = /[.,;:!?)\]]+$/.exec(url);
    if (trailing) url = url.slice(0, -trailing[0].length);
    if (start > last) parts.push({ kind: 'text', text: text.slice(last, start) });
    parts.push({ kind: 'link', url });
    last = start + url.length;
  }
  if (last < text.length) parts.push({ kind: 'text', text: text.slice(last) });
  return parts;
}
