/** Queries on `user_machines`: which machines a person runs (for acknowledgements and the finder). */
import type { Knex } from 'knex';

/** Machine ids per person, ascending; every asked id has an entry (empty when none). One query for all. */
export async function machineIdsOf(db: Knex, userIds: readonly number[]): Promise<Map<number, number[]>> {
  const byUser = new Map<number, number[]>(userIds.map((id) => [id, []]));
  if (userIds.length === 0) return byUser;
  const rows = await db('user_machines')
    .whereIn('user_id', userIds)
    .orderBy([{ column: 'user_id' }, { column: 'machine_id' }])
    .select<{ user_id: number; machine_id: number }[]>('user_id', 'machine_id');
  for (const row of rows) byUser.get(row.user_id)?.push(row.machine_id);
  return byUser;
}

/** Replaces the person's set of machines. */
export async function replaceUserMachines(db: Knex, userId: number, machineIds: readonly number[], now: Date): Promise<void> {
  await db('user_machines').where({ user_id: userId }).del();
  if (machineIds.length > 0) {
    await db('user_machines').insert(machineIds.map((machineId) => ({ user_id: userId, machine_id: machineId, assigned_at: now })));
  }
}

/**
 * Of the given ids, those that are not an active machine (unknown or archived). The rows
 * are share-locked so a machine cannot be archived while it is being assigned.
 */
export async function unusableMachineIds(db: Knex, machineIds: readonly number[]): Promise<number[]> {
  if (machineIds.length === 0) return [];
  const rows = await db('machines').whereIn('id', machineIds).andWhere({ archived: false }).forShare().select<{ id: number }[]>('id');
  const usable = new Set(rows.map((r) => r.id));
  return machineIds.filter((id) => !usable.has(id));
}
