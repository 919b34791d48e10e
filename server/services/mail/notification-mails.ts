/**
 * The texts of the notification mails: one mail per person, plain text and
 * HTML from composeMail, a subject naming the recipe number, version and title, one link
 * into the app, and — for the kinds a person may turn off — how to turn them off.
 */
import { isOptional, type NotificationKind } from '../../../shared/notification-kinds';
import { formatDate } from '../../../shared/date-format';
import { CUT_OUTCOME_LABELS, type CutOutcome, type DateFormat } from '../../../shared/vocabulary';
import type { OutgoingMail } from './outbox';
import { absoluteLink, composeMail, type MailLink } from './layout';
import type { MailSettings } from './settings';
import type { Recipient } from './recipients';

/** The version a mail is about. */
export interface VersionRef {
  recipeId: number;
  number: string;
  version: number;
  title: string;
}

/** `KB-0001 v2 "C45 bar, transverse"`: how subjects and sentences name a version. */
export function versionName(v: VersionRef): string {
  return `${v.number} v${v.version} "${v.title}"`;
}

const WHY: Record<NotificationKind, string> = {
  'review-requested': 'you are an approver',
  'review-outcome': 'you wrote this version',
  'review-due': 'you wrote this recipe',
  'cut-flagged': 'you wrote this recipe',
  'version-current': 'you are assigned to the machine this recipe is for',
  'integrity-failed': 'you are an admin or an auditor',
  'trail-sealed': 'you are an auditor',
};

/** Why a mail that cannot be turned off must reach its reader. */
const MUST_KNOW: Partial<Record<NotificationKind, string>> = {
  'version-current': 'everyone at the machine must know which version is in use',
  'integrity-failed': 'a change to signed records behind the application must be looked into',
  'trail-sealed': 'a copy of each seal outside the database is what shows later whether the trail was cut short or rewritten',
};

function footer(settings: MailSettings, kind: NotificationKind): string[] {
  if (!isOptional(kind)) {
    return [`You get this mail because ${WHY[kind]}. It cannot be turned off: ${MUST_KNOW[kind] ?? 'it concerns the records everyone relies on'}.`];
  }
  return [`You get this mail because ${WHY[kind]}. You can turn these mails off under My account: ${absoluteLink(settings.baseUrl, '/account')}`];
}

function mail(settings: MailSettings, kind: NotificationKind, to: Recipient, subject: string, paragraphs: string[], action: MailLink): OutgoingMail {
  return composeMail(settings.baseUrl, { to: to.email, subject, greeting: to.name, paragraphs, action, footer: footer(settings, kind), kind });
}

export const recipePath = (v: VersionRef) => `/recipes/${v.recipeId}?v=${v.version}`;

export function reviewRequestedMail(settings: MailSettings, to: Recipient, v: VersionRef, submittedBy: string): OutgoingMail {
  return mail(
    settings,
    'review-requested',
    to,
    `Review requested: ${versionName(v)}`,
    [
      `${submittedBy} sent ${versionName(v)} for review.`,
      'You did not write or edit this version, so you can review it and approve it or return it to its author.',
    ],
    { label: 'Review the version', path: `/recipes/${v.recipeId}/review` },
  );
}

export function versionReturnedMail(settings: MailSettings, to: Recipient, v: VersionRef, returnedBy: string, comment: string): OutgoingMail {
  return mail(
    settings,
    'review-outcome',
    to,
    `Returned to you: ${versionName(v)}`,
    [`${returnedBy} returned ${versionName(v)} to its author with this comment:`, comment, 'Change the draft and send it for review again.'],
    { label: 'Edit the version', path: `/recipes/${v.recipeId}/edit` },
  );
}

export function versionApprovedMail(
  settings: MailSettings,
  to: Recipient,
  v: VersionRef,
  approvedBy: string,
  effectiveFrom: string,
  current: boolean,
  dateFormat: DateFormat = 'iso',
): OutgoingMail {
  const when = current ? 'It is in use from today.' : `It comes into use on ${formatDate(effectiveFrom, dateFormat)}.`;
  return mail(settings, 'review-outcome', to, `Approved: ${versionName(v)}`, [`${approvedBy} approved ${versionName(v)}.`, when], {
    label: 'Open the recipe',
    path: recipePath(v),
  });
}

