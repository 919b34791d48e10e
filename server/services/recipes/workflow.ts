/**
 * Review and approval: submit, return, approve with a signature, withdraw with a
 * signature, and a new version from a closed one. Each transition is one transaction that
 * locks the version row, checks its status and the revision the person saw, bumps the
 * revision and writes its trail event (before and after status) — so of two people acting
 * on the same version at the same moment exactly one succeeds and the other gets 409.
 */
import { contentSha256 } from './version-integrity';
import type { Knex } from 'knex';
import type { FieldError } from '../../../shared/api-error';
import { changeReasonMissing, runChecks, worstSeverity, type CheckResult } from '../../../shared/recipe-checks';
import type { RecipeVersionDto } from '../../../shared/recipe-types';
import type { RecipeContent } from '../../../shared/schemas/recipe';
import type { ApproveBody, NewVersionBody, ReturnBody, SubmitBody, WithdrawBody } from '../../../shared/schemas/workflow';
import { AppError } from '../../app-error';
import { findLabSettings } from '../../data/lab-settings';
import { findRecipeRow, findVersion, insertVersion, updateRecipeRow, type VersionRow } from '../../data/recipes';
import {
  copyAttachments,
  findOpenVersion,
  insertReviewComment,
  insertSignature,
  isEditorOf,
  lockRecipe,
  lockVersion,
  maxVersionNumber,
  setCurrentVersion,
  touchEditor,
  updateVersionState,
} from '../../data/workflow';
import type { Actor } from '../actor';
import { TRAIL_EVENTS } from '../trail/event-types';
import { appendTrailEvent } from '../trail/append';
import { assignCheckCode } from './check-codes';
import { addMonths, isCalendarDay, utcDay } from '../../../shared/calendar-dates';
import { loadRecipeContext } from './context-loader';
import { contentValues, requireActor, versionDto } from './recipes';
import { verifySigner } from './signatures';
import { DEFAULT_MAIL_SETTINGS, type MailSettings } from '../mail/settings';
import type { VersionRef } from '../mail/notification-mails';
import { notifyApproved, notifyReturned, notifyReviewRequested, notifyVersionCurrent } from '../mail/notifications';
import { makeCurrent, recordSuperseded, replacedVersion } from './supersession';
import { RECIPE_STATUS_PHRASES, type RecipeStatus } from '../../../shared/vocabulary';
import { reportIntegrityFailure } from './integrity-alert';

/** The review interval when the lab has not set one: two years, a common periodic-review cycle. */
export const DEFAULT_REVIEW_INTERVAL_MONTHS = 24;

/**
 * Thrown inside a transaction when the version is not in the state the action needs or has
 * moved on; turned into 409 with the version as it is now once the transaction is undone.
 */
class VersionConflict extends Error {
  constructor(
    message: string,
    readonly path: string,
  ) {
    super(message);
  }
}

async function withConflicts<T>(db: Knex, recipeId: number, version: number, work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (err) {
    if (!(err instanceof VersionConflict)) throw err;
    const current = await versionDto(db, recipeId, version);
    throw new AppError(409, 'CONFLICT', [{ path: err.path, message: err.message }], { extra: { current } });
  }
}

async function requireVersion(trx: Knex.Transaction, recipeId: number, version: number): Promise<VersionRow> {
  const row = await lockVersion(trx, recipeId, version);
  if (row) return row;
  const recipe = await findRecipeRow(trx, recipeId);
  throw AppError.notFound(recipe ? `Recipe ${recipe.number} has no version ${version}.` : `There is no recipe with id ${recipeId}.`);
}

/** The version as a mail names it. */
function refOf(recipeId: number, number: string, v: Pick<VersionRow, 'version' | 'title'>): VersionRef {
  return { recipeId, number, version: v.version, title: v.title };
}

function label(number: string, v: Pick<VersionRow, 'version'>): string {
  return `Version ${v.version} of ${number}`;
}

