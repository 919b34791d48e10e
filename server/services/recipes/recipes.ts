/**
 * Recipes and their drafts: create (the server hands out the number),
 * the library list, versions, and saving a draft with optimistic concurrency — a stale
 * save gets 409 with the version as it is now, never a silent overwrite.
 */
import type { Knex } from 'knex';
import type { Page } from '../../../shared/api-types';
import { convertHardness } from '../../../shared/hardness';
import { runChecks, worstSeverity } from '../../../shared/recipe-checks';
import type { RecipeContext } from '../../../shared/recipe-context';
import type { RecipeSummary, RecipeVersionDto } from '../../../shared/recipe-types';
import type { CreateRecipeBody, RecipeContent, RecipeListQuery, SaveDraftBody } from '../../../shared/schemas/recipe';
import { AppError } from '../../app-error';
import { listAttachmentMetaRows } from '../../data/attachments';
import {
  findRecipeRow,
  findVersion,
  insertRecipe,
  insertVersion,
  listRecipeSummaryRows,
  listVersionRows,
  saveDraftRow,
  takeNextRecipeNumber,
  updateRecipeRow,
  type VersionContentValues,
} from '../../data/recipes';
import { listEditorRows, listSignatureRows, touchEditor } from '../../data/workflow';
import { listVersionEventRows } from '../../data/trail-events';
import { myAcknowledgement, type Viewer } from './acknowledgements';
import type { Actor } from '../actor';
import { TRAIL_EVENTS } from '../trail/event-types';
import { appendTrailEvent } from '../trail/append';
import { canonicalJson } from '../../../shared/canonical-json';
import { changedKeys } from '../trail/changes';
import { canSeeStatus, recipeNotFound, visibleVersion, type VersionScope } from '../operator/visibility';
import { loadRecipeContext } from './context-loader';
import { toRecipeSummary, toVersionDto } from './recipe-dto';
import { utcDay } from '../../../shared/calendar-dates';
import { RECIPE_STATUS_PHRASES, type HardnessScale, type MaterialGroup } from '../../../shared/vocabulary';

export function formatRecipeNumber(n: number): string {
  return `KB-${String(n).padStart(4, '0')}`;
}

/** A hardness in HV: as measured on HV, converted for steels (ASTM E140 via shared/hardness), else null. */
function inHv(value: number, scale: HardnessScale, group: MaterialGroup): number | null {
  if (scale === 'HV') return value;
  const converted = convertHardness(value, scale, 'HV', group);
  return converted.ok ? converted.value : null;
}

/**
 * The hardness window in HV for the library's hardness filter: the scope's window, or the
 * material's typical hardness as a one-point window. Scales that do not convert for the
 * group (e.g. HRB on a copper alloy) stay null, and the filter leaves those recipes out.
 */
function hardnessHv(content: RecipeContent, ctx: RecipeContext): { min: number | null; max: number | null } {
  const group = content.scope.group;
  const window = content.scope.hardness;
  const typical = ctx.material?.hardness;
  const [min, max] = window
    ? [inHv(window.min, window.scale, group), inHv(window.max, window.scale, group)]
    : typical
      ? [inHv(typical.value, typical.scale, group), inHv(typical.value, typical.scale, group)]
      : [null, null];
  return min === null || max === null ? { min: null, max: null } : { min, max };
}

/** The columns a save writes, all derived from the content and its context. */
export function contentValues(title: string, content: RecipeContent, ctx: RecipeContext): VersionContentValues {
  const checks = runChecks(content, ctx);
  const hv = hardnessHv(content, ctx);
  return {
    title,
    content_json: canonicalJson(content),
    checks_json: JSON.stringify(checks),
    worst_check: worstSeverity(checks),
    material_group: content.scope.group,
    material_id: content.scope.materialId,
    shape: content.scope.shape,
    size_min_mm: content.scope.sizeMinMm,
    size_max_mm: content.scope.sizeMaxMm,
    hardness_min_hv: hv.min,
    hardness_max_hv: hv.max,
    machine_id: content.cutting.machineId,
    wheel_id: content.cutting.wheelId,
  };
}

