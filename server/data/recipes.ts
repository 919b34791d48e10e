/** Queries on recipes, recipe_versions and the recipe number counter. */
import type { Knex } from 'knex';
import type { RecipeStatus } from '../../shared/vocabulary';
import { wordsMatch } from './search-words';

export interface RecipeRow {
  id: number;
  number: string;
  title: string;
  latest_version_id: number | null;
  /** The approved version in use today (review migration); null when none is. */
  current_version_id?: number | null;
  created_by: number;
  created_at: Date;
  updated_at: Date;
}

/** The columns a save writes: content, its copies for the library, the checks. */
export interface VersionContentValues {
  title: string;
  content_json: string;
  checks_json: string;
  worst_check: 'blocker' | 'warning' | 'note' | null;
  material_group: string;
  material_id: number | null;
  shape: string;
  size_min_mm: number;
  size_max_mm: number;
  hardness_min_hv: number | null;
  hardness_max_hv: number | null;
  machine_id: number;
  wheel_id: number;
}

export interface VersionRow extends VersionContentValues {
  id: number;
  recipe_id: number;
  version: number;
  status: RecipeStatus;
  revision: number;
  content_hash: string | null;
  created_by: number;
  updated_by: number;
  created_at: Date;
  updated_at: Date;
  /** Workflow columns (review migration); null until the step happens. */
  submitted_at?: Date | null;
  /** UTC calendar days (DATE columns, read as midnight UTC). */
  effective_from?: Date | null;
  review_due_on?: Date | null;
  superseded_at?: Date | null;
  withdrawn_at?: Date | null;
  withdrawn_reason?: string | null;
}

/** A version with what its DTO needs from other tables. */
export interface VersionWithNames extends VersionRow {
  number: string;
  created_by_name: string;
  updated_by_name: string;
}

/**
 * The next recipe number. The counter row is locked until the calling transaction ends,
 * so concurrent creates queue here and never share a number.
 */
export async function takeNextRecipeNumber(trx: Knex.Transaction): Promise<number> {
  const row = (await trx('recipe_number_counter').where({ id: 1 }).forUpdate().first()) as { last_number: number } | undefined;
  if (!row) throw new Error('The recipe number counter row is missing (run the migrations).');
  const next = row.last_number + 1;
  await trx('recipe_number_counter').where({ id: 1 }).update({ last_number: next });
  return next;
}

export async function insertRecipe(db: Knex, row: Omit<RecipeRow, 'id' | 'latest_version_id'>): Promise<number> {
  const [id] = await db('recipes').insert({ ...row, latest_version_id: null });
  return id!;
}

export async function updateRecipeRow(db: Knex, id: number, changes: Partial<Omit<RecipeRow, 'id'>>): Promise<void> {
  await db('recipes').where({ id }).update(changes);
}

export async function insertVersion(db: Knex, row: Omit<VersionRow, 'id'>): Promise<number> {
  const [id] = await db('recipe_versions').insert(row);
  return id!;
}

export async function findRecipeRow(db: Knex, id: number): Promise<RecipeRow | undefined> {
  return db<RecipeRow>('recipes').where({ id }).first();
}

function versionsWithNames(db: Knex) {
  return db('recipe_versions as v')
    .join('recipes as r', 'r.id', 'v.recipe_id')
    .join('users as cu', 'cu.id', 'v.created_by')
    .join('users as uu', 'uu.id', 'v.updated_by')
    .select('v.*', 'r.number as number', 'cu.display_name as created_by_name', 'uu.display_name as updated_by_name');
}

export async function findVersion(db: Knex, recipeId: number, version: number): Promise<VersionWithNames | undefined> {
  return versionsWithNames(db).where({ 'v.recipe_id': recipeId, 'v.version': version }).first();
}

export async function findVersionById(db: Knex, id: number): Promise<VersionWithNames | undefined> {
  return versionsWithNames(db).where({ 'v.id': id }).first();
}

/** Newest first. */
export async function listVersionRows(db: Knex, recipeId: number): Promise<VersionWithNames[]> {
  return versionsWithNames(db).where({ 'v.recipe_id': recipeId }).orderBy('v.version', 'desc');
}

/**
 * The one conditional write behind "save draft": it lands only if the version is still at
 * the revision the editor started from and still editable (a returned version becomes a
 * draft again). Answers how many rows changed: 1 saved, 0 refused.
 */
export async function saveDraftRow(
  db: Knex,
  versionId: number,
  expectedRevision: number,
  values: VersionContentValues & { updated_by: number; updated_at: Date },
): Promise<number> {
  return (
    db('recipe_versions')
      .where({ id: versionId, revision: expectedRevision })
      .whereIn('status', ['draft', 'returned'])
      // A returned version keeps the hash of what was reviewed until this edit: the edit makes
      // it a draft again and clears the hash in the same statement (the freeze trigger allows
      // exactly that step).
      .update({ ...values, status: 'draft', content_hash: null, revision: db.raw('revision + 1') })
  );
}

export interface RecipeListFilter {
  page: number;
  pageSize: number;
  sortColumn: string;
  dir: 'asc' | 'desc';
  q?: string | undefined;
  group?: string | undefined;
  shape?: string | undefined;
  machineId?: number | undefined;
  status?: string | undefined;
  size?: number | undefined;
  hardnessHv?: number | undefined;
  /** List each recipe by its current version (operators), leaving out recipes without one. */
  currentOnly?: boolean | undefined;
  /** Only recipes whose current version's periodic review was due before this UTC day. */
  reviewDueBefore?: string | undefined;
}

