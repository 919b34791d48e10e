/**
 * The bench's own people, one per role (bench.author, bench.approver, …), with a fresh
 * random password each run: the bench signs in whatever filled the database (the large data
 * set, the demo, a lab's copy) without having to know anyone's password. Written straight
 * to users/user_roles — the bench database is a throw-away copy, not a lab's record.
 */
import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import type { Role } from '../../../shared/roles';
import { findUserRowByUsername, insertUser, replaceRoles, updateUserRow } from '../../../server/data/users';
import { hashPassword } from '../../../server/services/auth/passwords';

export const BENCH_ROLES = ['author', 'approver', 'operator', 'auditor', 'admin'] as const satisfies readonly Role[];
export type BenchRole = (typeof BENCH_ROLES)[number];

export interface BenchUser {
  id: number;
  username: string;
  password: string;
}

export async function ensureBenchUsers(db: Knex): Promise<Record<BenchRole, BenchUser>> {
  const password = randomBytes(18).toString('base64url');
  const hash = await hashPassword(password);
  const now = new Date();
  const out = {} as Record<BenchRole, BenchUser>;
  for (const role of BENCH_ROLES) {
    const username = `bench.${role}`;
    const existing = await findUserRowByUsername(db, username);
    let id: number;
    if (existing) {
      id = existing.id;
      await updateUserRow(db, id, { password_hash: hash, must_change_password: false, active: true, deactivated_at: null, updated_at: now });
      await replaceRoles(db, id, [role]);
    } else {
      id = await insertUser(
        db,
        {
          username,
          display_name: `Bench ${role[0]!.toUpperCase()}${role.slice(1)}`,
          email: `${username}@bench.invalid`,
          password_hash: hash,
          must_change_password: false,
        },
        [role],
        now,
      );
    }
    out[role] = { id, username, password };
  }
  return out;
}
