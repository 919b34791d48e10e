/**
 * Who receives a notification mail: active people with an e-mail address, holding a role,
 * narrowed to the editors of a version, the people who did not edit it, or the operators
 * of a machine; for optional kinds, leaving out whoever turned that kind off.
 */
import type { Knex } from 'knex';
import type { Role } from '../../shared/roles';

export interface RecipientRow {
  id: number;
  display_name: string;
  email: string;
}

export interface RecipientFilter {
  role: Role;
  /** Honour `notification_opt_outs` for this kind (optional kinds only). */
  optOutKind?: string;
  /** Only people who created or edited this version. */
  editorsOf?: number;
  /** Only people who neither created nor edited this version. */
  notEditorsOf?: number;
  /** Only people assigned to this machine. */
  machineId?: number;
  /** Never these people (e.g. whoever caused the mail). */
  except?: readonly number[];
}

/** Matching people, by id. Plain reads: callers run it inside the transaction of the event. */
export async function findRecipientRows(db: Knex, filter: RecipientFilter): Promise<RecipientRow[]> {
  const q = db('users as u')
    .where('u.active', true)
    .whereRaw("TRIM(u.email) <> ''")
    .whereExists((s) => s.select(db.raw('1')).from('user_roles as ur').whereRaw('ur.user_id = u.id').andWhere('ur.role', filter.role));
  if (filter.optOutKind) {
    const kind = filter.optOutKind;
    q.whereNotExists((s) => s.select(db.raw('1')).from('notification_opt_outs as o').whereRaw('o.user_id = u.id').andWhere('o.kind', kind));
  }
  if (filter.editorsOf !== undefined) {
    const versionId = filter.editorsOf;
    q.whereExists((s) => s.select(db.raw('1')).from('recipe_version_editors as e').whereRaw('e.user_id = u.id').andWhere('e.version_id', versionId));
  }
  if (filter.notEditorsOf !== undefined) {
    const versionId = filter.notEditorsOf;
    q.whereNotExists((s) => s.select(db.raw('1')).from('recipe_version_editors as e').whereRaw('e.user_id = u.id').andWhere('e.version_id', versionId));
  }
  if (filter.machineId !== undefined) {
    const machineId = filter.machineId;
    q.whereExists((s) => s.select(db.raw('1')).from('user_machines as um').whereRaw('um.user_id = u.id').andWhere('um.machine_id', machineId));
  }
  if (filter.except && filter.except.length > 0) q.whereNotIn('u.id', [...filter.except]);
  return q.select('u.id', 'u.display_name', 'u.email').orderBy('u.id');
}
