/**
 * The invented lab's review history: which demo recipes the demo approver reviewed, when,
 * and with which words, so the library shows every state a recipe can be in. Days are
 * counted back from the day the demo is loaded; everything goes through the workflow
 * services with that day as their `now`, so signatures, dates and the trail agree.
 */
import type { RecipeContent } from '../../shared/schemas/recipe';

export type DemoStep =
  | { kind: 'submit'; daysAgo: number }
  | { kind: 'return'; daysAgo: number; comment: string }
  | { kind: 'approve'; daysAgo: number; comment?: string; effectiveInDays?: number }
  | { kind: 'withdraw'; daysAgo: number; reason: string }
  | { kind: 'new-version'; daysAgo: number; changeReason: string; change: (content: RecipeContent) => RecipeContent };

export interface DemoHistory {
  /** Title of a recipe in demo-recipes.ts. */
  title: string;
  steps: DemoStep[];
}

/** About two years back: the lab's review interval is 24 months, so these come due soon. */
const TWO_YEARS = 730;

export const DEMO_HISTORY: DemoHistory[] = [
  // Approved and current.
  {
    title: 'C45 bar, transverse section',
    steps: [
      { kind: 'submit', daysAgo: 121 },
      { kind: 'approve', daysAgo: 120, comment: 'Matches the trial cuts on lot 2207.' },
    ],
  },
  {
    title: 'EN AW-6082 bar, transverse',
    steps: [
      { kind: 'submit', daysAgo: 62 },
      { kind: 'approve', daysAgo: 60 },
    ],
  },
  {
    title: 'CW614N brass bar',
    steps: [
      { kind: 'submit', daysAgo: 31 },
      { kind: 'approve', daysAgo: 29, comment: 'Approved for the bench saw only.' },
    ],
  },

  // Version 2 approved, version 1 superseded.
  {
    title: '42CrMo4 quenched and tempered bar, large diameters',
    steps: [
      { kind: 'submit', daysAgo: 402 },
      { kind: 'approve', daysAgo: 400 },
      {
        kind: 'new-version',
        daysAgo: 21,
        changeReason: 'Feed lowered from 0.35 to 0.30 mm/s after temper colours on the cut face of heat 4417.',
        change: (c) => ({ ...c, cutting: { ...c.cutting, feedMmS: 0.3 } }),
      },
      { kind: 'submit', daysAgo: 20 },
      { kind: 'approve', daysAgo: 18, comment: 'Checked against the cut log of heat 4417.' },
    ],
  },

  // Returned to the author with a comment.
  {
    title: 'X5CrNi18-10 tube, transverse',
    steps: [
      { kind: 'submit', daysAgo: 5 },
      { kind: 'return', daysAgo: 3, comment: 'Thin walls: say where the clamps go and use soft inserts so the tube is not squeezed oval.' },
    ],
  },

  // Approved long ago, then withdrawn with a reason.
  {
    title: 'Ductile iron casting, section through the wall',
    steps: [
      { kind: 'submit', daysAgo: 301 },
      { kind: 'approve', daysAgo: 300 },
      { kind: 'withdraw', daysAgo: 10, reason: 'The part now comes as a forging; this casting method must no longer be used.' },
    ],
  },

  // Version 1 current; version 2 approved to take over in two weeks.
  {
    title: 'Alumina ceramic plate',
    steps: [
      { kind: 'submit', daysAgo: 201 },
      { kind: 'approve', daysAgo: 200 },
      {
        kind: 'new-version',
        daysAgo: 7,
        changeReason: 'Feed lowered to 0.02 mm/s: edge chipping above the limit on 2 mm plates.',
        change: (c) => ({ ...c, cutting: { ...c.cutting, feedMmS: 0.02 } }),
      },
      { kind: 'submit', daysAgo: 6 },
      { kind: 'approve', daysAgo: 2, comment: 'Effective once the new wax blocks are in.', effectiveInDays: 14 },
    ],
  },

  // Periodic review due in about three weeks, and one overdue.
  {
    title: 'Populated circuit board, solder joint section',
    steps: [
      { kind: 'submit', daysAgo: TWO_YEARS - 20 },
      { kind: 'approve', daysAgo: TWO_YEARS - 22 },
    ],
  },
  {
    title: 'X153CrMoV12 hardened block, bench saw',
    steps: [
      { kind: 'submit', daysAgo: TWO_YEARS + 12 },
      { kind: 'approve', daysAgo: TWO_YEARS + 9 },
    ],
  },

  // Waiting for review.
  { title: 'Ti-6Al-4V bar, pulsed cut', steps: [{ kind: 'submit', daysAgo: 2 }] },
  { title: 'Alloy 718 bar', steps: [{ kind: 'submit', daysAgo: 1 }] },
  { title: 'CFRP laminate coupon', steps: [{ kind: 'submit', daysAgo: 1 }] },
];

/** Versions the history adds beyond each recipe's first. */
export const DEMO_EXTRA_VERSIONS = DEMO_HISTORY.reduce((n, h) => n + h.steps.filter((s) => s.kind === 'new-version').length, 0);
