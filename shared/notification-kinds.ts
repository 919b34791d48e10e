/**
 * The mails Kerfbook sends about work (reviews, cut flags, new versions), as a person sees them in their
 * account. `optional: false` — the request to acknowledge a new current version — cannot be
 * turned off: an operator must hear of a change to a recipe for their machine.
 */
export const NOTIFICATION_KINDS = [
  'review-requested',
  'review-outcome',
  'review-due',
  'cut-flagged',
  'version-current',
  'integrity-failed',
  'trail-sealed',
] as const;
export type NotificationKind = (typeof NOTIFICATION_KINDS)[number];

export interface NotificationKindInfo {
  kind: NotificationKind;
  label: string;
  /** Who gets it. */
  audience: string;
  optional: boolean;
}

export const NOTIFICATION_INFO: readonly NotificationKindInfo[] = [
  { kind: 'review-requested', label: 'A version was sent for review', audience: 'approvers', optional: true },
  { kind: 'review-outcome', label: 'My version was returned or approved', audience: 'authors', optional: true },
  { kind: 'review-due', label: 'A periodic review of my recipe is coming due', audience: 'authors', optional: true },
  { kind: 'cut-flagged', label: 'An operator flagged a cut on my recipe', audience: 'authors', optional: true },
  { kind: 'version-current', label: 'A new version is in use on my machine (acknowledge it)', audience: 'operators', optional: false },
  { kind: 'integrity-failed', label: 'A signed version no longer matches its signatures', audience: 'admins and auditors', optional: false },
  { kind: 'trail-sealed', label: 'The trail was sealed (keep these mails: they let you check the trail later)', audience: 'auditors', optional: false },
];

/** Whether a person may turn this kind of mail off. */
export function isOptional(kind: NotificationKind): boolean {
  return NOTIFICATION_INFO.find((k) => k.kind === kind)?.optional ?? true;
}
