/**
 * The soak's lab on top of the demo seeds: more saws of the demo models (so that a new
 * version in force is announced to a machine's own operators, not to every operator in the
 * lab), and the soak's people with their roles, written with the same helpers the seeds use.
 * Everyone shares one random password (scrypt runs once). Most approvers turn the optional
 * "review requested" mail off, as a lab with thirty approvers would.
 */
import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import type { Role } from '../../shared/roles';
import { machineBody } from '../../shared/schemas/stock';
import { addOptOut } from '../../server/data/notification-opt-outs';
import { insertUser } from '../../server/data/users';
import type { Actor } from '../../server/services/actor';
import { hashPassword } from '../../server/services/auth/passwords';
import { createStock } from '../../server/services/stock/stock';
import { MACHINES } from '../../server/services/stock/records';
import { DEMO_MACHINES } from '../../seeds/data/demo-stock';

export type SoakRole = 'operator' | 'author' | 'approver' | 'auditor';

export interface SoakPerson {
  id: number;
  username: string;
  password: string;
  role: SoakRole;
  /** Operators: the saw they run. */
  machineId?: number;
}

export interface SoakLab {
  people: SoakPerson[];
  /** Every saw: demo model id → the ids of that model's saws (the demo one first). */
  sawsByModel: Map<number, number[]>;
}

/** Shares of each role, from the brief's 200 = 120 operators, 40 authors, 30 approvers, 10 auditors. */
const SHARES: [SoakRole, number][] = [
  ['operator', 120],
  ['author', 40],
  ['approver', 30],
  ['auditor', 10],
];
/** Copies of each demo saw model, so about ten operators share a saw at 200 people. */
const COPIES_PER_MODEL = 4;
/** Approvers who keep the review-requested mail. */
const APPROVERS_WITH_REVIEW_MAIL = 3;

const SETUP: Actor = { userId: null, name: 'soak set-up', clientAddress: '' };

export function roleCounts(users: number): Record<SoakRole, number> {
  const total = SHARES.reduce((s, [, n]) => s + n, 0);
  const counts = Object.fromEntries(SHARES.map(([role, n]) => [role, Math.max(1, Math.round((users * n) / total))])) as Record<SoakRole, number>;
  counts.operator = Math.max(1, users - counts.author - counts.approver - counts.auditor);
  return counts;
}

export async function createSoakLab(db: Knex, users: number): Promise<SoakLab> {
  const sawsByModel = new Map<number, number[]>();
  for (const raw of DEMO_MACHINES) {
    const demo = (await db('machines').where({ name: raw.name }).first('id')) as { id: number };
    const ids = [demo.id];
    for (let k = 2; k <= COPIES_PER_MODEL; k++) {
      ids.push((await createStock(db, SETUP, MACHINES, machineBody.parse({ ...raw, name: `${raw.name} no. ${k}` }))).id);
    }
    sawsByModel.set(demo.id, ids);
  }
  const saws = [...sawsByModel.values()].flat();

  const password = randomBytes(12).toString('base64url');
  const hash = await hashPassword(password);
  const now = new Date();
  const people: SoakPerson[] = [];
  for (const [role, count] of Object.entries(roleCounts(users)) as [SoakRole, number][]) {
    for (let i = 1; i <= count; i++) {
      const username = `soak.${role}${i}`;
      const id = await insertUser(
        db,
        { username, display_name: `Soak ${role} ${i}`, email: `${username}@soak.invalid`, password_hash: hash, must_change_password: false },
        [role as Role],
        now,
      );
      const person: SoakPerson = { id, username, password, role };
      if (role === 'operator') {
        person.machineId = saws[(i - 1) % saws.length]!;
        await db('user_machines').insert({ user_id: id, machine_id: person.machineId, assigned_at: now });
      }
      if (role === 'approver' && i > APPROVERS_WITH_REVIEW_MAIL) await addOptOut(db, id, 'review-requested');
      people.push(person);
    }
  }
  return { people, sawsByModel };
}