export interface RecipeSummaryRow {
  id: number;
  number: string;
  title: string;
  version: number;
  status: RecipeStatus;
  material_group: string;
  material_name: string | null;
  shape: string;
  size_min_mm: number;
  size_max_mm: number;
  machine_name: string;
  wheel_name: string;
  worst_check: 'blocker' | 'warning' | 'note' | null;
  updated_at: Date;
  /** The periodic review date of the current version, where the query reads it. */
  review_due_on?: Date | string | null;
}

/** The library: each recipe with its latest version, filtered and sorted on indexed columns. */
/** The columns of a library row (recipes r, versions v, materials m, machines mc, wheels w). */
export const SUMMARY_COLUMNS = [
  'r.id',
  'r.number',
  'v.title',
  'v.version',
  'v.status',
  'v.material_group',
  'm.name as material_name',
  'v.shape',
  'v.size_min_mm',
  'v.size_max_mm',
  'mc.name as machine_name',
  'w.name as wheel_name',
  'v.worst_check',
  'v.updated_at',
] as const;

/**
 * The same row from the library columns kept on `recipes` (migration 20261202022722): the
 * latest version's fields without reading the wide version row.
 */
const LIBRARY_COLUMNS = [
  'r.id',
  'r.number',
  'r.lib_title as title',
  'r.lib_version as version',
  'r.lib_status as status',
  'r.lib_material_group as material_group',
  'm.name as material_name',
  'r.lib_shape as shape',
  'r.lib_size_min_mm as size_min_mm',
  'r.lib_size_max_mm as size_max_mm',
  'mc.name as machine_name',
  'w.name as wheel_name',
  'r.lib_worst_check as worst_check',
  'r.lib_updated_at as updated_at',
] as const;

/** `v.title` → `r.lib_title`: a version column as the library keeps it on the recipe. */
const onRecipe = (column: string) => (column.startsWith('v.') ? `r.lib_${column.slice(2)}` : column);

export async function listRecipeSummaryRows(db: Knex, filter: RecipeListFilter): Promise<{ rows: RecipeSummaryRow[]; total: number }> {
  // Operators list current versions (joined); everyone else the latest, from the recipe row.
  const col = filter.currentOnly ? (c: string) => c : onRecipe;
  // Within a group or machine the library walks that index (few rows, in title order);
  // otherwise, and for operators' current versions, the full-text index finds the words.
  const narrowed = !filter.currentOnly && Boolean(filter.group || filter.machineId);
  const matchesWords = await wordsMatch(db, filter.currentOnly ? 'r.current_search' : 'r.lib_search', filter.q ?? '', !narrowed);
  const filtered = (query: Knex.QueryBuilder) => {
    matchesWords(query);
    if (filter.group) query.where(col('v.material_group'), filter.group);
    if (filter.shape) query.where(col('v.shape'), filter.shape);
    if (filter.machineId) query.where(col('v.machine_id'), filter.machineId);
    if (filter.status) query.where(col('v.status'), filter.status);
    if (filter.size !== undefined) query.where(col('v.size_min_mm'), '<=', filter.size).andWhere(col('v.size_max_mm'), '>=', filter.size);
    if (filter.hardnessHv !== undefined)
      query.where(col('v.hardness_min_hv'), '<=', filter.hardnessHv).andWhere(col('v.hardness_max_hv'), '>=', filter.hardnessHv);
    // Overdue: a range on the review-due index, then the versions that are their recipe's current one.
    if (filter.reviewDueBefore !== undefined)
      query.whereIn('r.current_version_id', db('recipe_versions').where('review_due_on', '<', filter.reviewDueBefore).select('id'));
    return query;
  };
  const joined = filter.currentOnly
    ? db('recipes as r')
        .join('recipe_versions as v', 'v.id', 'r.current_version_id')
        .leftJoin('materials as m', 'm.id', 'v.material_id')
        .join('machines as mc', 'mc.id', 'v.machine_id')
        .join('wheels as w', 'w.id', 'v.wheel_id')
        .where('v.status', 'approved')
        .select('v.review_due_on')
    : // Left joins (machine and wheel are never null): MariaDB then reads recipes first, by the
      // filter's index, instead of starting from the three machines and scanning recipes.
      // No "has a latest version" condition: every recipe has one outside its creating
      // transaction, and the condition would keep MariaDB off the narrow indexes.
      db('recipes as r')
        .leftJoin('materials as m', 'm.id', 'r.lib_material_id')
        .leftJoin('machines as mc', 'mc.id', 'r.lib_machine_id')
        .leftJoin('wheels as w', 'w.id', 'r.lib_wheel_id')
        // The current version's review date (its primary key), for the overdue marker.
        .leftJoin('recipe_versions as cv', 'cv.id', 'r.current_version_id')
        .select('cv.review_due_on');
  // The count reads only what the filters need, so it can be answered from an index.
  const counted = filter.currentOnly ? joined.clone() : db('recipes as r');
  const [{ total }] = (await filtered(counted).count<{ total: number }[]>({ total: '*' })) as [{ total: number }];
  const rows = (await filtered(joined)
    .select(...(filter.currentOnly ? SUMMARY_COLUMNS : LIBRARY_COLUMNS))
    .orderBy(col(filter.sortColumn), filter.dir)
    .orderBy('r.id', filter.dir)
    .limit(filter.pageSize)
    .offset(filter.page * filter.pageSize)) as RecipeSummaryRow[];
  return { rows, total: Number(total) };
}
