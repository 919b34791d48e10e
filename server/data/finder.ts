/** The finder's candidates: every recipe's current approved version with what matching needs. */
import type { Knex } from 'knex';
import { SUMMARY_COLUMNS, type RecipeSummaryRow } from './recipes';

export interface FinderCandidateRow extends RecipeSummaryRow {
  material_id: number | null;
  material_designation: string | null;
  /** The material's typical hardness on its own scale, when it has one. */
  material_hardness_value: number | null;
  material_hardness_scale: string | null;
  machine_id: number;
  content_json: string | object;
}

/**
 * Current versions only (recipes.current_version_id), and only while approved: a recipe
 * whose version was withdrawn has no current version. Optional prefilters narrow on indexed
 * columns; the matching itself (hardness, the material-or-group rule) is done in the service.
 */
export async function listFinderCandidates(db: Knex, filter: { groups?: readonly string[] | undefined }): Promise<FinderCandidateRow[]> {
  const q = db('recipes as r')
    .join('recipe_versions as v', 'v.id', 'r.current_version_id')
    .leftJoin('materials as m', 'm.id', 'v.material_id')
    .join('machines as mc', 'mc.id', 'v.machine_id')
    .join('wheels as w', 'w.id', 'v.wheel_id')
    .where('v.status', 'approved')
    .select(
      ...SUMMARY_COLUMNS,
      'v.material_id',
      'm.designation as material_designation',
      'm.hardness_value as material_hardness_value',
      'm.hardness_scale as material_hardness_scale',
      'v.machine_id',
      'v.content_json',
      'v.review_due_on',
    )
    .orderBy('r.id');
  if (filter.groups) q.whereIn('v.material_group', [...filter.groups]);
  return (await q) as FinderCandidateRow[];
}
