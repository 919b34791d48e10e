/**
 * What a person may see of the library: operators work from current approved versions
 * only, so an unapproved or obsolete version never reaches the saw. Someone who holds none of the roles that read the whole library (author,
 * approver, auditor, admin) sees released versions only — approved, superseded and
 * withdrawn ones — and the library lists each recipe by its current version. Drafts,
 * versions in review and returned versions answer exactly like versions that do not exist.
 *
 * Every read path that shows a version (list, versions, one version, comments, compare,
 * cuts) asks here, so the rule lives in one place.
 */
import type { Knex } from 'knex';
import type { Role } from '../../../shared/roles';
import type { RecipeStatus } from '../../../shared/vocabulary';
import { AppError } from '../../app-error';
import { findRecipeRow, findVersion, type VersionWithNames } from '../../data/recipes';

/** `all`: every version; `released`: approved, superseded and withdrawn versions only. */
export type VersionScope = 'all' | 'released';

/** Roles that read every version, drafts included. */
const READS_EVERY_VERSION: readonly Role[] = ['author', 'approver', 'auditor', 'admin'];

export const RELEASED_STATUSES: readonly RecipeStatus[] = ['approved', 'superseded', 'withdrawn'];

export function versionScopeOf(roles: readonly Role[] | undefined): VersionScope {
  return roles?.some((r) => READS_EVERY_VERSION.includes(r)) ? 'all' : 'released';
}

export function canSeeStatus(scope: VersionScope, status: RecipeStatus): boolean {
  return scope === 'all' || RELEASED_STATUSES.includes(status);
}

async function releasedVersionCount(db: Knex, recipeId: number): Promise<number> {
  const row = (await db('recipe_versions')
    .where({ recipe_id: recipeId })
    .whereIn('status', [...RELEASED_STATUSES])
    .count<{ n: number }[]>({ n: '*' })
    .first()) as { n: number };
  return Number(row.n);
}

/**
 * The 404 for a version the person cannot see, worded as for one that does not exist. A
 * recipe none of whose versions the person may see is answered as an unknown recipe.
 */
export async function versionNotFound(db: Knex, scope: VersionScope, recipeId: number, version: number): Promise<AppError> {
  const recipe = await findRecipeRow(db, recipeId);
  const known = recipe && (scope === 'all' || (await releasedVersionCount(db, recipeId)) > 0);
  return AppError.notFound(known ? `Recipe ${recipe.number} has no version ${version}.` : `There is no recipe with id ${recipeId}.`);
}

/** The 404 for a recipe the person cannot see any version of. */
export function recipeNotFound(recipeId: number): AppError {
  return AppError.notFound(`There is no recipe with id ${recipeId}.`);
}

/** The version when it exists and the person may see it; otherwise the same 404 as an unknown version. */
export async function visibleVersion(db: Knex, scope: VersionScope, recipeId: number, version: number): Promise<VersionWithNames> {
  const row = await findVersion(db, recipeId, version);
  if (row && canSeeStatus(scope, row.status)) return row;
  throw await versionNotFound(db, scope, recipeId, version);
}
