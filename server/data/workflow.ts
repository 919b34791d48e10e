/**
 * Queries of the review workflow: row locks for transitions, signatures, review comments,
 * the editors of each version, the recipe's current version and the lists behind Today
 * and "reviews due".
 *
 * Lock order, everywhere: the recipe row first (whoever changes which version is current
 * or adds a version), then version rows by primary key. Versions other than the one acted
 * on are locked by id, never through a range scan, so two transactions never wait on each
 * other in a circle.
 */
import type { Knex } from 'knex';
import type { RecipeStatus } from '../../shared/vocabulary';
import type { SignatureMeaning } from '../../shared/schemas/workflow';
import { SUMMARY_COLUMNS, type RecipeSummaryRow, type VersionRow } from './recipes';

export interface LockedRecipe {
  id: number;
  number: string;
  latest_version_id: number | null;
  current_version_id: number | null;
}

export async function lockRecipe(trx: Knex.Transaction, recipeId: number): Promise<LockedRecipe | undefined> {
  return trx('recipes').where({ id: recipeId }).forUpdate().first('id', 'number', 'latest_version_id', 'current_version_id');
}

/** The recipe row, or undefined when another transaction holds it (the scheduled job comes back later). */
export async function lockRecipeSkipLocked(trx: Knex.Transaction, recipeId: number): Promise<LockedRecipe | undefined> {
  return trx('recipes').where({ id: recipeId }).forUpdate().skipLocked().first('id', 'number', 'latest_version_id', 'current_version_id');
}

/** One version row, locked (unique-index lookup: only this row). */
export async function lockVersion(trx: Knex.Transaction, recipeId: number, version: number): Promise<VersionRow | undefined> {
  return trx<VersionRow>('recipe_versions').where({ recipe_id: recipeId, version }).forUpdate().first();
}

export async function lockVersionsById(trx: Knex.Transaction, ids: readonly number[]): Promise<VersionRow[]> {
  if (ids.length === 0) return [];
  return trx<VersionRow>('recipe_versions').whereIn('id', ids).forUpdate().orderBy('version');
}

/** Versions of a recipe without their content (plain read). */
export async function listVersionStates(db: Knex, recipeId: number): Promise<Pick<VersionRow, 'id' | 'version' | 'status' | 'effective_from'>[]> {
  return db('recipe_versions').where({ recipe_id: recipeId }).select('id', 'version', 'status', 'effective_from').orderBy('version');
}

export type WorkflowColumns = Partial<
  Pick<
    VersionRow,
    'status' | 'content_hash' | 'checks_json' | 'worst_check' | 'submitted_at' | 'superseded_at' | 'withdrawn_at' | 'withdrawn_reason' | 'updated_at'
  >
> & {
  /** UTC days, YYYY-MM-DD (written as text so no time zone can shift them). */
  effective_from?: string;
  review_due_on?: string;
};

/** A state change on a locked version: the columns given, and the revision bumped. */
export async function updateVersionState(trx: Knex.Transaction, versionId: number, changes: WorkflowColumns): Promise<void> {
  await trx('recipe_versions')
    .where({ id: versionId })
    .update({ ...changes, revision: trx.raw('revision + 1') });
}

export async function setCurrentVersion(trx: Knex.Transaction, recipeId: number, versionId: number | null, at: Date): Promise<void> {
  await trx('recipes').where({ id: recipeId }).update({ current_version_id: versionId, updated_at: at });
}

// --- Signatures ---------------------------------------------------------------------------

export interface SignatureRow {
  id: number;
  version_id: number;
  signer_id: number;
  signer_name: string;
  meaning: SignatureMeaning;
  comment: string;
  signed_at: Date;
  content_hash: string;
  acknowledged_warnings_json: string;
}

export async function insertSignature(trx: Knex.Transaction, row: Omit<SignatureRow, 'id'>): Promise<number> {
  const [id] = await trx('signatures').insert(row);
  return id!;
}

export async function listSignatureRows(db: Knex, versionIds: readonly number[]): Promise<SignatureRow[]> {
  if (versionIds.length === 0) return [];
  return db<SignatureRow>('signatures').whereIn('version_id', versionIds).orderBy('id');
}

// --- Review comments ----------------------------------------------------------------------

export interface ReviewCommentRow {
  id: number;
  version_id: number;
  author_id: number;
  author_name: string;
  body: string;
  path: string;
  created_at: Date;
}

export async function insertReviewComment(trx: Knex.Transaction, row: Omit<ReviewCommentRow, 'id'>): Promise<number> {
  const [id] = await trx('review_comments').insert(row);
  return id!;
}

export async function listReviewCommentRows(db: Knex, versionId: number): Promise<ReviewCommentRow[]> {
  return db<ReviewCommentRow>('review_comments').where({ version_id: versionId }).orderBy('id');
}

export async function findReviewCommentRow(db: Knex, id: number): Promise<ReviewCommentRow | undefined> {
  return db<ReviewCommentRow>('review_comments').where({ id }).first();
}

// --- Editors ------------------------------------------------------------------------------

export interface EditorRow {
  version_id: number;
  user_id: number;
}

/** Records that the person created or changed the version (once per person; the last time kept). */
export async function touchEditor(db: Knex, versionId: number, userId: number, at: Date): Promise<void> {
  await db('recipe_version_editors')
    .insert({ version_id: versionId, user_id: userId, first_edited_at: at, last_edited_at: at })
    .onConflict(['version_id', 'user_id'])
    .merge({ last_edited_at: at });
}

export async function listEditorRows(db: Knex, versionIds: readonly number[]): Promise<EditorRow[]> {
  if (versionIds.length === 0) return [];
  return db<EditorRow>('recipe_version_editors').whereIn('version_id', versionIds).select('version_id', 'user_id').orderBy(['version_id', 'user_id']);
}

