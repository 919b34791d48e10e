/**
 * One look for every mail Kerfbook sends: a plain-text part and an HTML part built from the
 * same paragraphs, every value escaped in the HTML, and links made absolute against the
 * configured base URL (APP_BASE_URL) so they work from any mail program.
 */
import escapeHtml from 'escape-html';
import type { OutgoingMail } from './outbox';

export interface MailLink {
  label: string;
  /** An app path starting with '/', e.g. `/recipes/3?v=2`. */
  path: string;
}

export interface MailContent {
  to: string;
  subject: string;
  /** Greeting name, e.g. the person's display name. */
  greeting: string;
  /** Plain sentences; each becomes one paragraph. */
  paragraphs: readonly string[];
  /** The one thing to do, shown as a button in HTML and as a line in text. */
  action?: MailLink;
  /** Small print under the action (why they get it, how to turn it off). */
  footer?: readonly string[];
  kind: string;
}

/** `base` + `path`, with exactly one slash between them. */
export function absoluteLink(base: string, path: string): string {
  return `${base.replace(/\/+$/, '')}/${path.replace(/^\/+/, '')}`;
}

export function composeMail(base: string, content: MailContent): OutgoingMail {
  const link = content.action ? absoluteLink(base, content.action.path) : null;
  const text = [
    `Hello ${content.greeting},`,
    '',
    ...content.paragraphs.flatMap((p) => [p, '']),
    ...(content.action && link ? [`${content.action.label}: ${link}`, ''] : []),
    ...(content.footer ?? []).flatMap((f) => [f, '']),
    '— Kerfbook',
  ].join('\n');
  const html = [
    '<!doctype html><html><body style="font-family:sans-serif;font-size:15px;line-height:1.45;color:#1b1b1f">',
    `<p>Hello ${escapeHtml(content.greeting)},</p>`,
    ...content.paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`),
    ...(content.action && link
      ? [
          `<p><a href="${escapeHtml(link)}" style="display:inline-block;padding:8px 16px;background:#29506b;color:#fff;text-decoration:none;border-radius:4px">${escapeHtml(content.action.label)}</a></p>`,
          `<p style="font-size:13px;color:#555">Or open this address: ${escapeHtml(link)}</p>`,
        ]
      : []),
    ...(content.footer ?? []).map((f) => `<p style="font-size:13px;color:#555">${escapeHtml(f)}</p>`),
    '<p>— Kerfbook</p></body></html>',
  ].join('\n');
  return { to: content.to, subject: content.subject, text, html, kind: content.kind };
}
