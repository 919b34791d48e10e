/** A piece of one line of a mail's text part: plain words, or a link the page may follow. */
export type MailTextPart = { text: string; href?: undefined } | { text: string; href: string };

/** Absolute http(s) addresses and site-relative paths ("/set-password?token=…"). */
const ADDRESS = /https?:\/\/[^\s<>"']+|(?<![\w/])\/[A-Za-z0-9][^\s<>"']*/g;
/** Sentence punctuation after an address belongs to the sentence, not the address. */
const TRAILING = /[.,;:!?)\]]+$/;

/**
 * Splits a mail's text part into lines of parts, so a template can show it with plain
 * bindings (never innerHTML). Only addresses on this page's own origin, or relative
 * ones, become links; anything else stays text, so a mail cannot lead the admin elsewhere.
 */
export function mailTextLines(text: string, origin: string): MailTextPart[][] {
  return text.split(/\r?\n/).map((line) => splitLine(line, origin));
}

function splitLine(line: string, origin: string): MailTextPart[] {
  const parts: MailTextPart[] = [];
  let at = 0;
  for (const match of line.matchAll(ADDRESS)) {
    const address = match[0].replace(TRAILING, '');
    const start = match.index;
    const href = linkTarget(address, origin);
    if (!href) continue;
    if (start > at) parts.push({ text: line.slice(at, start) });
    parts.push({ text: address, href });
    at = start + address.length;
  }
  if (at < line.length || parts.length === 0) parts.push({ text: line.slice(at) });
  return parts;
}

/** The address to link to, or null when it leaves this site. */
function linkTarget(address: string, origin: string): string | null {
  if (address.startsWith('/')) return address.startsWith('//') ? null : address;
  try {
    const url = new URL(address);
    return url.origin === origin ? url.pathname + url.search + url.hash : null;
  } catch {
    return null;
  }
}
