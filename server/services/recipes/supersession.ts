/**
 * Effective dates and supersession: an approved version becomes current on its
 * effective day, and every older approved version of the recipe (the one in use, or one
 * approved for a later day that never came) becomes superseded at that moment.
 *
 * Approval does this at once for a version effective today; `applyDueSupersessions` does it
 * for versions whose day has come since, on a timer in every app process. It is safe with
 * several processes and idempotent: each recipe is handled in its own short transaction
 * that locks the recipe row with SKIP LOCKED (MariaDB 10.6+) — a recipe another process
 * or a person is changing right now is left for the next run — and everything is looked at
 * again under the lock before anything changes.
 */
import type { Knex } from 'knex';
import { startRepeatingJob } from '../repeating-job';
import type { VersionRow } from '../../data/recipes';
import {
  listVersionStates,
  lockRecipeSkipLocked,
  lockVersionsById,
  recipesWithDueVersions,
  setCurrentVersion,
  updateVersionState,
  type LockedRecipe,
} from '../../data/workflow';
import type { Actor } from '../actor';
import { TRAIL_EVENTS } from '../trail/event-types';
import { appendTrailEvent } from '../trail/append';
import { dayOf, utcDay } from '../../../shared/calendar-dates';
import { DEFAULT_MAIL_SETTINGS, type MailSettings } from '../mail/settings';
import { notifyVersionCurrent } from '../mail/notifications';

/** Who the trail names for changes the scheduled job makes. */
export const SCHEDULER_ACTOR: Actor = { userId: null, name: 'Kerfbook scheduler', clientAddress: '' };

export interface SupersededVersion {
  id: number;
  version: number;
  revision: number;
}

/**
 * Makes `target` the recipe's current version and supersedes every older approved version.
 * The caller holds the recipe row's lock; the older versions are locked here by id.
 * Writes no trail events: the caller writes them last (the trail's head lock comes last).
 */
export async function makeCurrent(
  trx: Knex.Transaction,
  recipe: LockedRecipe,
  target: Pick<VersionRow, 'id' | 'version'>,
  now: Date,
): Promise<SupersededVersion[]> {
  const states = await listVersionStates(trx, recipe.id);
  const olderIds = states.filter((s) => s.version < target.version && s.status === 'approved').map((s) => s.id);
  const older = (await lockVersionsById(trx, olderIds)).filter((v) => v.status === 'approved');
  for (const v of older) await updateVersionState(trx, v.id, { status: 'superseded', superseded_at: now });
  if (recipe.current_version_id !== target.id) await setCurrentVersion(trx, recipe.id, target.id, now);
  return older.map((v) => ({ id: v.id, version: v.version, revision: v.revision }));
}

/** The newest version a new current one replaced (for the operators' mail), or null. */
export function replacedVersion(superseded: readonly SupersededVersion[]): number | null {
  return superseded.reduce<number | null>((best, s) => (best === null || s.version > best ? s.version : best), null);
}

/** The trail events of versions superseded by `by`. */
export async function recordSuperseded(
  trx: Knex,
  actor: Actor,
  superseded: readonly SupersededVersion[],
  by: { id: number; version: number },
  now: Date,
): Promise<void> {
  for (const s of superseded) {
    await appendTrailEvent(
      trx,
      actor,
      {
        type: TRAIL_EVENTS.versionSuperseded,
        entityType: 'recipe_version',
        entityId: s.id,
        before: { status: 'approved', revision: s.revision },
        after: { status: 'superseded', revision: s.revision + 1, supersededByVersion: by.version, supersededByVersionId: by.id },
      },
      now,
    );
  }
}

export interface SupersessionResult {
  /** Versions that became current in this run. */
  madeCurrent: number;
  /** Older versions superseded by them. */
  superseded: number;
}

/**
 * One recipe under its lock; left alone when another transaction holds the recipe. The
 * machine's operators are mailed in the same transaction: only the run that made the
 * version current sends them.
 */
async function applyForRecipe(db: Knex, recipeId: number, now: Date, result: SupersessionResult, mail: MailSettings): Promise<void> {
  const today = utcDay(now);
  await db.transaction(async (trx) => {
    const recipe = await lockRecipeSkipLocked(trx, recipeId);
    if (!recipe) return;
    const states = await listVersionStates(trx, recipeId);
    const approved = await lockVersionsById(
      trx,
      states.filter((s) => s.status === 'approved').map((s) => s.id),
    );
    const due = approved.filter((v) => v.status === 'approved' && (dayOf(v.effective_from) ?? '9999-12-31') <= today);
    const target = due.reduce<VersionRow | null>((best, v) => (best === null || v.version > best.version ? v : best), null);
    if (!target || recipe.current_version_id === target.id) return;
    const superseded = await makeCurrent(trx, recipe, target, now);
    await updateVersionState(trx, target.id, {});
    const changeReason = (JSON.parse(target.content_json) as { changeReason?: string }).changeReason ?? '';
    await notifyVersionCurrent(
      trx,
      mail,
      { machineId: target.machine_id, changeReason, replaces: replacedVersion(superseded) },
      { recipeId, number: recipe.number, version: target.version, title: target.title },
      now,
    );
    await appendTrailEvent(
      trx,
      SCHEDULER_ACTOR,
      {
        type: TRAIL_EVENTS.versionEffective,
        entityType: 'recipe_version',
        entityId: target.id,
        before: { status: 'approved', current: false, revision: target.revision },
        after: { status: 'approved', current: true, revision: target.revision + 1, effectiveFrom: dayOf(target.effective_from) },
      },
      now,
    );
    await recordSuperseded(trx, SCHEDULER_ACTOR, superseded, target, now);
    result.madeCurrent += 1;
    result.superseded += superseded.length;
  });
}

/**
 * Makes every approved version whose effective day (UTC) has come by `now` current, and
 * supersedes its predecessors. Tests pass a chosen `now`.
 */
export async function applyDueSupersessions(db: Knex, now: Date = new Date(), mail: MailSettings = DEFAULT_MAIL_SETTINGS): Promise<SupersessionResult> {
  const result: SupersessionResult = { madeCurrent: 0, superseded: 0 };
  for (const recipeId of await recipesWithDueVersions(db, utcDay(now))) {
    await applyForRecipe(db, recipeId, now, result, mail);
  }
  return result;
}

/** Runs the job now and then every `intervalMs` until stopped (see repeating-job.ts). */
export function startSupersessionTimer(
  db: Knex,
  intervalMs: number,
  log: (...args: unknown[]) => void = console.error,
  mail: MailSettings = DEFAULT_MAIL_SETTINGS,
): () => void {
  return startRepeatingJob('supersession', () => applyDueSupersessions(db, new Date(), mail), intervalMs, log);
}