/** Refuses unless the locked version is in one of the states and at the revision the person saw. */
function expectState(number: string, v: VersionRow, allowed: readonly RecipeStatus[], action: string, revision: number): void {
  if (!allowed.includes(v.status)) {
    throw new VersionConflict(`${label(number, v)} is ${RECIPE_STATUS_PHRASES[v.status]}, so it cannot be ${action} now.`, 'status');
  }
  if (v.revision !== revision) {
    throw new VersionConflict(
      `${label(number, v)} changed after you opened it (you saw revision ${revision}, it is now at ${v.revision}). Reload it, look again and then try again.`,
      'revision',
    );
  }
}

/**
 * A signature binds the content as it was submitted: content changed since then (by
 * someone writing to the database) is not signed, whatever its stored hash says.
 */
function requireIntact(number: string, v: { version: number; content_json: string; content_hash: string | null }): void {
  if (v.content_hash !== null && contentSha256(v.content_json) === v.content_hash) return;
  throw new AppError(409, 'INTEGRITY_FAILED', [
    {
      path: '',
      message: `Version ${v.version} of ${number} fails its integrity check: its content no longer matches what was submitted, so it cannot be signed. Admins and auditors have been told.`,
    },
  ]);
}

/** The checks of frozen content against the stock as it is now. */
async function checksNow(trx: Knex, v: VersionRow): Promise<{ content: RecipeContent; checks: CheckResult[] }> {
  const content = JSON.parse(v.content_json) as RecipeContent;
  return { content, checks: runChecks(content, await loadRecipeContext(trx, content)) };
}

function blockerErrors(v: VersionRow, content: RecipeContent, checks: readonly CheckResult[]): FieldError[] {
  const errors: FieldError[] = checks.filter((c) => c.severity === 'blocker').map((c) => ({ path: c.path ?? '', message: c.message }));
  const reasonMissing = changeReasonMissing(v.version, content.changeReason);
  if (reasonMissing) errors.push({ path: 'changeReason', message: reasonMissing });
  return errors;
}

function blockers(errors: FieldError[], checks: readonly CheckResult[]): AppError {
  // `checks`: every result as it is now, so the screen can show them beside the blockers.
  return new AppError(409, 'BLOCKERS', errors, { extra: { checks } });
}

async function numberOf(trx: Knex, recipeId: number): Promise<string> {
  return (await findRecipeRow(trx, recipeId))?.number ?? `recipe ${recipeId}`;
}

// --- submit -------------------------------------------------------------------------------

/**
 * Author sends a draft for review: refused while the checks (against today's stock) find a
 * blocker. Approvers who could approve it are told by mail.
 */
export async function submitVersion(
  db: Knex,
  actor: Actor,
  recipeId: number,
  version: number,
  body: SubmitBody,
  now = new Date(),
  mail: MailSettings = DEFAULT_MAIL_SETTINGS,
): Promise<RecipeVersionDto> {
  requireActor(actor);
  await withConflicts(db, recipeId, version, () =>
    db.transaction(async (trx) => {
      const v = await requireVersion(trx, recipeId, version);
      const number = await numberOf(trx, recipeId);
      expectState(number, v, ['draft'], 'submitted', body.revision);
      const { content, checks } = await checksNow(trx, v);
      const errors = blockerErrors(v, content, checks);
      if (errors.length > 0) throw blockers(errors, checks);
      const hash = contentSha256(v.content_json);
      await updateVersionState(trx, v.id, {
        status: 'in-review',
        content_hash: hash,
        submitted_at: now,
        checks_json: JSON.stringify(checks),
        worst_check: worstSeverity(checks),
      });
      await notifyReviewRequested(trx, mail, v.id, refOf(recipeId, number, v), actor, now);
      await appendTrailEvent(
        trx,
        actor,
        {
          type: TRAIL_EVENTS.versionSubmitted,
          entityType: 'recipe_version',
          entityId: v.id,
          before: { status: v.status, revision: v.revision },
          after: { status: 'in-review', revision: v.revision + 1, contentSha256: hash, worstCheck: worstSeverity(checks) },
        },
        now,
      );
    }),
  );
  return versionDto(db, recipeId, version);
}

