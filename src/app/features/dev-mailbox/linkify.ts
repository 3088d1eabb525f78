export type TextPart = { text: string; href?: undefined } | { text: string; href: string };

// http(s) only: a mail body must not produce javascript: or data: links.
const URL_PATTERN = /https?:\/\/[^\s<>"')\]]+/g;

/** Splits plain text into text and link parts so a template can render the links as anchors. */
export function linkify(text: string): TextPart[] {
  const parts: TextPart[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const start = match.index ?? 0;
    // A sentence's full stop or comma is not part of the address.
    const href = match[0].replace(/[.,;:!?]+$/, '');
    if (start > last) parts.push({ text: text.slice(last, start) });
    parts.push({ text: href, href });
    last = start + href.length;
  }
  if (last < text.length) parts.push({ text: text.slice(last) });
  return parts;
}
