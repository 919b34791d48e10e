/** Queries on the lab's wheel-selection table (material group × hardness band → wheel). */
import type { Knex } from 'knex';

export interface SelectionRowRow {
  id: number;
  material_group: string;
  hardness_min: number | null;
  hardness_max: number | null;
  hardness_scale: string | null;
  wheel_id: number;
  note: string;
  created_at: Date;
  updated_at: Date;
}

export type SelectionRowValues = Omit<SelectionRowRow, 'id' | 'created_at' | 'updated_at'>;

/** In the order the table is shown: by group, then hardness band, then id. */
export async function listSelectionRowRows(db: Knex): Promise<SelectionRowRow[]> {
  return db<SelectionRowRow>('selection_rows').select('*').orderBy('material_group').orderBy('hardness_min').orderBy('id');
}

/** The rows whose wheel is in use, each with its wheel's kind and marking, in the order of listSelectionRowRows. */
export async function listSelectionRowRowsWithWheels(db: Knex): Promise<(SelectionRowRow & { wheel_kind: string; wheel_specification: string })[]> {
  return db('selection_rows as s')
    .join('wheels as w', 'w.id', 's.wheel_id')
    .where('w.archived', false)
    .select('s.*', 'w.kind as wheel_kind', 'w.specification as wheel_specification')
    .orderBy('s.material_group')
    .orderBy('s.hardness_min')
    .orderBy('s.id');
}

export async function findSelectionRowRow(db: Knex, id: number, forUpdate = false): Promise<SelectionRowRow | undefined> {
  const q = db<SelectionRowRow>('selection_rows').where({ id }).first();
  return forUpdate ? q.forUpdate() : q;
}

export async function insertSelectionRowRow(db: Knex, values: SelectionRowValues, now: Date): Promise<number> {
  const [id] = await db('selection_rows').insert({ ...values, created_at: now, updated_at: now });
  return id!;
}

export async function updateSelectionRowRow(db: Knex, id: number, values: SelectionRowValues, now: Date): Promise<void> {
  await db('selection_rows')
    .where({ id })
    .update({ ...values, updated_at: now });
}

export async function deleteSelectionRowRow(db: Knex, id: number): Promise<void> {
  await db('selection_rows').where({ id }).del();
}
