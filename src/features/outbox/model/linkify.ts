// Splits plain mail text into text and web links so the links can be followed. Only http(s)
// links are made clickable: a mail body must never turn into a javascript: or data: link.
export type TextPart = { kind: "text"; text: string } | { kind: "link"; href: string };

const URL_PATTERN = /https?:\/\/[^\s<>"']+/g;
// Sentence punctuation right after a link belongs to the sentence, not the link.
const TRAILING = /[.,;:!?)\]]+$/;

export function linkify(text: string): TextPart[] {
  const parts: TextPart[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const start = match.index;
    const href = match[0].replace(TRAILING, "");
    if (start > last) parts.push({ kind: "text", text: text.slice(last, start) });
    parts.push({ kind: "link", href });
    last = start + href.length;
  }
  if (last < text.length) parts.push({ kind: "text", text: text.slice(last) });
  return parts;
}
