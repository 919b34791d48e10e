/**
 * What the local mail catcher caught: `npm test` starts it for the e2e server and names its
 * folder in E2E_MAIL_DIR; every message is a `.json` file with its parsed parts.
 */
import fs from 'node:fs';
import path from 'node:path';

export interface CaughtMailFile {
  to: string[];
  subject: string;
  text: string;
  html: string | null;
}

const MAIL_DIR = process.env['E2E_MAIL_DIR'] ?? '';

/** Waits (the worker sends every half second) for a mail to `to` that `matches`. */
export async function waitForMail(to: string, matches: (mail: CaughtMailFile) => boolean, timeoutMs = 30_000): Promise<CaughtMailFile> {
  if (!MAIL_DIR) throw new Error('E2E_MAIL_DIR is not set: run the browser tests through `npm test`.');
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const files = fs.existsSync(MAIL_DIR) ? fs.readdirSync(MAIL_DIR).filter((f) => f.endsWith('.json')) : [];
    for (const file of files) {
      const mail = JSON.parse(fs.readFileSync(path.join(MAIL_DIR, file), 'utf8')) as CaughtMailFile;
      if (mail.to.includes(to) && matches(mail)) return mail;
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`No matching mail to ${to} reached the catcher within ${timeoutMs / 1000} s.`);
}

/** The first link in the mail's text that starts with `base`. */
export function linkIn(mail: CaughtMailFile, base: string): string {
  const escaped = base.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  const match = new RegExp(`${escaped}/\\S+`).exec(mail.text);
  if (!match) throw new Error(`The mail "${mail.subject}" has no link to ${base}:\n${mail.text}`);
  return match[0];
}