export function versionCurrentMail(
  settings: MailSettings,
  to: Recipient,
  v: VersionRef,
  machineName: string,
  changeReason: string,
  replaces: number | null,
): OutgoingMail {
  const what =
    replaces === null
      ? v.version === 1
        ? 'This is the first version of the recipe.'
        : 'No earlier version of the recipe was in use.'
      : `It replaces version ${replaces}.`;
  const reason = changeReason.trim() ? `What changed: ${changeReason.trim()}` : 'The version gives no reason for the change.';
  return mail(
    settings,
    'version-current',
    to,
    `New version in use: ${versionName(v)} — please acknowledge`,
    [
      `${versionName(v)} is now the version in use for ${machineName}. ${what}`,
      reason,
      'Read it and acknowledge it ("read and understood") before you print or use its bench sheet.',
    ],
    { label: 'Read and acknowledge', path: `/recipes/${v.recipeId}/acknowledge?v=${v.version}` },
  );
}

export interface FlaggedCut {
  operatorName: string;
  specimenId: string;
  outcome: CutOutcome;
  notes: string;
}

export function cutFlaggedMail(settings: MailSettings, to: Recipient, v: VersionRef, cut: FlaggedCut): OutgoingMail {
  const paragraphs = [
    `${cut.operatorName} recorded a cut with ${versionName(v)} on specimen ${cut.specimenId}: ${CUT_OUTCOME_LABELS[cut.outcome].toLowerCase()}.`,
  ];
  if (cut.notes.trim()) paragraphs.push(`Their notes: ${cut.notes.trim()}`);
  paragraphs.push('Look at the cut and clear the flag once you have dealt with it.');
  return mail(settings, 'cut-flagged', to, `Cut flagged: ${versionName(v)}`, paragraphs, { label: 'See the cuts', path: `${recipePath(v)}&tab=cuts` });
}

/** `dueOn` and `today` are UTC days (YYYY-MM-DD); the mail writes the day in the lab's `dateFormat`. */
export function reviewDueMail(
  settings: MailSettings,
  to: Recipient,
  v: VersionRef,
  dueOn: string,
  today: string,
  dateFormat: DateFormat = 'iso',
): OutgoingMail {
  const overdue = dueOn < today;
  const due = formatDate(dueOn, dateFormat);
  return mail(
    settings,
    'review-due',
    to,
    `${overdue ? 'Review overdue' : 'Review due'} ${due}: ${versionName(v)}`,
    [
      overdue
        ? `The periodic review of ${versionName(v)} was due on ${due} and has not been done.`
        : `The periodic review of ${versionName(v)} is due on ${due}.`,
      'Check that the recipe still fits the lab, then start a new version or have it approved again.',
    ],
    { label: 'Open the recipe', path: recipePath(v) },
  );
}

/** The stored content of a signed version no longer matches its hash or its signatures. */
export function integrityFailedMail(settings: MailSettings, to: Recipient, v: VersionRef, problems: readonly string[]): OutgoingMail {
  return mail(
    settings,
    'integrity-failed',
    to,
    `Integrity check failed: ${versionName(v)}`,
    [
      `Kerfbook recomputed the content hash of ${versionName(v)} and it does not match what was signed:`,
      ...problems.map((p) => `- ${p}`),
      'Someone changed the database outside the application, or restored a damaged backup. Its bench sheet no longer prints. Compare the version with the trail, and restore from a backup you trust.',
    ],
    { label: 'Open the version', path: recipePath(v) },
  );
}

/** What a seal mail records: the chain head at the moment of the seal. */
export interface SealedHead {
  headEventId: number;
  headHash: string;
  eventCount: number;
  /** ISO 8601 UTC. */
  sealedAt: string;
  reason: 'interval' | 'approval';
}

/** A copy of one seal in the auditor's mailbox, out of reach of whoever can change the database. */
export function trailSealedMail(settings: MailSettings, to: Recipient, seal: SealedHead): OutgoingMail {
  const why = seal.reason === 'approval' ? 'after an approval' : "at the lab's seal interval";
  return mail(
    settings,
    'trail-sealed',
    to,
    `Trail sealed at event #${seal.headEventId} (${seal.eventCount} events)`,
    [
      `Kerfbook sealed the trail ${why}, at ${seal.sealedAt} UTC. At that moment:`,
      `- last event: #${seal.headEventId}`,
      `- its hash: ${seal.headHash}`,
      `- events in the trail: ${seal.eventCount}`,
      'Keep this mail. If the trail later holds fewer events, no event with this number, or this event with another hash, it was cut short or rewritten after this seal; npm run trail:verify checks the trail against the seal file the same way.',
    ],
    { label: 'Open the trail', path: '/trail' },
  );
}
