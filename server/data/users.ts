/** Queries on `users` and `user_roles`. Rows come back in snake_case; mapping to DTOs is in services. */
import type { Knex } from 'knex';
import { ROLES, type Role } from '../../shared/roles';
import type { UnitPreference } from '../../shared/api-types';
import { usersWithOpenInvitation } from './user-tokens';
import { machineIdsOf } from './user-machines';

export interface UserRow {
  id: number;
  username: string;
  display_name: string;
  email: string;
  password_hash: string;
  must_change_password: number | boolean;
  active: number | boolean;
  units: UnitPreference;
  session_epoch: number;
  created_at: Date;
  updated_at: Date;
  last_sign_in_at: Date | null;
  deactivated_at: Date | null;
}

export interface UserWithRoles extends UserRow {
  roles: Role[];
  /** Machines the person runs, ascending. */
  machine_ids: number[];
  /** An open invitation link exists: invited and no password set yet (see user-tokens.ts). */
  invitation_pending: boolean;
}

export async function findUserRowById(db: Knex, id: number, forUpdate = false): Promise<UserRow | undefined> {
  const q = db<UserRow>('users').where({ id }).first();
  return forUpdate ? q.forUpdate() : q;
}

export async function findUserRowByUsername(db: Knex, username: string): Promise<UserRow | undefined> {
  return db<UserRow>('users').where({ username }).first();
}

export async function rolesOf(db: Knex, userId: number): Promise<Role[]> {
  const rows = await db('user_roles').where({ user_id: userId }).select<{ role: Role }[]>('role');
  return sortRoles(rows.map((r) => r.role));
}

export async function rolesOfMany(db: Knex, userIds: number[]): Promise<Map<number, Role[]>> {
  const byUser = new Map<number, Role[]>(userIds.map((id) => [id, []]));
  if (userIds.length === 0) return byUser;
  const rows = await db('user_roles').whereIn('user_id', userIds).select<{ user_id: number; role: Role }[]>('user_id', 'role');
  for (const row of rows) byUser.get(row.user_id)?.push(row.role);
  for (const [id, roles] of byUser) byUser.set(id, sortRoles(roles));
  return byUser;
}

/** Roles always listed in the order of ROLES, so before/after snapshots compare cleanly. */
export function sortRoles(roles: readonly Role[]): Role[] {
  return ROLES.filter((r) => roles.includes(r));
}

export async function findUserById(db: Knex, id: number, forUpdate = false): Promise<UserWithRoles | undefined> {
  const row = await findUserRowById(db, id, forUpdate);
  if (!row) return undefined;
  return (await withRelations(db, [row]))[0];
}

/** Roles, machines and invitation state for many rows: one query each, whatever the number of rows. */
export async function withRelations(db: Knex, rows: readonly UserRow[]): Promise<UserWithRoles[]> {
  const ids = rows.map((r) => r.id);
  const [roles, machines, pending] = [await rolesOfMany(db, ids), await machineIdsOf(db, ids), await usersWithOpenInvitation(db, ids)];
  return rows.map((row) => ({
    ...row,
    roles: roles.get(row.id) ?? [],
    machine_ids: machines.get(row.id) ?? [],
    invitation_pending: pending.has(row.id),
  }));
}

/** Active people with this e-mail address, compared without regard to case. */
export async function findActiveUsersByEmail(db: Knex, email: string): Promise<UserRow[]> {
  const address = email.trim().toLowerCase();
  if (!address) return [];
  return db<UserRow>('users').whereRaw('LOWER(email) = ?', [address]).andWhere({ active: true }).orderBy('id');
}

export interface NewUserRow {
  username: string;
  display_name: string;
  email: string;
  password_hash: string;
  must_change_password: boolean;
  units?: UnitPreference;
}

export async function insertUser(db: Knex, user: NewUserRow, roles: readonly Role[], now: Date): Promise<number> {
  const [id] = await db('users').insert({ ...user, active: true, session_epoch: 0, created_at: now, updated_at: now });
  await replaceRoles(db, id!, roles);
  return id!;
}

export async function updateUserRow(db: Knex, id: number, changes: Partial<Omit<UserRow, 'id'>>): Promise<void> {
  await db('users').where({ id }).update(changes);
}

/** Bumps the epoch so that every session begun before now is treated as signed out. */
export async function bumpSessionEpoch(db: Knex, id: number): Promise<void> {
  await db('users').where({ id }).increment('session_epoch', 1);
}

export async function replaceRoles(db: Knex, userId: number, roles: readonly Role[]): Promise<void> {
  await db('user_roles').where({ user_id: userId }).del();
  if (roles.length > 0) await db('user_roles').insert(roles.map((role) => ({ user_id: userId, role })));
}

export interface UserListFilter {
  page: number;
  pageSize: number;
  sort: 'username' | 'displayName' | 'createdAt' | 'lastSignInAt';
  dir: 'asc' | 'desc';
  q?: string | undefined;
  role?: Role | undefined;
  status: 'active' | 'inactive' | 'all';
}

const SORT_COLUMNS: Record<UserListFilter['sort'], string> = {
  username: 'users.username',
  displayName: 'users.display_name',
  createdAt: 'users.created_at',
  lastSignInAt: 'users.last_sign_in_at',
};

/** `LIKE` pattern matching `text` anywhere; `%`, `_` and the escape character are taken literally. */
export function containsPattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

export async function listUserRows(db: Knex, filter: UserListFilter): Promise<{ rows: UserRow[]; total: number }> {
  const base = db<UserRow>('users');
  if (filter.q) {
    // where(col, 'like', …) and not whereLike(): the latter adds COLLATE utf8_bin, which
    // fails on utf8mb4 columns. Backslash is MariaDB's LIKE escape.
    const pattern = containsPattern(filter.q);
    base.where((w) => w.where('users.username', 'like', pattern).orWhere('users.display_name', 'like', pattern).orWhere('users.email', 'like', pattern));
  }
  if (filter.status !== 'all') base.where('users.active', filter.status === 'active');
  if (filter.role) {
    const role = filter.role;
    base.whereExists((sub) => sub.select(db.raw('1')).from('user_roles').whereRaw('user_roles.user_id = users.id').andWhere('user_roles.role', role));
  }
  const [{ total }] = (await base.clone().count<{ total: number }[]>({ total: '*' })) as [{ total: number }];
  const rows = await base
    .clone()
    .select('users.*')
    .orderBy(SORT_COLUMNS[filter.sort], filter.dir)
    .orderBy('users.id', filter.dir)
    .limit(filter.pageSize)
    .offset(filter.page * filter.pageSize);
  return { rows, total: Number(total) };
}
