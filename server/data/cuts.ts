/** Queries on cut_records: insert, find, the lists per version and per specimen, flags per recipe. */
import type { Knex } from 'knex';
import type { CutOutcome } from '../../shared/vocabulary';

export interface CutRow {
  id: number;
  version_id: number;
  recipe_id: number;
  specimen_id: string;
  part_ref: string;
  quantity: number;
  outcome: CutOutcome;
  notes: string;
  operator_id: number;
  operator_name: string;
  cut_at: Date;
  flag_cleared_at: Date | null;
  flag_cleared_by: number | null;
}

/** A cut with its recipe number and version number, as the API shows it. */
export interface CutWithVersion extends CutRow {
  number: string;
  version: number;
}

export async function insertCut(db: Knex, row: Omit<CutRow, 'id' | 'flag_cleared_at' | 'flag_cleared_by'>): Promise<number> {
  const [id] = await db('cut_records').insert({ ...row, flag_cleared_at: null, flag_cleared_by: null });
  return id!;
}

function cutsWithVersion(db: Knex) {
  return db('cut_records as c')
    .join('recipe_versions as v', 'v.id', 'c.version_id')
    .join('recipes as r', 'r.id', 'c.recipe_id')
    .select('c.*', 'r.number as number', 'v.version as version');
}

export async function findCut(db: Knex, id: number): Promise<CutWithVersion | undefined> {
  return cutsWithVersion(db).where('c.id', id).first();
}

/** The cut row, locked until the calling transaction ends. */
export async function lockCut(trx: Knex.Transaction, id: number): Promise<CutRow | undefined> {
  return trx<CutRow>('cut_records').where({ id }).forUpdate().first();
}

/** Every cut made with one version, newest first. */
export async function listCutsOfVersion(db: Knex, versionId: number): Promise<CutWithVersion[]> {
  return cutsWithVersion(db).where('c.version_id', versionId).orderBy('c.cut_at', 'desc').orderBy('c.id', 'desc');
}

/** Every cut with this specimen id, newest first. */
export async function listCutsOfSpecimen(db: Knex, specimenId: string, limit: number): Promise<CutWithVersion[]> {
  return cutsWithVersion(db).where('c.specimen_id', specimenId).orderBy('c.cut_at', 'desc').orderBy('c.id', 'desc').limit(limit);
}

/** Clears a flag once: answers 1 when this call cleared it, 0 when it was already cleared. */
export async function clearCutFlag(trx: Knex.Transaction, id: number, userId: number, at: Date): Promise<number> {
  return trx('cut_records').where({ id }).whereNull('flag_cleared_at').update({ flag_cleared_at: at, flag_cleared_by: userId });
}

export interface FlaggedRecipeRow {
  recipe_id: number;
  number: string;
  title: string;
  count: number;
  last_cut_at: Date;
}

/**
 * Per recipe the person created or edited (any version), the cuts that were not good and
 * whose flag nobody has cleared; the recipe with the latest such cut first.
 */
export async function flaggedCutRows(db: Knex, userId: number, limit: number): Promise<FlaggedRecipeRow[]> {
  const rows = (await db('cut_records as c')
    .join('recipes as r', 'r.id', 'c.recipe_id')
    .whereNot('c.outcome', 'good')
    .whereNull('c.flag_cleared_at')
    .where((w) =>
      w
        .where('r.created_by', userId)
        .orWhereExists((q) =>
          q
            .select(db.raw('1'))
            .from('recipe_version_editors as e')
            .join('recipe_versions as ev', 'ev.id', 'e.version_id')
            .whereRaw('ev.recipe_id = r.id')
            .andWhere('e.user_id', userId),
        ),
    )
    .groupBy('r.id', 'r.number', 'r.title')
    .select('r.id as recipe_id', 'r.number', 'r.title', db.raw('COUNT(*) as count'), db.raw('MAX(c.cut_at) as last_cut_at'))
    .orderBy('last_cut_at', 'desc')
    .orderBy('r.id')
    .limit(limit)) as FlaggedRecipeRow[];
  return rows.map((r) => ({ ...r, count: Number(r.count) }));
}
