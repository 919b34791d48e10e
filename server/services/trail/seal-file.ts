/**
 * The seal file: one line per seal of the trail's chain head, appended and never rewritten,
 * kept outside the database so that an account that can rewrite the database cannot rewrite
 * the seals. Each line carries the SHA-256 of the line before it, so the file is a hash chain
 * of its own: a line edited, removed or inserted breaks the next line's link.
 *
 * Format "kb-seal-1" — one JSON object per line, keys in this order, "\n" after each:
 *
 *   {"format":"kb-seal-1","seq":1,"headEventId":42,"headHash":"<64 hex>","eventCount":42,
 *    "sealedAt":"2027-01-31T08:15:02.120Z","reason":"interval","prevLineSha256":"<64 hex>"}
 *
 * - seq counts lines from 1; prevLineSha256 is the lower-case hex SHA-256 of the previous
 *   line's UTF-8 bytes without its "\n" (64 zeros on line 1);
 * - headEventId, headHash: the trail's last event and its hash when sealed; eventCount: the
 *   number of trail events then; reason: "interval" or "approval".
 */
import { createHash } from 'node:crypto';
import { constants } from 'node:fs';
import { mkdir, open, readFile } from 'node:fs/promises';
import path from 'node:path';
import { z } from 'zod';

export const SEAL_FORMAT = 'kb-seal-1';
export const SEAL_FILE_NAME = 'trail-seals.jsonl';
const FIRST_PREV = '0'.repeat(64);
const hex64 = z.string().regex(/^[0-9a-f]{64}$/);

const sealLine = z.strictObject({
  format: z.literal(SEAL_FORMAT),
  seq: z.number().int().min(1),
  headEventId: z.number().int().min(1),
  headHash: hex64,
  eventCount: z.number().int().min(1),
  sealedAt: z.iso.datetime(),
  reason: z.enum(['interval', 'approval']),
  prevLineSha256: hex64,
});
export type SealLine = z.infer<typeof sealLine>;
export type SealReason = SealLine['reason'];
export type SealContent = Pick<SealLine, 'headEventId' | 'headHash' | 'eventCount' | 'sealedAt' | 'reason'>;

export interface SealFile {
  seals: SealLine[];
  /** The first place the file's own chain does not hold, or null. */
  problem: string | null;
}

const sha256 = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex');

/** The seal file in a seal directory. */
export const sealFilePath = (dir: string) => path.join(dir, SEAL_FILE_NAME);

/** Reads the file's lines and checks its own chain; stops at the first line that does not hold. */
export function parseSealFile(text: string): SealFile {
  const seals: SealLine[] = [];
  if (text === '') return { seals, problem: null };
  const lines = text.split('\n');
  const complete = lines.pop() === '';
  let prev = FIRST_PREV;
  for (const [i, line] of lines.entries()) {
    const n = i + 1;
    let parsed: unknown;
    try {
      parsed = JSON.parse(line);
    } catch {
      return { seals, problem: `line ${n} is not a seal (not JSON)` };
    }
    const seal = sealLine.safeParse(parsed);
    if (!seal.success) return { seals, problem: `line ${n} is not a ${SEAL_FORMAT} seal (${seal.error.issues[0]?.path.join('.') || 'shape'})` };
    if (seal.data.seq !== n) return { seals, problem: `line ${n} says it is seal ${seal.data.seq}: a line was removed or inserted` };
    if (seal.data.prevLineSha256 !== prev)
      return { seals, problem: `line ${n} does not link to line ${n - 1}: ${n === 1 ? 'lines were removed from the start' : `line ${n - 1} was changed`}` };
    if (JSON.stringify(seal.data) !== line) return { seals, problem: `line ${n} is not written the way seals are written` };
    seals.push(seal.data);
    prev = sha256(line);
  }
  if (!complete) return { seals, problem: `line ${lines.length + 1} is incomplete (no end of line)` };
  return { seals, problem: null };
}

/** The file's seals, or null when there is no file. */
export async function readSealFile(file: string): Promise<SealFile | null> {
  try {
    return parseSealFile(await readFile(file, 'utf8'));
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null;
    throw err;
  }
}

/**
 * Appends one seal, linked to the file's last line, and flushes it to disk before
 * answering. Callers hold the seal lock, so no two writers append at once. A file whose own
 * chain is broken is not extended: it must be looked into (and a new file started) first.
 */
export async function appendSeal(dir: string, content: SealContent): Promise<SealLine> {
  await mkdir(dir, { recursive: true, mode: 0o750 });
  const file = sealFilePath(dir);
  const existing = (await readSealFile(file)) ?? { seals: [], problem: null };
  if (existing.problem) throw new Error(`The seal file ${file} is damaged (${existing.problem}); not sealing into it.`);
  const last = existing.seals.at(-1);
  const seal: SealLine = {
    format: SEAL_FORMAT,
    seq: (last?.seq ?? 0) + 1,
    headEventId: content.headEventId,
    headHash: content.headHash,
    eventCount: content.eventCount,
    sealedAt: content.sealedAt,
    reason: content.reason,
    prevLineSha256: last ? sha256(JSON.stringify(last)) : FIRST_PREV,
  };
  // O_APPEND: every write lands at the end, whatever else has the file open.
  const handle = await open(file, constants.O_WRONLY | constants.O_APPEND | constants.O_CREAT, 0o640);
  try {
    await handle.write(`${JSON.stringify(seal)}\n`);
    await handle.sync();
  } finally {
    await handle.close();
  }
  if (!last) await syncDirectory(dir);
  return seal;
}

/** A new file's name is durable only once its directory is flushed too. */
async function syncDirectory(dir: string): Promise<void> {
  const handle = await open(dir, constants.O_RDONLY);
  try {
    await handle.sync();
  } finally {
    await handle.close();
  }
}
