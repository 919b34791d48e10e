import type { UserDto } from '../../../shared/api-types';
import type { UserWithRoles } from '../../data/users';

/** The public shape of a person: never the hash, never the session epoch. */
export function toUserDto(user: UserWithRoles): UserDto {
  return {
    id: user.id,
    username: user.username,
    displayName: user.display_name,
    email: user.email,
    roles: user.roles,
    active: Boolean(user.active),
    mustChangePassword: Boolean(user.must_change_password),
    units: user.units,
    machineIds: user.machine_ids,
    invitationPending: user.invitation_pending,
    createdAt: new Date(user.created_at).toISOString(),
    lastSignInAt: user.last_sign_in_at ? new Date(user.last_sign_in_at).toISOString() : null,
  };
}

/** What the trail records of a person (before/after); the same fields as the DTO minus times. */
export function trailSnapshot(user: UserWithRoles): Record<string, unknown> {
  const dto = toUserDto(user);
  return {
    username: dto.username,
    displayName: dto.displayName,
    email: dto.email,
    roles: dto.roles,
    active: dto.active,
    mustChangePassword: dto.mustChangePassword,
    units: dto.units,
    machineIds: dto.machineIds,
  };
}