/** One version as the API returns it, with photos and workflow facts; 404 when it does not exist. */
export async function versionDto(db: Knex, recipeId: number, version: number): Promise<RecipeVersionDto> {
  const row = await findVersion(db, recipeId, version);
  if (!row) {
    const recipe = await findRecipeRow(db, recipeId);
    throw AppError.notFound(recipe ? `Recipe ${recipe.number} has no version ${version}.` : `There is no recipe with id ${recipeId}.`);
  }
  const [attachments, signatures, editors, returns] = await Promise.all([
    listAttachmentMetaRows(db, [row.id]),
    listSignatureRows(db, [row.id]),
    listEditorRows(db, [row.id]),
    listVersionEventRows(db, TRAIL_EVENTS.versionReturned, [row.id]),
  ]);
  return toVersionDto(row, attachments, { signatures, editors, returns });
}

export function requireActor(actor: Actor): number {
  if (actor.userId === null) throw new Error('Recipes are written by a signed-in person.');
  return actor.userId;
}

export async function createRecipe(db: Knex, actor: Actor, body: CreateRecipeBody): Promise<RecipeVersionDto> {
  const userId = requireActor(actor);
  const ctx = await loadRecipeContext(db, body.content);
  const values = contentValues(body.title, body.content, ctx);
  const recipeId = await db.transaction(async (trx) => {
    const now = new Date();
    const number = formatRecipeNumber(await takeNextRecipeNumber(trx));
    const id = await insertRecipe(trx, { number, title: body.title, created_by: userId, created_at: now, updated_at: now });
    const versionId = await insertVersion(trx, {
      ...values,
      recipe_id: id,
      version: 1,
      status: 'draft',
      revision: 0,
      content_hash: null,
      created_by: userId,
      updated_by: userId,
      created_at: now,
      updated_at: now,
    });
    await updateRecipeRow(trx, id, { latest_version_id: versionId });
    await touchEditor(trx, versionId, userId, now);
    await appendTrailEvent(
      trx,
      actor,
      {
        type: TRAIL_EVENTS.recipeCreated,
        entityType: 'recipe',
        entityId: id,
        before: null,
        after: { number, title: body.title, version: 1, status: 'draft', worstCheck: values.worst_check },
      },
      now,
    );
    return id;
  });
  return versionDto(db, recipeId, 1);
}

const SORT_COLUMNS: Record<RecipeListQuery['sort'], string> = {
  // Numbers are handed out in creation order under the counter's lock, so id order is
  // number order — also past KB-9999, where text order would not be.
  number: 'r.id',
  title: 'v.title',
  group: 'v.material_group',
  status: 'v.status',
  updatedAt: 'v.updated_at',
  sizeMaxMm: 'v.size_max_mm',
};

/** The library; a `released` scope (operators) lists each recipe by its current approved version. */
export async function listRecipes(db: Knex, query: RecipeListQuery, scope: VersionScope = 'all'): Promise<Page<RecipeSummary>> {
  const { rows, total } = await listRecipeSummaryRows(db, {
    page: query.page,
    pageSize: query.pageSize,
    sortColumn: SORT_COLUMNS[query.sort],
    dir: query.dir,
    q: query.q || undefined,
    group: query.group,
    shape: query.shape,
    machineId: query.machineId,
    status: query.status,
    size: query.size,
    hardnessHv: query.hardnessHv,
    currentOnly: scope === 'released',
    reviewDueBefore: query.review === 'overdue' ? utcDay(new Date()) : undefined,
  });
  return { items: rows.map(toRecipeSummary), total, page: query.page, pageSize: query.pageSize };
}

export async function listVersions(db: Knex, recipeId: number, scope: VersionScope = 'all'): Promise<RecipeVersionDto[]> {
  const rows = (await listVersionRows(db, recipeId)).filter((r) => canSeeStatus(scope, r.status));
  if (rows.length === 0) throw recipeNotFound(recipeId);
  const ids = rows.map((r) => r.id);
  const [attachments, signatures, editors, returns] = await Promise.all([
    listAttachmentMetaRows(db, ids),
    listSignatureRows(db, ids),
    listEditorRows(db, ids),
    listVersionEventRows(db, TRAIL_EVENTS.versionReturned, ids),
  ]);
  return rows.map((row) => toVersionDto(row, attachments, { signatures, editors, returns }));
}

