/**
 * Checking the trail against its seals: every sealed head must still be in the database
 * with the hash it had, and the database must hold at least as many events as each seal
 * counted. Rows cut from the end (even with the chain head moved back to match) and rows
 * rewritten before a seal (even with every later hash recomputed) fail here, where the
 * chain alone would still hold.
 */
import type { Knex } from 'knex';
import { readChainHead } from '../../data/trail-events';
import { countTrailEvents, trailEventHashes } from '../../data/trail-seals';
import type { SealFile, SealLine } from './seal-file';

export interface SealFinding {
  kind: 'truncated' | 'rewritten';
  /** The seal's line in the seal file. */
  seq: number;
  message: string;
}

export interface SealCheck {
  /** The seal file's own chain: the first line that does not hold, or null. */
  fileProblem: string | null;
  /** The newest seal that could be read (the one the trail was checked against last). */
  lastSeal: SealLine | null;
  findings: SealFinding[];
}

export async function checkAgainstSeals(db: Knex, file: SealFile): Promise<SealCheck> {
  const findings: SealFinding[] = [];
  await db.transaction(
    async (trx) => {
      const head = await readChainHead(trx);
      const count = await countTrailEvents(trx);
      const hashes = await trailEventHashes(trx, [...new Set(file.seals.map((s) => s.headEventId))]);
      for (const seal of file.seals) {
        const at = `sealed ${seal.sealedAt} (seal ${seal.seq})`;
        const hash = hashes.get(seal.headEventId);
        if (hash === undefined) {
          findings.push({
            kind: 'truncated',
            seq: seal.seq,
            message: `event #${seal.headEventId}, ${at}, is no longer in the database (its chain now ends at #${head.lastEventId})`,
          });
        } else if (hash !== seal.headHash) {
          findings.push({ kind: 'rewritten', seq: seal.seq, message: `event #${seal.headEventId} no longer has the hash ${at}` });
        }
        if (count < seal.eventCount) {
          findings.push({ kind: 'truncated', seq: seal.seq, message: `${seal.eventCount} events were ${at}; the database holds ${count}` });
        }
      }
    },
    { readOnly: true },
  );
  return { fileProblem: file.problem, lastSeal: file.seals.at(-1) ?? null, findings };
}

/** At most this many findings are listed; the rest are counted. */
const LISTED = 20;

/** Lines for people and logs: the CLI prints them. */
export function describeSealCheck(result: SealCheck, fileName: string): string[] {
  const lines: string[] = [];
  if (result.fileProblem) lines.push(`Seal file BROKEN: ${fileName}: ${result.fileProblem}.`);
  for (const f of result.findings.slice(0, LISTED)) lines.push(`Trail ${f.kind === 'truncated' ? 'TRUNCATED' : 'REWRITTEN'}: ${f.message}.`);
  if (result.findings.length > LISTED) lines.push(`… and ${result.findings.length - LISTED} more findings against earlier seals.`);
  const last = result.lastSeal;
  if (!result.fileProblem && result.findings.length === 0) {
    lines.push(
      last
        ? `Seals verified: checked against seal ${last.seq} of ${fileName} (event #${last.headEventId}, ${last.eventCount} events, sealed ${last.sealedAt}).`
        : `Seal file ${fileName} holds no seals yet: only the chain inside the database was checked.`,
    );
  }
  return lines;
}

export const sealCheckHolds = (result: SealCheck): boolean => result.fileProblem === null && result.findings.length === 0;