// --- return -------------------------------------------------------------------------------

/** Approver sends a version in review back to its author; the comment is kept as a review comment and mailed to the authors. */
export async function returnVersion(
  db: Knex,
  actor: Actor,
  recipeId: number,
  version: number,
  body: ReturnBody,
  now = new Date(),
  mail: MailSettings = DEFAULT_MAIL_SETTINGS,
): Promise<RecipeVersionDto> {
  const userId = requireActor(actor);
  await withConflicts(db, recipeId, version, () =>
    db.transaction(async (trx) => {
      const v = await requireVersion(trx, recipeId, version);
      const number = await numberOf(trx, recipeId);
      expectState(number, v, ['in-review'], 'returned', body.revision);
      const commentId = await insertReviewComment(trx, {
        version_id: v.id,
        author_id: userId,
        author_name: actor.name.slice(0, 100),
        body: body.comment,
        path: '',
        created_at: now,
      });
      await updateVersionState(trx, v.id, { status: 'returned' });
      await notifyReturned(trx, mail, v.id, refOf(recipeId, number, v), actor.name, body.comment, now);
      await appendTrailEvent(
        trx,
        actor,
        {
          type: TRAIL_EVENTS.versionReturned,
          entityType: 'recipe_version',
          entityId: v.id,
          before: { status: v.status, revision: v.revision },
          after: { status: 'returned', revision: v.revision + 1, commentId, comment: body.comment },
        },
        now,
      );
    }),
  );
  return versionDto(db, recipeId, version);
}

// --- approve ------------------------------------------------------------------------------

function ownVersion(): AppError {
  return new AppError(403, 'OWN_VERSION', [{ path: '', message: 'You authored or edited this version, so another approver must review and approve it.' }]);
}

async function reviewIntervalMonths(db: Knex): Promise<number> {
  const months = (await findLabSettings(db))?.review_interval_months;
  return typeof months === 'number' && months > 0 ? months : DEFAULT_REVIEW_INTERVAL_MONTHS;
}

/**
 * Approver signs: password again, meaning "approved", optional comment; every warning
 * acknowledged; never a version they authored or edited. Effective today, the version is
 * current at once and the previous approved one is superseded; effective later, the
 * scheduled job does that on the day. The authors hear of the approval by mail, and the
 * machine's operators when the version is in use at once.
 */