/**
 * One version for the person asking; `viewer` (the signed-in person) adds whether they, as
 * an operator of its machine, must still acknowledge it.
 */
export async function getVersion(db: Knex, recipeId: number, version: number, scope: VersionScope = 'all', viewer?: Viewer): Promise<RecipeVersionDto> {
  // The version is read while its visibility is checked (one wait instead of three); a
  // refusal of visibility wins over anything the read found.
  const [seen, read] = await Promise.allSettled([
    visibleVersion(db, scope, recipeId, version).then(async (row) => (viewer ? await myAcknowledgement(db, viewer, row) : undefined)),
    versionDto(db, recipeId, version),
  ]);
  if (seen.status === 'rejected') throw seen.reason;
  if (read.status === 'rejected') throw read.reason;
  return viewer ? { ...read.value, myAcknowledgement: seen.value ?? null } : read.value;
}

const EDITABLE = new Set(['draft', 'returned']);

function notEditable(dto: RecipeVersionDto): AppError {
  return AppError.conflict(
    `Version ${dto.version} of ${dto.number} is ${RECIPE_STATUS_PHRASES[dto.status]}, and only drafts can be edited. Start a new version to change it.`,
  );
}

function stale(dto: RecipeVersionDto): AppError {
  return new AppError(
    409,
    'CONFLICT',
    [
      {
        path: 'revision',
        message: `${dto.updatedBy.name} saved this draft after you opened it (now revision ${dto.revision}). Compare your changes with theirs and save again.`,
      },
    ],
    { extra: { current: dto } },
  );
}

/**
 * Saves a draft. The write is one conditional UPDATE (revision and status in its WHERE),
 * so of two saves based on the same revision exactly one lands; the other gets 409 with
 * the version as it is now. A returned version becomes a draft again: the author's edit is
 * the answer to the approver's comments.
 */
export async function saveDraft(db: Knex, actor: Actor, recipeId: number, version: number, body: SaveDraftBody, at = new Date()): Promise<RecipeVersionDto> {
  const userId = requireActor(actor);
  const before = await findVersion(db, recipeId, version);
  if (!before) return versionDto(db, recipeId, version); // throws the right 404
  if (!EDITABLE.has(before.status)) throw notEditable(toVersionDto(before, []));

  const ctx = await loadRecipeContext(db, body.content);
  const values = contentValues(body.title, body.content, ctx);

  const saved = await db.transaction(async (trx) => {
    // `before` must be the revision the editor started from, or its content is not what
    // the editor changed: then the save is stale whatever the UPDATE would say.
    if (before.revision !== body.revision) return false;
    const now = at;
    const changed = await saveDraftRow(trx, before.id, body.revision, { ...values, updated_by: userId, updated_at: now });
    if (changed !== 1) return false;
    // Whoever saves a version has edited it, and may never approve it.
    await touchEditor(trx, before.id, userId, now);
    const recipe = await findRecipeRow(trx, recipeId);
    if (recipe?.latest_version_id === before.id) await updateRecipeRow(trx, recipeId, { title: body.title, updated_at: now });
    const contentKeys = changedKeys(JSON.parse(before.content_json) as Record<string, unknown>, JSON.parse(values.content_json) as Record<string, unknown>);
    const trailBefore: Record<string, unknown> = { revision: before.revision };
    const trailAfter: Record<string, unknown> = { revision: before.revision + 1, changed: contentKeys };
    if (before.title !== body.title) {
      trailBefore['title'] = before.title;
      trailAfter['title'] = body.title;
    }
    if (before.status !== 'draft') {
      trailBefore['status'] = before.status;
      trailAfter['status'] = 'draft';
    }
    if (before.worst_check !== values.worst_check) {
      trailBefore['worstCheck'] = before.worst_check;
      trailAfter['worstCheck'] = values.worst_check;
    }
    await appendTrailEvent(
      trx,
      actor,
      { type: TRAIL_EVENTS.draftSaved, entityType: 'recipe_version', entityId: before.id, before: trailBefore, after: trailAfter },
      now,
    );
    return true;
  });

  // Read after the transaction: inside it, a consistent read would still show the old snapshot.
  const current = await versionDto(db, recipeId, version);
  if (saved) return current;
  if (!EDITABLE.has(current.status)) throw notEditable(current);
  throw stale(current);
}
