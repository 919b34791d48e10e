/**
 * The names records are known by, for the trail's "What" column: one query per kind of
 * record on a page (never one per row).
 */
import type { Knex } from 'knex';

export interface VersionName {
  id: number;
  number: string;
  version: number;
}

export interface AttachmentName extends VersionName {
  file_name: string;
}

export interface SelectionRowName {
  id: number;
  material_group: string;
  wheel_name: string;
}

export async function recipeNumbers(db: Knex, ids: number[]): Promise<{ id: number; number: string; title: string }[]> {
  if (ids.length === 0) return [];
  return db('recipes').whereIn('id', ids).select('id', 'number', 'title');
}

export async function versionNames(db: Knex, ids: number[]): Promise<VersionName[]> {
  if (ids.length === 0) return [];
  return db('recipe_versions as v').join('recipes as r', 'r.id', 'v.recipe_id').whereIn('v.id', ids).select('v.id', 'r.number', 'v.version');
}

export async function attachmentNames(db: Knex, ids: number[]): Promise<AttachmentName[]> {
  if (ids.length === 0) return [];
  return db('attachments as a')
    .join('recipe_versions as v', 'v.id', 'a.version_id')
    .join('recipes as r', 'r.id', 'v.recipe_id')
    .whereIn('a.id', ids)
    .select('a.id', 'a.file_name', 'r.number', 'v.version');
}

/** Materials, wheels and machines by their name. */
export async function stockNames(db: Knex, table: 'materials' | 'wheels' | 'machines', ids: number[]): Promise<{ id: number; name: string }[]> {
  if (ids.length === 0) return [];
  return db(table).whereIn('id', ids).select('id', 'name');
}

export async function selectionRowNames(db: Knex, ids: number[]): Promise<SelectionRowName[]> {
  if (ids.length === 0) return [];
  return db('selection_rows as s').join('wheels as w', 'w.id', 's.wheel_id').whereIn('s.id', ids).select('s.id', 's.material_group', 'w.name as wheel_name');
}

export async function personNames(db: Knex, ids: number[]): Promise<{ id: number; display_name: string }[]> {
  if (ids.length === 0) return [];
  return db('users').whereIn('id', ids).select('id', 'display_name');
}

/** Everyone the trail may name, active or not, by name: the auditor's person filter. */
export async function listPeopleNames(db: Knex): Promise<{ id: number; display_name: string; active: number | boolean }[]> {
  return db('users')
    .select('id', 'display_name', 'active')
    .orderBy([{ column: 'display_name' }, { column: 'id' }]);
}
