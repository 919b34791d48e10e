import type { UserDto } from '@shared/api-types';

/** An invented lab user for specs; override what the test is about. */
export function aUser(overrides: Partial<UserDto> = {}): UserDto {
  return {
    id: 7,
    username: 'rlindqvist',
    displayName: 'Ragna Lindqvist',
    email: 'ragna@lab.example',
    roles: ['author'],
    active: true,
    mustChangePassword: false,
    units: 'metric',
    machineIds: [],
    invitationPending: false,
    createdAt: '2026-01-05T08:00:00.000Z',
    lastSignInAt: null,
    ...overrides,
  };
}
