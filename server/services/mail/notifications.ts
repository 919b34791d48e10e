/**
 * Enqueues the notification mails of one event: finds the recipients and writes one mail
 * each into the outbox, inside the caller's transaction (the mail exists exactly when the
 * event committed). Callers do this before their trail event, whose head lock comes last.
 */
import type { Knex } from 'knex';
import { findMachineName } from '../../data/acknowledgements';
import { dateFormatOf, findLabSettings } from '../../data/lab-settings';
import { enqueueMail, type OutgoingMail } from './outbox';
import {
  cutFlaggedMail,
  integrityFailedMail,
  trailSealedMail,
  type SealedHead,
  reviewDueMail,
  reviewRequestedMail,
  versionApprovedMail,
  versionCurrentMail,
  versionReturnedMail,
  type FlaggedCut,
  type VersionRef,
} from './notification-mails';
import type { MailSettings } from './settings';
import { auditorsOf, authorsOf, guardiansOf, operatorsOf, reviewersOf, type Recipient } from './recipients';

async function enqueueAll(trx: Knex.Transaction, recipients: readonly Recipient[], build: (to: Recipient) => OutgoingMail, now: Date): Promise<number> {
  for (const to of recipients) await enqueueMail(trx, build(to), now);
  return recipients.length;
}

export async function notifyReviewRequested(
  trx: Knex.Transaction,
  settings: MailSettings,
  versionId: number,
  v: VersionRef,
  submitter: { userId: number | null; name: string },
  now: Date,
): Promise<number> {
  const to = await reviewersOf(trx, versionId, submitter.userId);
  return enqueueAll(trx, to, (r) => reviewRequestedMail(settings, r, v, submitter.name), now);
}

export async function notifyReturned(
  trx: Knex.Transaction,
  settings: MailSettings,
  versionId: number,
  v: VersionRef,
  returnedBy: string,
  comment: string,
  now: Date,
): Promise<number> {
  const to = await authorsOf(trx, versionId, 'review-outcome');
  return enqueueAll(trx, to, (r) => versionReturnedMail(settings, r, v, returnedBy, comment), now);
}

export async function notifyApproved(
  trx: Knex.Transaction,
  settings: MailSettings,
  versionId: number,
  v: VersionRef,
  approvedBy: string,
  effectiveFrom: string,
  current: boolean,
  now: Date,
): Promise<number> {
  const to = await authorsOf(trx, versionId, 'review-outcome');
  const dateFormat = dateFormatOf(await findLabSettings(trx));
  return enqueueAll(trx, to, (r) => versionApprovedMail(settings, r, v, approvedBy, effectiveFrom, current, dateFormat), now);
}

/** The version just became current: its machine's operators must acknowledge it. */
export async function notifyVersionCurrent(
  trx: Knex.Transaction,
  settings: MailSettings,
  target: { machineId: number; changeReason: string; replaces: number | null },
  v: VersionRef,
  now: Date,
): Promise<number> {
  const to = await operatorsOf(trx, target.machineId);
  if (to.length === 0) return 0;
  const machineName = (await findMachineName(trx, target.machineId)) ?? `machine ${target.machineId}`;
  return enqueueAll(trx, to, (r) => versionCurrentMail(settings, r, v, machineName, target.changeReason, target.replaces), now);
}

export async function notifyCutFlagged(
  trx: Knex.Transaction,
  settings: MailSettings,
  versionId: number,
  v: VersionRef,
  cut: FlaggedCut,
  now: Date,
): Promise<number> {
  const to = await authorsOf(trx, versionId, 'cut-flagged');
  return enqueueAll(trx, to, (r) => cutFlaggedMail(settings, r, v, cut), now);
}

export async function notifyReviewDue(
  trx: Knex.Transaction,
  settings: MailSettings,
  versionId: number,
  v: VersionRef,
  dueOn: string,
  today: string,
  now: Date,
): Promise<number> {
  const to = await authorsOf(trx, versionId, 'review-due');
  const dateFormat = dateFormatOf(await findLabSettings(trx));
  return enqueueAll(trx, to, (r) => reviewDueMail(settings, r, v, dueOn, today, dateFormat), now);
}

export async function notifyIntegrityFailed(
  trx: Knex.Transaction,
  settings: MailSettings,
  v: VersionRef,
  problems: readonly string[],
  now: Date,
): Promise<number> {
  const to = await guardiansOf(trx);
  return enqueueAll(trx, to, (r) => integrityFailedMail(settings, r, v, problems), now);
}

/** The trail's chain head was sealed: every auditor gets a copy of the seal. */
export async function notifyTrailSealed(trx: Knex.Transaction, settings: MailSettings, seal: SealedHead, now: Date): Promise<number> {
  const to = await auditorsOf(trx);
  return enqueueAll(trx, to, (r) => trailSealedMail(settings, r, seal), now);
}