export async function approveVersion(
  db: Knex,
  actor: Actor,
  recipeId: number,
  version: number,
  body: ApproveBody,
  now = new Date(),
  mail: MailSettings = DEFAULT_MAIL_SETTINGS,
): Promise<RecipeVersionDto> {
  const userId = requireActor(actor);
  const seen = await findVersion(db, recipeId, version);
  if (!seen) return versionDto(db, recipeId, version); // throws the right 404
  if (await isEditorOf(db, seen.id, userId)) throw ownVersion();
  if (seen.content_hash !== null && contentSha256(seen.content_json) !== seen.content_hash) {
    // Reported before refusing: the approver's answer says admins and auditors were told.
    const dto = await versionDto(db, recipeId, version);
    await reportIntegrityFailure(db, mail, { recipeId, number: dto.number, version, title: dto.title }, dto.integrity!);
    requireIntact(dto.number, seen);
  }

  // Field errors first, all at once; the password is checked before anything is locked.
  const today = utcDay(now);
  const effectiveFrom = body.effectiveDate ?? today;
  const errors: FieldError[] = [];
  if (!isCalendarDay(effectiveFrom)) errors.push({ path: 'effectiveDate', message: 'Use a real calendar date like 2027-01-31.' });
  else if (effectiveFrom < today) errors.push({ path: 'effectiveDate', message: `The effective date cannot be in the past (today is ${today}, UTC).` });
  let signerName = actor.name;
  try {
    signerName = (await verifySigner(db, actor, userId, body, { versionId: seen.id, meaning: 'approved' }, mail)).displayName;
  } catch (err) {
    if (!(err instanceof AppError && err.code === 'VALIDATION_FAILED')) throw err;
    errors.push(...err.errors);
  }
  if (errors.length > 0) throw AppError.validation(errors);
  const reviewDueOn = addMonths(effectiveFrom, await reviewIntervalMonths(db));

  await withConflicts(db, recipeId, version, () =>
    db.transaction(async (trx) => {
      const recipe = (await lockRecipe(trx, recipeId))!;
      const v = await requireVersion(trx, recipeId, version);
      expectState(recipe.number, v, ['in-review'], 'approved', body.revision);
      if (await isEditorOf(trx, v.id, userId)) throw ownVersion();

      const { content, checks } = await checksNow(trx, v);
      const blocking = blockerErrors(v, content, checks);
      if (blocking.length > 0) throw blockers(blocking, checks);
      const warnings = checks.filter((c) => c.severity === 'warning');
      const unacknowledged = warnings.filter((c) => !body.acknowledgedWarnings.includes(c.id));
      if (unacknowledged.length > 0) {
        throw AppError.validation(
          unacknowledged.map((c) => ({ path: 'acknowledgedWarnings', message: `Acknowledge the warning "${c.id}" before signing: ${c.message}` })),
        );
      }
      const acknowledged = [...new Set(warnings.map((c) => c.id))].sort();

      requireIntact(recipe.number, v);
      const signatureId = await insertSignature(trx, {
        version_id: v.id,
        signer_id: userId,
        signer_name: signerName.slice(0, 100),
        meaning: 'approved',
        comment: body.comment,
        signed_at: now,
        content_hash: v.content_hash!,
        acknowledged_warnings_json: JSON.stringify(acknowledged),
      });
      await updateVersionState(trx, v.id, {
        status: 'approved',
        effective_from: effectiveFrom,
        review_due_on: reviewDueOn,
        checks_json: JSON.stringify(checks),
        worst_check: worstSeverity(checks),
      });
      await assignCheckCode(trx, v.id);
      const current = effectiveFrom <= today;
      const superseded = current ? await makeCurrent(trx, recipe, v, now) : [];
      const ref = refOf(recipeId, recipe.number, v);
      await notifyApproved(trx, mail, v.id, ref, signerName, effectiveFrom, current, now);
      if (current) {
        await notifyVersionCurrent(trx, mail, { machineId: v.machine_id, changeReason: content.changeReason, replaces: replacedVersion(superseded) }, ref, now);
      }

      await appendTrailEvent(
        trx,
        actor,
        {
          type: TRAIL_EVENTS.versionApproved,
          entityType: 'recipe_version',
          entityId: v.id,
          before: { status: v.status, revision: v.revision },
          after: {
            status: 'approved',
            revision: v.revision + 1,
            signatureId,
            signerName,
            meaning: 'approved',
            comment: body.comment,
            contentSha256: v.content_hash,
            acknowledgedWarnings: acknowledged,
            effectiveFrom,
            reviewDueOn,
            current,
          },
        },
        now,
      );
      await recordSuperseded(trx, actor, superseded, v, now);
    }),
  );
  return versionDto(db, recipeId, version);
}

// --- withdraw -----------------------------------------------------------------------------

