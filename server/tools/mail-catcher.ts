/**
 * A local SMTP catcher for development and tests: accepts every message on 127.0.0.1,
 * parses it with mailparser and keeps it in memory and, unless told otherwise, as
 * `<n>.eml` (the raw message) and `<n>.json` (the parsed parts) under `.data/mail/`.
 * STARTTLS is off: smtp-server's built-in certificate has expired, and nothing leaves
 * this machine.
 */
import fs from 'node:fs';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { DATA_DIR } from './project-files';

export const MAIL_DIR = path.join(DATA_DIR, 'mail');

export interface CaughtMail {
  /** Envelope sender and recipients, as the client gave them. */
  envelopeFrom: string;
  envelopeTo: string[];
  /** Parsed headers and parts. */
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  messageId: string | null;
  receivedAt: string;
  raw: string;
}

export interface MailCatcher {
  port: number;
  /** Everything caught so far, oldest first. */
  messages(): CaughtMail[];
  stop(): Promise<void>;
}

function addresses(value: AddressObject | AddressObject[] | undefined): string[] {
  const list = value === undefined ? [] : Array.isArray(value) ? value : [value];
  return list.flatMap((a) => a.value.map((v) => v.address ?? '')).filter((a) => a !== '');
}

function envelopeAddress(a: false | { address: string }): string {
  return a ? a.address : '';
}

/**
 * Starts the catcher on 127.0.0.1:`port` (0 picks a free port). `dir` is where messages
 * are written; null keeps them in memory only.
 */
export async function startMailCatcher(port: number, options: { dir?: string | null } = {}): Promise<MailCatcher> {
  const dir = options.dir === undefined ? MAIL_DIR : options.dir;
  const caught: CaughtMail[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    banner: 'Kerfbook local mail catcher',
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('error', callback);
      stream.on('end', () => {
        const raw = Buffer.concat(chunks);
        simpleParser(raw)
          .then((parsed) => {
            const mail: CaughtMail = {
              envelopeFrom: envelopeAddress(session.envelope.mailFrom),
              envelopeTo: session.envelope.rcptTo.map((r) => r.address),
              from: addresses(parsed.from)[0] ?? '',
              to: addresses(parsed.to),
              subject: parsed.subject ?? '',
              text: parsed.text ?? '',
              html: typeof parsed.html === 'string' ? parsed.html : null,
              messageId: parsed.messageId ?? null,
              receivedAt: new Date().toISOString(),
              raw: raw.toString('utf8'),
            };
            caught.push(mail);
            if (dir) {
              fs.mkdirSync(dir, { recursive: true });
              const name = `${mail.receivedAt.replace(/[:.]/g, '-')}-${caught.length}`;
              fs.writeFileSync(path.join(dir, `${name}.eml`), raw);
              const { raw: _raw, ...parts } = mail;
              fs.writeFileSync(path.join(dir, `${name}.json`), JSON.stringify(parts, null, 2) + '\n');
            }
            callback();
          })
          .catch((err: unknown) => callback(err instanceof Error ? err : new Error(String(err))));
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => {
      server.off('error', reject);
      resolve();
    });
  });
  // Later errors (a client dropping the connection) are not fatal.
  server.on('error', () => undefined);
  const address = (server as unknown as { server: { address(): AddressInfo } }).server.address();
  return {
    port: address.port,
    messages: () => [...caught],
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