export async function isEditorOf(db: Knex, versionId: number, userId: number): Promise<boolean> {
  return Boolean(await db('recipe_version_editors').where({ version_id: versionId, user_id: userId }).first('user_id'));
}

// --- New versions -------------------------------------------------------------------------

const OPEN_STATUSES: readonly RecipeStatus[] = ['draft', 'in-review', 'returned'];

export async function findOpenVersion(db: Knex, recipeId: number): Promise<{ version: number; status: RecipeStatus } | undefined> {
  return db('recipe_versions').where({ recipe_id: recipeId }).whereIn('status', OPEN_STATUSES).first('version', 'status');
}

export async function maxVersionNumber(db: Knex, recipeId: number): Promise<number> {
  const row = (await db('recipe_versions').where({ recipe_id: recipeId }).max({ n: 'version' }).first()) as { n: number | null } | undefined;
  return Number(row?.n ?? 0);
}

/** Copies the photos of one version to another (a new draft keeps the photos it started from). */
export async function copyAttachments(trx: Knex.Transaction, fromVersionId: number, toVersionId: number, userId: number, at: Date): Promise<number> {
  const [result] = (await trx.raw(
    `INSERT INTO attachments (version_id, role, caption, file_name, mime_type, size_bytes, sha256, width, height, data, thumbnail, thumbnail_mime_type, thumbnail_sha256, created_by, created_at)
     SELECT ?, role, caption, file_name, mime_type, size_bytes, sha256, width, height, data, thumbnail, thumbnail_mime_type, thumbnail_sha256, ?, ?
       FROM attachments WHERE version_id = ? ORDER BY id`,
    [toVersionId, userId, at, fromVersionId],
  )) as [{ affectedRows: number }];
  return result.affectedRows;
}

// --- Scheduled supersession ---------------------------------------------------------------

/**
 * Recipes with an approved version whose effective day has come but which is not current:
 * a plain read; the job locks and looks again before it changes anything.
 */
export async function recipesWithDueVersions(db: Knex, today: string): Promise<number[]> {
  const rows = (await db('recipe_versions as v')
    .join('recipes as r', 'r.id', 'v.recipe_id')
    .where('v.status', 'approved')
    .andWhere('v.effective_from', '<=', today)
    .andWhere((w) => w.whereNull('r.current_version_id').orWhereRaw('r.current_version_id <> v.id'))
    .distinct('v.recipe_id')
    .orderBy('v.recipe_id')) as { recipe_id: number }[];
  return rows.map((r) => r.recipe_id);
}

// --- Lists: reviews due, Today ------------------------------------------------------------

export interface WorkflowSummaryRow extends RecipeSummaryRow {
  version_id: number;
  review_due_on: Date | null;
}

/** Library-style summary rows for a chosen version of each recipe (`versionColumn` joins it). */
function summaries(db: Knex, join: 'latest' | 'current') {
  return db('recipes as r')
    .join('recipe_versions as v', 'v.id', join === 'latest' ? 'r.latest_version_id' : 'r.current_version_id')
    .leftJoin('materials as m', 'm.id', 'v.material_id')
    .join('machines as mc', 'mc.id', 'v.machine_id')
    .join('wheels as w', 'w.id', 'v.wheel_id')
    .select(...SUMMARY_COLUMNS, 'v.id as version_id', 'v.review_due_on');
}

/** Current approved versions whose periodic review is due on or before `until`, soonest first. */
export async function reviewDueRows(db: Knex, until: string, limit: number): Promise<WorkflowSummaryRow[]> {
  return summaries(db, 'current')
    .where('v.status', 'approved')
    .whereNotNull('v.review_due_on')
    .andWhere('v.review_due_on', '<=', until)
    .orderBy('v.review_due_on')
    .orderBy('r.id')
    .limit(limit);
}

/** Recipes whose open version (the latest) is a draft or returned and was created or edited by the person. */
export async function myDraftRows(db: Knex, userId: number, limit: number): Promise<WorkflowSummaryRow[]> {
  return summaries(db, 'latest')
    .whereIn('v.status', ['draft', 'returned'])
    .whereExists((q) => q.select(db.raw('1')).from('recipe_version_editors as e').whereRaw('e.version_id = v.id').andWhere('e.user_id', userId))
    .orderBy('v.updated_at', 'desc')
    .orderBy('r.id')
    .limit(limit);
}

/** Versions in review that the person neither authored nor edited, oldest submission first. */
export async function waitingForReviewRows(db: Knex, userId: number, limit: number): Promise<WorkflowSummaryRow[]> {
  return summaries(db, 'latest')
    .where('v.status', 'in-review')
    .whereNotExists((q) => q.select(db.raw('1')).from('recipe_version_editors as e').whereRaw('e.version_id = v.id').andWhere('e.user_id', userId))
    .orderBy('v.submitted_at')
    .orderBy('r.id')
    .limit(limit);
}

/**
 * Current approved versions on the machines the person is assigned to that they have not
 * acknowledged yet, the most recently changed recipe first.
 */
export async function toAcknowledgeRows(db: Knex, userId: number, limit: number): Promise<WorkflowSummaryRow[]> {
  return summaries(db, 'current')
    .where('v.status', 'approved')
    .whereExists((q) => q.select(db.raw('1')).from('user_machines as um').whereRaw('um.machine_id = v.machine_id').andWhere('um.user_id', userId))
    .whereNotExists((q) => q.select(db.raw('1')).from('acknowledgements as a').whereRaw('a.version_id = v.id').andWhere('a.user_id', userId))
    .orderBy('r.updated_at', 'desc')
    .orderBy('r.id')
    .limit(limit);
}
