/**
 * Queries shared by the three stock tables (materials, wheels, machines): one list query
 * with whitelisted sort columns, find, insert, update, delete, and the references that
 * keep a record from being deleted. Rows come back in snake_case; mapping is in services.
 */
import type { Knex } from 'knex';
import { containsPattern } from './users';

export type StockTable = 'materials' | 'wheels' | 'machines';

export interface StockRowBase {
  id: number;
  archived: number | boolean;
  archived_at: Date | null;
  created_at: Date;
  updated_at: Date;
}

export interface StockListFilter {
  page: number;
  pageSize: number;
  /** A column name the caller has already checked against its whitelist. */
  sortColumn: string;
  dir: 'asc' | 'desc';
  q?: string | undefined;
  searchColumns: readonly string[];
  /** Materials only. */
  group?: string | undefined;
  archived: 'no' | 'yes' | 'all';
}

export async function listStockRows<R extends StockRowBase>(db: Knex, table: StockTable, filter: StockListFilter): Promise<{ rows: R[]; total: number }> {
  const base = db(table);
  if (filter.q) {
    // where(col, 'like', …), not whereLike(): that adds COLLATE utf8_bin, which fails on utf8mb4 columns.
    const pattern = containsPattern(filter.q);
    base.where((w) => {
      for (const column of filter.searchColumns) w.orWhere(`${table}.${column}`, 'like', pattern);
    });
  }
  if (filter.group) base.where(`${table}.material_group`, filter.group);
  if (filter.archived !== 'all') base.where(`${table}.archived`, filter.archived === 'yes');
  const [{ total }] = (await base.clone().count<{ total: number }[]>({ total: '*' })) as [{ total: number }];
  const rows = (await base
    .clone()
    .select(`${table}.*`)
    .orderBy(`${table}.${filter.sortColumn}`, filter.dir)
    .orderBy(`${table}.id`, filter.dir)
    .limit(filter.pageSize)
    .offset(filter.page * filter.pageSize)) as R[];
  return { rows, total: Number(total) };
}

export async function findStockRow<R extends StockRowBase>(db: Knex, table: StockTable, id: number, forUpdate = false): Promise<R | undefined> {
  const q = db(table).where({ id }).first();
  return (forUpdate ? q.forUpdate() : q) as Promise<R | undefined>;
}

export async function findStockRows<R extends StockRowBase>(db: Knex, table: StockTable, ids: number[]): Promise<R[]> {
  if (ids.length === 0) return [];
  return (await db(table).whereIn('id', ids)) as R[];
}

/** Every record of a table that is in use (not archived), by id. */
export async function listInUseStockRows<R extends StockRowBase>(db: Knex, table: StockTable): Promise<R[]> {
  return (await db(table).where({ archived: false }).orderBy('id')) as R[];
}

export async function insertStockRow(db: Knex, table: StockTable, row: Record<string, unknown>): Promise<number> {
  const [id] = await db(table).insert(row);
  return id!;
}

export async function updateStockRow(db: Knex, table: StockTable, id: number, changes: Record<string, unknown>): Promise<void> {
  await db(table).where({ id }).update(changes);
}

export async function deleteStockRow(db: Knex, table: StockTable, id: number): Promise<void> {
  await db(table).where({ id }).del();
}

/** Where each stock table is referenced from: recipe versions always, wheels also from the selection table. */
const REFERENCES: Record<StockTable, { table: string; column: string }[]> = {
  materials: [{ table: 'recipe_versions', column: 'material_id' }],
  wheels: [
    { table: 'recipe_versions', column: 'wheel_id' },
    { table: 'selection_rows', column: 'wheel_id' },
  ],
  machines: [{ table: 'recipe_versions', column: 'machine_id' }],
};

/** True when any recipe version (or, for a wheel, a selection row) points at the record. */
export async function isStockReferenced(db: Knex, table: StockTable, id: number): Promise<boolean> {
  for (const ref of REFERENCES[table]) {
    const hit = await db(ref.table).where(ref.column, id).first(db.raw('1 as hit'));
    if (hit) return true;
  }
  return false;
}
