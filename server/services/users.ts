/** People, managed by admins (design section 2). Nobody is ever deleted: people are deactivated. */
import type { Knex } from 'knex';
import type { Page, UserDto } from '../../shared/api-types';
import type { CreateUserBody, UpdateUserBody, UserListQuery } from '../../shared/schemas/users';
import type { Role } from '../../shared/roles';
import { AppError } from '../app-error';
import {
  bumpSessionEpoch,
  findUserById,
  findUserRowByUsername,
  insertUser,
  listUserRows,
  replaceRoles,
  rolesOfMany,
  sortRoles,
  updateUserRow,
  type UserWithRoles,
} from '../data/users';
import type { Actor } from './actor';
import { AUDIT_EVENTS, recordAudit } from './audit';
import { replacePassword } from './password-replacement';
import { hashPassword } from './passwords';
import { auditSnapshot, toUserDto } from './user-dto';

export async function listUsers(db: Knex, query: UserListQuery): Promise<Page<UserDto>> {
  const { rows, total } = await listUserRows(db, query);
  const roles = await rolesOfMany(db, rows.map((r) => r.id));
  return {
    items: rows.map((row) => toUserDto({ ...row, roles: roles.get(row.id) ?? [] })),
    total,
    page: query.page,
    pageSize: query.pageSize,
  };
}

async function mustFind(db: Knex, id: number, forUpdate = false): Promise<UserWithRoles> {
  const user = await findUserById(db, id, forUpdate);
  if (!user) throw AppError.notFound(`There is no person with id ${id}.`);
  return user;
}

export async function getUser(db: Knex, id: number): Promise<UserDto> {
  return toUserDto(await mustFind(db, id));
}

function duplicateUsername(username: string): AppError {
  return new AppError(409, 'CONFLICT', [{ path: 'username', message: `The username "${username}" is already taken.` }]);
}

function isDuplicateKey(err: unknown): boolean {
  return (err as { code?: string } | null)?.code === 'ER_DUP_ENTRY';
}

/**
 * Creates a person. The password is temporary (must be changed at first sign-in) unless
 * the person chose it themselves, as with `npm run admin:create`.
 */
export async function createUser(db: Knex, actor: Actor, input: CreateUserBody, options: { passwordIsTemporary?: boolean } = {}): Promise<UserDto> {
  // Hash outside the transaction: it is slow and needs no lock.
  const passwordHash = await hashPassword(input.temporaryPassword);
  try {
    return await db.transaction(async (trx) => {
      if (await findUserRowByUsername(trx, input.username)) throw duplicateUsername(input.username);
      const id = await insertUser(
        trx,
        {
          username: input.username,
          display_name: input.displayName,
          email: input.email,
          password_hash: passwordHash,
          must_change_password: options.passwordIsTemporary ?? true,
        },
        sortRoles(input.roles),
        new Date(),
      );
      const created = await mustFind(trx, id);
      await recordAudit(trx, actor, { type: AUDIT_EVENTS.userCreated, entityType: 'user', entityId: id, before: null, after: auditSnapshot(created) });
      return toUserDto(created);
    });
  } catch (err) {
    // Two admins creating the same name at once: the unique index decides.
    if (isDuplicateKey(err)) throw duplicateUsername(input.username);
    throw err;
  }
}

function sameRoles(a: readonly Role[], b: readonly Role[]): boolean {
  return a.length === b.length && a.every((r) => b.includes(r));
}

export async function updateUser(db: Knex, actor: Actor, id: number, input: UpdateUserBody): Promise<UserDto> {
  return db.transaction(async (trx) => {
    const before = await mustFind(trx, id, true);
    const details: Record<string, string> = {};
    const detailsBefore: Record<string, string> = {};
    if (input.displayName !== undefined && input.displayName !== before.display_name) {
      details['displayName'] = input.displayName;
      detailsBefore['displayName'] = before.display_name;
    }
    if (input.email !== undefined && input.email !== before.email) {
      details['email'] = input.email;
      detailsBefore['email'] = before.email;
    }
    const newRoles = input.roles ? sortRoles(input.roles) : undefined;
    const rolesChange = newRoles && !sameRoles(newRoles, before.roles);

    if (rolesChange && actor.userId === id && before.roles.includes('admin') && !newRoles.includes('admin')) {
      throw new AppError(409, 'CONFLICT', [
        { path: 'roles', message: 'You cannot remove your own admin role; ask another admin to do it, so the lab is never left without one.' },
      ]);
    }

    const now = new Date();
    if (Object.keys(details).length > 0) {
      await updateUserRow(trx, id, {
        ...(details['displayName'] !== undefined ? { display_name: details['displayName'] } : {}),
        ...(details['email'] !== undefined ? { email: details['email'] } : {}),
        updated_at: now,
      });
      await recordAudit(trx, actor, { type: AUDIT_EVENTS.userDetailsChanged, entityType: 'user', entityId: id, before: detailsBefore, after: details }, now);
    }
    if (rolesChange) {
      await replaceRoles(trx, id, newRoles);
      await updateUserRow(trx, id, { updated_at: now });
      await recordAudit(trx, actor, { type: AUDIT_EVENTS.userRolesChanged, entityType: 'user', entityId: id, before: { roles: before.roles }, after: { roles: newRoles } }, now);
    }
    return toUserDto(await mustFind(trx, id));
  });
}

export async function deactivateUser(db: Knex, actor: Actor, id: number): Promise<UserDto> {
  if (actor.userId === id) {
    throw AppError.conflict('You cannot deactivate your own account; ask another admin to do it.');
  }
  return db.transaction(async (trx) => {
    const before = await mustFind(trx, id, true);
    if (!before.active) throw AppError.conflict(`${before.display_name} is already deactivated.`);
    const now = new Date();
    await updateUserRow(trx, id, { active: false, deactivated_at: now, updated_at: now });
    // Ends every session the person has open.
    await bumpSessionEpoch(trx, id);
    const after = await mustFind(trx, id);
    await recordAudit(trx, actor, { type: AUDIT_EVENTS.userDeactivated, entityType: 'user', entityId: id, before: { active: true }, after: { active: false } }, now);
    return toUserDto(after);
  });
}

export async function reactivateUser(db: Knex, actor: Actor, id: number): Promise<UserDto> {
  return db.transaction(async (trx) => {
    const before = await mustFind(trx, id, true);
    if (before.active) throw AppError.conflict(`${before.display_name} is already active.`);
    const now = new Date();
    await updateUserRow(trx, id, { active: true, deactivated_at: null, updated_at: now });
    const after = await mustFind(trx, id);
    await recordAudit(trx, actor, { type: AUDIT_EVENTS.userReactivated, entityType: 'user', entityId: id, before: { active: false }, after: { active: true } }, now);
    return toUserDto(after);
  });
}

export async function setTemporaryPassword(db: Knex, actor: Actor, id: number, password: string): Promise<UserDto> {
  if (actor.userId === id) {
    throw AppError.conflict('Use "Change password" for your own account; a temporary password is for someone else.');
  }
  const passwordHash = await hashPassword(password);
  return db.transaction(async (trx) => {
    const before = await mustFind(trx, id, true);
    await replacePassword(trx, actor, { userId: id, passwordHash, mustChange: true, mustChangeBefore: Boolean(before.must_change_password) });
    const after = await mustFind(trx, id);
    return toUserDto(after);
  });
}
