/**
 * GET /api/recipes/:id/compare: two versions of one recipe side by side, built by the
 * shared compareVersions() so the server and the client label changes the same way.
 */
import type { Knex } from 'knex';
import type { UnitPreference } from '../../../shared/api-types';
import { compareVersions, type StockNames } from '../../../shared/recipe-compare';
import type { RecipeComparison } from '../../../shared/recipe-types';
import type { RecipeContent } from '../../../shared/schemas/recipe';
import { AppError } from '../../app-error';
import { findRecipeRow, findVersion, type VersionWithNames } from '../../data/recipes';
import { findStockRows, type StockRowBase, type StockTable } from '../../data/stock';
import { fromJsonColumn } from '../../data/json-column';
import { visibleVersion, type VersionScope } from '../operator/visibility';
import { keptWordDiff } from './text-diff-memo';
import { listSignatureRows } from '../../data/workflow';
import { versionIntegrity } from './version-integrity';

async function versionOrNotFound(db: Knex, recipeId: number, version: number): Promise<VersionWithNames> {
  const row = await findVersion(db, recipeId, version);
  if (row) return row;
  const recipe = await findRecipeRow(db, recipeId);
  throw AppError.notFound(recipe ? `Recipe ${recipe.number} has no version ${version}.` : `There is no recipe with id ${recipeId}.`);
}

/** Names of the given stock records, archived ones included (an old version may use them). */
async function namesOf(db: Knex, table: StockTable, ids: (number | null)[]): Promise<Map<number, string>> {
  const wanted = [...new Set(ids.filter((id): id is number => id !== null))];
  const rows = await findStockRows<StockRowBase & { name: string }>(db, table, wanted);
  return new Map(rows.map((r) => [r.id, r.name]));
}

export async function compareRecipeVersions(
  db: Knex,
  recipeId: number,
  from: number,
  to: number,
  pref: UnitPreference,
  scope: VersionScope = 'all',
): Promise<RecipeComparison> {
  const read = (n: number) => (scope === 'all' ? versionOrNotFound(db, recipeId, n) : visibleVersion(db, scope, recipeId, n));
  // Both sides at once; when both are missing, the "from" side's answer is the one given.
  const [sideA, sideB] = await Promise.allSettled([read(from), read(to)]);
  if (sideA.status === 'rejected') throw sideA.reason;
  if (sideB.status === 'rejected') throw sideB.reason;
  const [a, b] = [sideA.value, sideB.value];
  const contentA = fromJsonColumn<RecipeContent>(a.content_json);
  const contentB = fromJsonColumn<RecipeContent>(b.content_json);
  const [materials, wheels, machines] = await Promise.all([
    namesOf(db, 'materials', [contentA.scope.materialId, contentB.scope.materialId]),
    namesOf(db, 'wheels', [contentA.cutting.wheelId, contentB.cutting.wheelId]),
    namesOf(db, 'machines', [contentA.cutting.machineId, contentB.cutting.machineId]),
  ]);
  const names: StockNames = { materials, wheels, machines };
  const comparison = compareVersions(
    { version: a.version, status: a.status, title: a.title, content: contentA },
    { version: b.version, status: b.status, title: b.title, content: contentB },
    names,
    pref,
    keptWordDiff,
  );
  // Each side's content held against its signatures, as a read of the version does.
  const signatures = await listSignatureRows(db, [a.id, b.id]);
  const integrityOf = (row: typeof a) =>
    versionIntegrity(
      row,
      signatures.filter((s) => s.version_id === row.id),
    );
  return {
    recipeId,
    number: a.number,
    ...comparison,
    from: { ...comparison.from, integrity: integrityOf(a) },
    to: { ...comparison.to, integrity: integrityOf(b) },
  };
}
