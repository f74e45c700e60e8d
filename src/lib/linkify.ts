/** A piece of plain text: either words or a web address to show as a link. */
export type TextPiece = { kind: 'text'; text: string } | { kind: 'link'; href: string };

const URL_RE = /\bhttps?:\/\/[^\s<>"']+/g;
// A sentence often ends right after an address; those closing marks are not part of it.
const TRAILING = /[.,;:!?)\]]+$/;

/** Splits text into plain runs and http(s) addresses, so a mail's links can be clicked. */
export function linkify(text: string): TextPiece[] {
  const out: TextPiece[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_RE)) {
    const start = match.index ?? 0;
    const raw = match[0];
    const href = raw.replace(TRAILING, '');
    if (start > last) out.push({ kind: 'text', text: text.slice(last, start) });
    out.push({ kind: 'link', href });
    last = start + href.length;
  }
  if (last < text.length) out.push({ kind: 'text', text: text.slice(last) });
  return out;
}
