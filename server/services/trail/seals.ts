/**
 * Sealing the trail: the chain head (last event, its hash, the event count, the time) is
 * written where the app's database account cannot reach — a line in the seal file and a
 * mail to every auditor — at the lab's seal interval and after every approval (an
 * approval's seal is mailed at most once an hour). A seal lets
 * `npm run trail:verify` find rows cut from the end of the trail, or rewritten, before it.
 *
 * Any number of app processes may seal: a named database lock lets one writer at a time
 * read and extend a seal file, and the claim row (unique head id) lets exactly one of them
 * seal a given head, whichever seal directory each process uses.
 */
import type { Knex } from 'knex';
import { countTrailEvents, claimSeal, newestSeal, releaseSealLock, takeSealLock } from '../../data/trail-seals';
import { findLabSettings } from '../../data/lab-settings';
import { readChainHead } from '../../data/trail-events';
import { newestMailOfKind } from '../../data/mail-outbox';
import { notifyTrailSealed } from '../mail/notifications';
import type { MailSettings } from '../mail/settings';
import { startRepeatingJob } from '../repeating-job';
import { appendSeal, type SealLine, type SealReason } from './seal-file';

export const DEFAULT_SEAL_INTERVAL_HOURS = 24;
/**
 * An approval's seal is mailed only when no seal mail went out within this time: each seal
 * is in the file, and the newest mailed seal anchors everything before it, so a busy day
 * of approvals does not bury the auditors in mail. The regular seal is always mailed.
 */
export const SEAL_MAIL_GAP_MS = 3600_000;
/** How long a seal run waits for another process's seal to be written. */
const LOCK_WAIT_SECONDS = 30;

export interface SealSettings {
  /** The seal directory (SEAL_DIR): its trail-seals.jsonl is appended to. */
  dir: string;
  mail: MailSettings;
}

/**
 * Seals the chain head as it is now, unless it was sealed before (by this or another
 * process) or the trail is empty. With `onlyWhenDue`, also not before the lab's seal
 * interval has passed since the newest seal. Answers the seal written, or null.
 */
export async function sealTrail(db: Knex, settings: SealSettings, reason: SealReason, now = new Date(), onlyWhenDue = false): Promise<SealLine | null> {
  return db.transaction(async (trx) => {
    if (!(await takeSealLock(trx, LOCK_WAIT_SECONDS))) throw new Error(`Another process kept the trail seal lock for ${LOCK_WAIT_SECONDS} s.`);
    try {
      // Read only now, under the lock: what an earlier writer committed is seen.
      const head = await readChainHead(trx);
      if (head.lastEventId === 0) return null;
      const newest = await newestSeal(trx);
      if (newest && Number(newest.head_event_id) === head.lastEventId) return null;
      if (onlyWhenDue && newest) {
        const hours = (await findLabSettings(trx))?.seal_interval_hours ?? DEFAULT_SEAL_INTERVAL_HOURS;
        if (now.getTime() - new Date(newest.sealed_at).getTime() < hours * 3600_000) return null;
      }
      const seal = { headEventId: head.lastEventId, headHash: head.lastHash, eventCount: await countTrailEvents(trx), sealedAt: now.toISOString(), reason };
      const claimed = await claimSeal(trx, {
        head_event_id: seal.headEventId,
        head_hash: seal.headHash,
        event_count: seal.eventCount,
        reason,
        sealed_at: now,
      });
      if (!claimed) return null;
      const lastMailed = reason === 'interval' ? null : await newestMailOfKind(trx, 'trail-sealed');
      if (!lastMailed || now.getTime() - lastMailed.getTime() >= SEAL_MAIL_GAP_MS) await notifyTrailSealed(trx, settings.mail, seal, now);
      // Last: a failed write rolls the claim and the mails back, and the next run tries again.
      return await appendSeal(settings.dir, seal);
    } finally {
      await releaseSealLock(trx);
    }
  });
}

/**
 * The seal after an approval, once the approval has committed. The approval stands
 * whatever happens here: a failed seal is logged, and the next regular seal covers it.
 */
export async function sealAfterApproval(db: Knex, settings: SealSettings, log: (...args: unknown[]) => void = console.error): Promise<void> {
  try {
    await sealTrail(db, settings, 'approval');
  } catch (err) {
    log('[trail seals] seal after approval failed:', err instanceof Error ? err.message : err);
  }
}

/** Looks every `checkIntervalMs` whether the lab's seal interval has passed, and seals then. */
export function startSealTimer(db: Knex, settings: SealSettings, checkIntervalMs: number, log?: (...args: unknown[]) => void): () => void {
  return startRepeatingJob('trail seals', () => sealTrail(db, settings, 'interval', new Date(), true), checkIntervalMs, log);
}
