/**
 * Who gets each notification mail. Only active people with an e-mail
 * address; for the optional kinds, not those who turned the kind off under My account.
 * Called inside the transaction of the event, so the list matches what committed.
 */
import type { Knex } from 'knex';
import { isOptional, type NotificationKind } from '../../../shared/notification-kinds';
import { findRecipientRows, type RecipientFilter } from '../../data/recipients';

export interface Recipient {
  id: number;
  name: string;
  email: string;
}

async function recipients(db: Knex, kind: NotificationKind, filter: Omit<RecipientFilter, 'optOutKind'>): Promise<Recipient[]> {
  const rows = await findRecipientRows(db, { ...filter, ...(isOptional(kind) ? { optOutKind: kind } : {}) });
  return rows.map((r) => ({ id: r.id, name: r.display_name, email: r.email.trim() }));
}

/** Approvers who could approve the version: not its editors, and not whoever sent it. */
export function reviewersOf(db: Knex, versionId: number, exceptUserId: number | null): Promise<Recipient[]> {
  return recipients(db, 'review-requested', { role: 'approver', notEditorsOf: versionId, except: exceptUserId === null ? [] : [exceptUserId] });
}

/** The version's editors who hold the author role: the people who wrote it. */
export function authorsOf(db: Knex, versionId: number, kind: NotificationKind): Promise<Recipient[]> {
  return recipients(db, kind, { role: 'author', editorsOf: versionId });
}

/** Operators assigned to the machine: they must acknowledge a new version before using its sheet. */
export function operatorsOf(db: Knex, machineId: number): Promise<Recipient[]> {
  return recipients(db, 'version-current', { role: 'operator', machineId });
}

/** Admins and auditors, each once: the people who look into records changed behind the application. */
export async function guardiansOf(db: Knex): Promise<Recipient[]> {
  const [admins, auditors] = await Promise.all([
    recipients(db, 'integrity-failed', { role: 'admin' }),
    recipients(db, 'integrity-failed', { role: 'auditor' }),
  ]);
  const byId = new Map([...admins, ...auditors].map((r) => [r.id, r]));
  return [...byId.values()].sort((a, b) => a.id - b.id);
}

/** Auditors: each keeps a copy of every seal of the trail. */
export function auditorsOf(db: Knex): Promise<Recipient[]> {
  return recipients(db, 'trail-sealed', { role: 'auditor' });
}
