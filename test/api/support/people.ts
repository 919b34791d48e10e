/** Test people, inserted straight into the database (the People API is tested on its own). */
import type { Knex } from 'knex';
import type { Role } from '../../../shared/roles';
import { insertUser, updateUserRow } from '../../../server/data/users';
import { hashPassword } from '../../../server/services/auth/passwords';

export const DEFAULT_PASSWORD = 'correct horse battery';

// scrypt is deliberately slow: hash each distinct password once per run.
const hashes = new Map<string, Promise<string>>();
function hashOnce(password: string): Promise<string> {
  if (!hashes.has(password)) hashes.set(password, hashPassword(password));
  return hashes.get(password)!;
}

let counter = 0;

export interface TestPerson {
  id: number;
  username: string;
  password: string;
  displayName: string;
}

export interface PersonOptions {
  username?: string;
  displayName?: string;
  password?: string;
  roles?: Role[];
  mustChangePassword?: boolean;
  active?: boolean;
}

export async function createPerson(db: Knex, options: PersonOptions = {}): Promise<TestPerson> {
  counter += 1;
  const roles = options.roles ?? [];
  const username = options.username ?? `person${counter}.${roles.length === 1 ? roles[0] : roles.length === 0 ? 'none' : 'multi'}`;
  const password = options.password ?? DEFAULT_PASSWORD;
  const displayName = options.displayName ?? `Test Person ${counter}`;
  const id = await insertUser(
    db,
    {
      username,
      display_name: displayName,
      email: `${username}@lab.example`,
      password_hash: await hashOnce(password),
      must_change_password: options.mustChangePassword ?? false,
    },
    options.roles ?? [],
    new Date(),
  );
  if (options.active === false) await updateUserRow(db, id, { active: false, deactivated_at: new Date() });
  return { id, username, password, displayName };
}
