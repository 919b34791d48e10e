/** People, managed by admins. Nobody is ever deleted: people are deactivated, and the trail keeps their names. */
import type { Knex } from 'knex';
import { randomBytes } from 'node:crypto';
import type { MessageDto, Page, UserDto } from '../../../shared/api-types';
import type { CreateUserBody, InviteBody, UpdateUserBody, UserListQuery } from '../../../shared/schemas/users';
import type { Role } from '../../../shared/roles';
import { AppError } from '../../app-error';
import {
  bumpSessionEpoch,
  findUserById,
  findUserRowByUsername,
  insertUser,
  listUserRows,
  replaceRoles,
  sortRoles,
  updateUserRow,
  withRelations,
  type UserWithRoles,
} from '../../data/users';
import { findLabSettings } from '../../data/lab-settings';
import { replaceUserMachines, unusableMachineIds } from '../../data/user-machines';
import type { Actor } from '../actor';
import { TRAIL_EVENTS } from '../trail/event-types';
import { appendTrailEvent } from '../trail/append';
import { replacePassword } from '../auth/password-replacement';
import { hashPassword } from '../auth/passwords';
import { trailSnapshot, toUserDto } from './user-dto';
import { enqueueMail } from '../mail/outbox';
import { invitationMail } from '../mail/account-mails';
import type { MailSettings } from '../mail/settings';
import { issueToken } from '../auth/user-tokens';

export async function listUsers(db: Knex, query: UserListQuery): Promise<Page<UserDto>> {
  const { rows, total } = await listUserRows(db, query);
  // Roles, machines and invitation state: one query each for the whole page.
  return {
    items: (await withRelations(db, rows)).map(toUserDto),
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
      await assertUsableMachines(trx, input.machineIds);
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
      await replaceUserMachines(trx, id, ascending(input.machineIds), new Date());
      const created = await mustFind(trx, id);
      await appendTrailEvent(trx, actor, { type: TRAIL_EVENTS.userCreated, entityType: 'user', entityId: id, before: null, after: trailSnapshot(created) });
      return toUserDto(created);
    });
  } catch (err) {
    // Two admins creating the same name at once: the unique index decides.
    if (isDuplicateKey(err)) throw duplicateUsername(input.username);
    throw err;
  }
}

/** Machines to assign must exist and not be archived; otherwise 400 on `machineIds` and nothing changes. */
async function assertUsableMachines(trx: Knex, machineIds: readonly number[]): Promise<void> {
  const bad = await unusableMachineIds(trx, machineIds);
  if (bad.length === 0) return;
  const list = bad.join(', ');
  throw AppError.validation([
    {
      path: 'machineIds',
      message: bad.length === 1 ? `Machine ${list} does not exist or is archived.` : `Machines ${list} do not exist or are archived.`,
    },
  ]);
}

function ascending(ids: readonly number[]): number[] {
  return [...ids].sort((a, b) => a - b);
}

/**
 * Invites a person by e-mail: the account (active, with a password nobody knows),
 * roles, machines, a 72 h link and the invitation mail, all in one transaction. The person
 * chooses their own password with the link and then signs in.
 */
export async function inviteUser(db: Knex, actor: Actor, mail: MailSettings, input: InviteBody, now: Date = new Date()): Promise<UserDto> {
  // A hash of a random secret nobody keeps: sign-in fails, and takes as long as for anyone else.
  const unusableHash = await hashPassword(randomBytes(32).toString('base64url'));
  try {
    return await db.transaction(async (trx) => {
      if (await findUserRowByUsername(trx, input.username)) throw duplicateUsername(input.username);
      await assertUsableMachines(trx, input.machineIds);
      const id = await insertUser(
        trx,
        { username: input.username, display_name: input.displayName, email: input.email, password_hash: unusableHash, must_change_password: false },
        sortRoles(input.roles),
        now,
      );
      await replaceUserMachines(trx, id, ascending(input.machineIds), now);
      const link = await issueToken(trx, id, 'invitation', actor.userId, now);
      const created = await mustFind(trx, id);
      await enqueueMail(trx, invitationMail(mail, await invitationContent(trx, actor, created, link.token)), now);
      await appendTrailEvent(
        trx,
        actor,
        { type: TRAIL_EVENTS.userInvited, entityType: 'user', entityId: id, before: null, after: trailSnapshot(created) },
        now,
      );
      return toUserDto(created);
    });
  } catch (err) {
    if (isDuplicateKey(err)) throw duplicateUsername(input.username);
    throw err;
  }
}

