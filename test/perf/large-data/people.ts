/**
 * The large data set's people: `users` of them with their roles spread like a company's
 * labs (mostly operators, then authors, approvers, auditors and a few admins), some authors
 * also approving. All share one password, hashed once (scrypt is slow on purpose).
 */
import type { Role } from '../../../shared/roles';
import { type Random } from './random';

export const LARGE_DATA_PASSWORD = 'large-data-2026';

export interface Person {
  id: number;
  username: string;
  displayName: string;
  email: string;
  roles: Role[];
  /** The workstation the person works from, as the trail's client address. */
  clientAddress: string;
  createdAt: number;
  /** Latest sign-in (ms), filled while the trail is planned. */
  lastSignInAt: number | null;
}

/** Share of each primary role; operators take the rest. */
const ROLE_SHARES: [Role, number][] = [
  ['admin', 0.03],
  ['auditor', 0.07],
  ['approver', 0.12],
  ['author', 0.25],
];

const FIRST = [
  'Ada',
  'Bela',
  'Carla',
  'Dmitri',
  'Elif',
  'Farid',
  'Greta',
  'Hugo',
  'Ingrid',
  'Jonas',
  'Kaito',
  'Lena',
  'Marek',
  'Nadia',
  'Oskar',
  'Priya',
  'Quentin',
  'Rosa',
  'Sven',
  'Tara',
  'Umar',
  'Vera',
  'Wim',
  'Yara',
  'Zeno',
];
const LAST = [
  'Albers',
  'Brodsky',
  'Castell',
  'Duarte',
  'Eklund',
  'Ferreira',
  'Gallo',
  'Hartmann',
  'Ivanova',
  'Jansen',
  'Kowalski',
  'Lindqvist',
  'Moreau',
  'Nakamura',
  'Okonkwo',
  'Petrov',
  'Quist',
  'Rahman',
  'Schuster',
  'Tanaka',
  'Urban',
  'Vos',
  'Weber',
  'Yilmaz',
  'Zeller',
];

/** How many of `total` people have each primary role: at least one each, two approvers. */
function roleCounts(total: number): [Role, number][] {
  const counts: [Role, number][] = ROLE_SHARES.map(([role, share]) => [role, Math.max(role === 'approver' ? 2 : 1, Math.round(total * share))]);
  const operators = total - counts.reduce((sum, [, n]) => sum + n, 0);
  if (operators < 1) throw new Error(`At least ${total - operators + 1} people are needed for one of each role.`);
  return [...counts, ['operator', operators]];
}

/** The people, ids 1..total in creation order; the first admin comes first. */
export function planPeople(total: number, createdFrom: number, random: Random): Person[] {
  const people: Person[] = [];
  let id = 0;
  for (const [role, count] of roleCounts(total)) {
    for (let i = 1; i <= count; i++) {
      id += 1;
      const first = FIRST[(id * 7) % FIRST.length]!;
      const last = LAST[(id * 11 + Math.floor(id / LAST.length)) % LAST.length]!;
      const username = `large.${role}.${String(i).padStart(3, '0')}`;
      // Every eighth author also approves (never their own versions).
      const roles: Role[] = role === 'author' && i % 8 === 0 ? ['author', 'approver'] : [role];
      people.push({
        id,
        username,
        displayName: `${first} ${last} ${String(i).padStart(3, '0')}`,
        email: `${username}@large-lab.example`,
        roles,
        clientAddress: `10.${20 + (id % 8)}.${Math.floor(id / 250)}.${(id % 250) + 2}`,
        createdAt: createdFrom + id * 60_000 + random.int(0, 30_000),
        lastSignInAt: null,
      });
    }
  }
  return people;
}

/** The first person with the role as their only or first role, for the summary. */
export function firstWithRole(people: readonly Person[], role: Role): Person | undefined {
  return people.find((p) => p.roles[0] === role);
}

export function withRole(people: readonly Person[], role: Role): Person[] {
  return people.filter((p) => p.roles.includes(role));
}
