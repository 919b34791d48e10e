/** Queries behind check codes: setting a version's code and finding a version by its code. */
import type { Knex } from 'knex';
import type { RecipeStatus } from '../../shared/vocabulary';

/** Sets the code of a version that has none; MariaDB's unique index refuses a duplicate (ER_DUP_ENTRY). */
export async function setCheckCode(trx: Knex, versionId: number, code: string): Promise<number> {
  return trx('recipe_versions').where({ id: versionId }).whereNull('check_code').update({ check_code: code });
}

export interface CheckedVersionRow {
  id: number;
  recipe_id: number;
  version: number;
  status: RecipeStatus;
  check_code: string;
  effective_from: Date | string | null;
  withdrawn_at: Date | null;
  superseded_at: Date | null;
  number: string;
  title: string;
  /** The version in force now, or null. */
  current_version: number | null;
}

export async function findVersionByCheckCode(db: Knex, code: string): Promise<CheckedVersionRow | undefined> {
  return db('recipe_versions as v')
    .join('recipes as r', 'r.id', 'v.recipe_id')
    .leftJoin('recipe_versions as c', 'c.id', 'r.current_version_id')
    .where('v.check_code', code)
    .first(
      'v.id',
      'v.recipe_id',
      'v.version',
      'v.status',
      'v.check_code',
      'v.effective_from',
      'v.withdrawn_at',
      'v.superseded_at',
      'r.number',
      'v.title',
      'c.version as current_version',
    );
}
