/** Queries on acknowledgements ("read and understood") and on who runs which machine. */
import type { Knex } from 'knex';

export interface AcknowledgementRow {
  id: number;
  version_id: number;
  user_id: number;
  user_name: string;
  acknowledged_at: Date;
}

export async function findAcknowledgement(db: Knex, versionId: number, userId: number): Promise<AcknowledgementRow | undefined> {
  return db<AcknowledgementRow>('acknowledgements').where({ version_id: versionId, user_id: userId }).first();
}

/** Inserts one; a second one for the same version and person fails on the unique key (ER_DUP_ENTRY). */
export async function insertAcknowledgement(trx: Knex.Transaction, row: Omit<AcknowledgementRow, 'id'>): Promise<number> {
  const [id] = await trx('acknowledgements').insert(row);
  return id!;
}

/** Everyone who acknowledged the version, in the order they did. */
export async function listAcknowledgementRows(db: Knex, versionId: number): Promise<AcknowledgementRow[]> {
  return db<AcknowledgementRow>('acknowledgements').where({ version_id: versionId }).orderBy('acknowledged_at').orderBy('id');
}

/** True when the person holds the operator role and is assigned to the machine. */
export async function isOperatorOfMachine(db: Knex, userId: number, machineId: number): Promise<boolean> {
  const row = await db('user_machines as um')
    .join('user_roles as ur', 'ur.user_id', 'um.user_id')
    .where({ 'um.user_id': userId, 'um.machine_id': machineId, 'ur.role': 'operator' })
    .first('um.user_id');
  return Boolean(row);
}

/** Active operators assigned to the machine, by name. */
export async function activeOperatorsOfMachine(db: Knex, machineId: number): Promise<{ id: number; display_name: string }[]> {
  return db('users as u')
    .join('user_machines as um', 'um.user_id', 'u.id')
    .join('user_roles as ur', 'ur.user_id', 'u.id')
    .where({ 'um.machine_id': machineId, 'ur.role': 'operator', 'u.active': true })
    .select('u.id', 'u.display_name')
    .orderBy('u.display_name')
    .orderBy('u.id');
}

export async function findMachineName(db: Knex, machineId: number): Promise<string | undefined> {
  return ((await db('machines').where({ id: machineId }).first('name')) as { name: string } | undefined)?.name;
}

/** The person's most recent acknowledgement of an earlier version of the recipe, with that version's number. */
export async function lastAcknowledgementBefore(
  db: Knex,
  recipeId: number,
  userId: number,
  beforeVersion: number,
): Promise<{ version: number; acknowledged_at: Date } | undefined> {
  return db('acknowledgements as a')
    .join('recipe_versions as v', 'v.id', 'a.version_id')
    .where({ 'v.recipe_id': recipeId, 'a.user_id': userId })
    .andWhere('v.version', '<', beforeVersion)
    .orderBy('a.acknowledged_at', 'desc')
    .orderBy('a.id', 'desc')
    .first('v.version', 'a.acknowledged_at');
}
