/** Queries on sheet_prints: one row per bench sheet handed out. */
import type { Knex } from 'knex';

export interface SheetPrintRow {
  id: number;
  version_id: number;
  user_id: number;
  printed_at: Date;
  client_address: string;
}

export async function insertSheetPrint(db: Knex, row: Omit<SheetPrintRow, 'id'>): Promise<number> {
  const [id] = await db('sheet_prints').insert(row);
  return id!;
}

/** The version's check code (null until approved). */
export async function findCheckCodeOfVersion(db: Knex, versionId: number): Promise<string | null> {
  const row = (await db('recipe_versions').where({ id: versionId }).first('check_code')) as { check_code: string | null } | undefined;
  return row?.check_code ?? null;
}