async function invitationContent(trx: Knex, actor: Actor, user: UserWithRoles, token: string) {
  const labName = (await findLabSettings(trx))?.lab_name || 'Kerfbook';
  return { to: user.email, displayName: user.display_name, username: user.username, labName, invitedBy: actor.name || 'An admin', token };
}

/** A new 72 h invitation link (the older one is void), while the person has not set a password. */
export async function resendInvitation(db: Knex, actor: Actor, mail: MailSettings, id: number, now: Date = new Date()): Promise<MessageDto> {
  return db.transaction(async (trx) => {
    const user = await mustFind(trx, id, true);
    if (!user.active) throw AppError.conflict(`${user.display_name} is deactivated; reactivate the account before sending an invitation.`);
    if (!user.invitation_pending) {
      throw AppError.conflict(`${user.display_name} has already set a password. Use "Forgot password" or set a temporary password instead.`);
    }
    if (!user.email) throw AppError.conflict(`${user.display_name} has no e-mail address; add one first.`, 'email');
    const link = await issueToken(trx, id, 'invitation', actor.userId, now);
    await enqueueMail(trx, invitationMail(mail, await invitationContent(trx, actor, user, link.token)), now);
    await appendTrailEvent(
      trx,
      actor,
      { type: TRAIL_EVENTS.invitationResent, entityType: 'user', entityId: id, before: null, after: { email: user.email } },
      now,
    );
    return { message: `A new invitation is on its way to ${user.email}. It works for 72 hours; the earlier link no longer works.` };
  });
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

    // Separation of duties: a role comes from someone else. An admin who could make themselves
    // approver could write, sign and release a recipe alone (21 CFR 11.10(g), authority checks).
    const gained = rolesChange && actor.userId === id ? newRoles.filter((r) => !before.roles.includes(r)) : [];
    if (gained.length > 0) {
      throw new AppError(409, 'CONFLICT', [
        {
          path: 'roles',
          message: `You cannot give yourself a role (${gained.join(', ')}); another admin must grant it, so nobody signs with a right they gave themselves.`,
        },
      ]);
    }

    const newMachines = input.machineIds ? ascending(input.machineIds) : undefined;
    const machinesChange = newMachines && newMachines.join(',') !== before.machine_ids.join(',');
    if (machinesChange) await assertUsableMachines(trx, newMachines);

    const now = new Date();
    if (Object.keys(details).length > 0) {
      await updateUserRow(trx, id, {
        ...(details['displayName'] !== undefined ? { display_name: details['displayName'] } : {}),
        ...(details['email'] !== undefined ? { email: details['email'] } : {}),
        updated_at: now,
      });
      await appendTrailEvent(
        trx,
        actor,
        { type: TRAIL_EVENTS.userDetailsChanged, entityType: 'user', entityId: id, before: detailsBefore, after: details },
        now,
      );
    }
    if (rolesChange) {
      await replaceRoles(trx, id, newRoles);
      await updateUserRow(trx, id, { updated_at: now });
      await appendTrailEvent(
        trx,
        actor,
        { type: TRAIL_EVENTS.userRolesChanged, entityType: 'user', entityId: id, before: { roles: before.roles }, after: { roles: newRoles } },
        now,
      );
    }
    if (machinesChange) {
      await replaceUserMachines(trx, id, newMachines, now);
      await updateUserRow(trx, id, { updated_at: now });
      await appendTrailEvent(
        trx,
        actor,
        {
          type: TRAIL_EVENTS.userMachinesChanged,
          entityType: 'user',
          entityId: id,
          before: { machineIds: before.machine_ids },
          after: { machineIds: newMachines },
        },
        now,
      );
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
    await appendTrailEvent(
      trx,
      actor,
      { type: TRAIL_EVENTS.userDeactivated, entityType: 'user', entityId: id, before: { active: true }, after: { active: false } },
      now,
    );
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
    await appendTrailEvent(
      trx,
      actor,
      { type: TRAIL_EVENTS.userReactivated, entityType: 'user', entityId: id, before: { active: false }, after: { active: true } },
      now,
    );
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
