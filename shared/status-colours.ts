/**
 * Kerfbook's one status language: every version status and check severity as colour + icon +
 * word, so the same state looks the same on a chip, in a table, on the check page and on the
 * printed sheet, and never depends on colour alone (WCAG 2.1 SC 1.4.1, Use of Color).
 *
 * A few tones carry the meaning; statuses and severities borrow them:
 *   go      (green)  approved / current: the version to use
 *   info    (blue)   in review, notes: something in progress or worth knowing
 *   caution (amber)  returned, warnings: someone has to act
 *   stop    (red)    withdrawn, blockers: do not use, cannot go on
 *   idle    (grey)   drafts: not yet anything
 *   retired (slate)  superseded: was right once, history now
 *
 * Each tone's `ink` (text and icon) reads at 4.5:1 or better on its own `fill` and on the
 * app's surfaces (WCAG 2.1 SC 1.4.3, Contrast (Minimum)); test/unit/shared/status-colours.spec.ts
 * measures it. The client publishes these as CSS custom properties (`--kb-tone-go-ink`, …),
 * the bench sheet prints with the same inks.
 */
import type { CheckSeverity } from './recipe-checks';
import { CHECK_SEVERITY_LABELS, RECIPE_STATUS_LABELS, RECIPE_STATUSES, type RecipeStatus } from './vocabulary';

export const STATUS_TONES = ['go', 'info', 'caution', 'stop', 'idle', 'retired'] as const;
export type StatusTone = (typeof STATUS_TONES)[number];

export interface ToneColours {
  /** Text and icon colour: on `fill`, and on the app's light surfaces. */
  ink: string;
  /** The chip's or box's background. */
  fill: string;
  /** A border or left bar that sets the box off from the page. */
  edge: string;
}

export const TONE_COLOURS: Record<StatusTone, ToneColours> = {
  go: { ink: '#1d5a2e', fill: '#dcefdf', edge: '#3f8a52' },
  info: { ink: '#1d4a6a', fill: '#dde9f5', edge: '#527b9d' },
  caution: { ink: '#6b3d00', fill: '#fbe6c8', edge: '#b7791f' },
  stop: { ink: '#8c1d18', fill: '#fbe2de', edge: '#c4423a' },
  idle: { ink: '#44474b', fill: '#e6e8ed', edge: '#8e9195' },
  retired: { ink: '#4a4658', fill: '#ebe8f1', edge: '#8b869b' },
};

/**
 * The app's light surfaces a status ink may sit on without its fill (the theme's
 * neutral tones: page, cards, raised containers). Kept here so the contrast test covers them.
 */
export const APP_SURFACES = { page: '#f7f9fe', card: '#ffffff', container: '#eceef2', raised: '#e6e8ed' } as const;

export interface StatusMark extends ToneColours {
  tone: StatusTone;
  /** A Material Icons ligature name. */
  icon: string;
  /** The word shown with it (from the vocabulary). */
  label: string;
}

const mark = (tone: StatusTone, icon: string, label: string): StatusMark => ({ tone, icon, label, ...TONE_COLOURS[tone] });

export const RECIPE_STATUS_MARKS: Record<RecipeStatus, StatusMark> = {
  draft: mark('idle', 'edit_note', RECIPE_STATUS_LABELS.draft),
  'in-review': mark('info', 'rate_review', RECIPE_STATUS_LABELS['in-review']),
  returned: mark('caution', 'undo', RECIPE_STATUS_LABELS.returned),
  approved: mark('go', 'verified', RECIPE_STATUS_LABELS.approved),
  superseded: mark('retired', 'history', RECIPE_STATUS_LABELS.superseded),
  withdrawn: mark('stop', 'block', RECIPE_STATUS_LABELS.withdrawn),
};

export const CHECK_SEVERITY_MARKS: Record<CheckSeverity, StatusMark> = {
  blocker: mark('stop', 'block', CHECK_SEVERITY_LABELS.blocker),
  warning: mark('caution', 'warning', CHECK_SEVERITY_LABELS.warning),
  note: mark('info', 'info', CHECK_SEVERITY_LABELS.note),
};

/**
 * The check page's verdict on a printed sheet is about use at the saw, so it takes the tone
 * of what the operator must do: use it (go), wait (caution), do not use it (stop). The
 * icon and headline still name the version's status.
 */
export const SHEET_VERDICT_TONES = { current: 'go', pending: 'caution', superseded: 'stop', withdrawn: 'stop' } as const satisfies Record<string, StatusTone>;

/** "No findings": the checks ran and found nothing. */
export const NO_FINDINGS_MARK: StatusMark = mark('go', 'check_circle', 'No findings');

/** Every status and severity, for tests and the CSS custom properties. */
export const ALL_STATUS_MARKS: readonly StatusMark[] = [
  ...RECIPE_STATUSES.map((s) => RECIPE_STATUS_MARKS[s]),
  ...Object.values(CHECK_SEVERITY_MARKS),
  NO_FINDINGS_MARK,
];

/** The tones as CSS custom properties: `--kb-tone-go-ink: #1d5a2e`, … */
export function toneCustomProperties(): Record<string, string> {
  const properties: Record<string, string> = {};
  for (const tone of STATUS_TONES) {
    for (const [part, value] of Object.entries(TONE_COLOURS[tone])) properties[`--kb-tone-${tone}-${part}`] = value;
  }
  return properties;
}