/** Approver takes an approved version (current or still to come) out of use, signed, with a reason. */
export async function withdrawVersion(
  db: Knex,
  actor: Actor,
  recipeId: number,
  version: number,
  body: WithdrawBody,
  now = new Date(),
  mail: MailSettings = DEFAULT_MAIL_SETTINGS,
): Promise<RecipeVersionDto> {
  const userId = requireActor(actor);
  const seen = await findVersion(db, recipeId, version);
  if (!seen) return versionDto(db, recipeId, version); // 404
  const { displayName } = await verifySigner(db, actor, userId, body, { versionId: seen.id, meaning: 'withdrawn' }, mail);

  await withConflicts(db, recipeId, version, () =>
    db.transaction(async (trx) => {
      const recipe = (await lockRecipe(trx, recipeId))!;
      const v = await requireVersion(trx, recipeId, version);
      expectState(recipe.number, v, ['approved'], 'withdrawn', body.revision);
      const signatureId = await insertSignature(trx, {
        version_id: v.id,
        signer_id: userId,
        signer_name: displayName.slice(0, 100),
        meaning: 'withdrawn',
        comment: body.reason,
        signed_at: now,
        content_hash: v.content_hash!,
        acknowledged_warnings_json: '[]',
      });
      await updateVersionState(trx, v.id, { status: 'withdrawn', withdrawn_at: now, withdrawn_reason: body.reason });
      const wasCurrent = recipe.current_version_id === v.id;
      // A withdrawn version is out of use: the recipe has no current version until another is approved.
      if (wasCurrent) await setCurrentVersion(trx, recipe.id, null, now);
      await appendTrailEvent(
        trx,
        actor,
        {
          type: TRAIL_EVENTS.versionWithdrawn,
          entityType: 'recipe_version',
          entityId: v.id,
          before: { status: v.status, revision: v.revision, current: wasCurrent },
          after: {
            status: 'withdrawn',
            revision: v.revision + 1,
            current: false,
            signatureId,
            signerName: displayName,
            meaning: 'withdrawn',
            reason: body.reason,
          },
        },
        now,
      );
    }),
  );
  return versionDto(db, recipeId, version);
}

// --- new version --------------------------------------------------------------------------

const CLOSED: readonly RecipeStatus[] = ['approved', 'superseded', 'withdrawn'];

/**
 * A new draft (number n+1) copied from a closed version, with the change reason set and the
 * photos copied. A recipe has at most one open (draft, in-review or returned) version.
 */
export async function createNextVersion(db: Knex, actor: Actor, recipeId: number, body: NewVersionBody, now = new Date()): Promise<RecipeVersionDto> {
  const userId = requireActor(actor);
  const next = await db.transaction(async (trx) => {
    const recipe = await lockRecipe(trx, recipeId);
    if (!recipe) throw AppError.notFound(`There is no recipe with id ${recipeId}.`);
    const source = await lockVersion(trx, recipeId, body.fromVersion);
    if (!source) throw AppError.validation([{ path: 'fromVersion', message: `${recipe.number} has no version ${body.fromVersion}.` }]);
    if (!CLOSED.includes(source.status)) {
      throw AppError.conflict(
        `${label(recipe.number, source)} is ${RECIPE_STATUS_PHRASES[source.status]}; a new version starts from an approved, superseded or withdrawn one.`,
        'fromVersion',
      );
    }
    const open = await findOpenVersion(trx, recipeId);
    if (open) {
      throw AppError.conflict(
        `${label(recipe.number, open)} is still ${RECIPE_STATUS_PHRASES[open.status]}. A recipe has one open version at a time: finish that one first.`,
        'fromVersion',
      );
    }
    const n = (await maxVersionNumber(trx, recipeId)) + 1;
    const content = { ...(JSON.parse(source.content_json) as RecipeContent), changeReason: body.changeReason };
    const values = contentValues(source.title, content, await loadRecipeContext(trx, content));
    const versionId = await insertVersion(trx, {
      ...values,
      recipe_id: recipeId,
      version: n,
      status: 'draft',
      revision: 0,
      content_hash: null,
      created_by: userId,
      updated_by: userId,
      created_at: now,
      updated_at: now,
    });
    await updateRecipeRow(trx, recipeId, { latest_version_id: versionId, title: source.title, updated_at: now });
    await touchEditor(trx, versionId, userId, now);
    const photos = await copyAttachments(trx, source.id, versionId, userId, now);
    await appendTrailEvent(
      trx,
      actor,
      {
        type: TRAIL_EVENTS.versionCreated,
        entityType: 'recipe_version',
        entityId: versionId,
        before: null,
        after: {
          version: n,
          status: 'draft',
          fromVersion: source.version,
          changeReason: body.changeReason,
          photosCopied: photos,
          worstCheck: values.worst_check,
        },
      },
      now,
    );
    return n;
  });
  return versionDto(db, recipeId, next);
}
