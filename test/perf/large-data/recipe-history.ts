/**
 * Each recipe's life, planned the way the workflow services would have played it:
 * version 1 created and saved a few times, submitted (sometimes returned, fixed and
 * submitted again), approved with a signature and made current, superseding the version
 * before it; then the next version from it. The newest version of most recipes is approved
 * and current; some are still drafts, in review, returned, or were withdrawn.
 *
 * Every step plans the trail event its service writes, with the same before/after; rows
 * for versions, signatures, review comments and editors are collected for insertion once
 * the trail has handed out their ids.
 */
import type { RecipeStatus } from '../../../shared/vocabulary';
import type { CheckResult } from '../../../shared/recipe-checks';
import type { VersionContentValues } from '../../../server/data/recipes';
import { TRAIL_EVENTS } from '../../../server/services/trail/event-types';
import { addMonths, utcDay } from '../../../shared/calendar-dates';
import { newCheckCode } from '../../../server/services/recipes/check-codes';
import { formatRecipeNumber } from '../../../server/services/recipes/recipes';
import { contentSha256 } from '../../../server/services/recipes/version-integrity';
import { firstContent, nextContent, withReviewFix, type PlannedContent } from './content';
import type { Person } from './people';
import { DAY_MS, HOUR_MS, MINUTE_MS, type Random } from './random';
import type { StockCatalog } from './stock';
import { actorOf, IdSequence, type TrailPlan } from './trail-plan';

export interface PlannedRecipe {
  id: number;
  number: string;
  title: string;
  createdBy: Person;
  createdAt: number;
  updatedAt: number;
  versions: PlannedVersion[];
  /** The approved version in use now, or null. */
  current: PlannedVersion | null;
}

export interface PlannedVersion {
  id: number;
  recipe: PlannedRecipe;
  version: number;
  status: RecipeStatus;
  revision: number;
  planned: PlannedContent;
  contentHash: string | null;
  createdBy: Person;
  updatedBy: Person;
  createdAt: number;
  updatedAt: number;
  submittedAt: number | null;
  /** When it was approved and made current (cuts and prints come after). */
  approvedAt: number | null;
  effectiveFrom: string | null;
  reviewDueOn: string | null;
  supersededAt: number | null;
  withdrawnAt: number | null;
  withdrawnReason: string | null;
  checkCode: string | null;
  /** Person id → first and last edit. */
  editors: Map<number, { first: number; last: number }>;
}

export interface PlannedSignature {
  id: number;
  version: PlannedVersion;
  signer: Person;
  meaning: 'approved' | 'withdrawn';
  comment: string;
  signedAt: number;
  contentHash: string;
  acknowledgedWarnings: string[];
}

export interface PlannedComment {
  id: number;
  version: PlannedVersion;
  author: Person;
  body: string;
  createdAt: number;
}

/** Everything the recipe histories produced, filled while the trail is written. */
export interface RecipeHistory {
  recipes: PlannedRecipe[];
  signatures: PlannedSignature[];
  comments: PlannedComment[];
  ids: { recipes: IdSequence; versions: IdSequence; signatures: IdSequence; comments: IdSequence };
}

type Outcome = 'approved' | 'draft' | 'in-review' | 'returned' | 'withdrawn';

/** How the newest version of a recipe stands: mostly approved and in use. */
function outcomeOf(random: Random): Outcome {
  const r = random.next();
  if (r < 0.8) return 'approved';
  if (r < 0.86) return 'draft';
  if (r < 0.91) return 'in-review';
  if (r < 0.95) return 'returned';
  return 'withdrawn';
}

const SAVE_CHANGES = [['cutting'], ['instructionsMd'], ['acceptanceMd', 'instructionsMd'], ['scope'], ['cautionsMd'], ['clamping'], ['coolant', 'cutting']];
const RETURN_COMMENTS = [
  'Please add the acceptance criterion for flatness.',
  'Acceptance criteria are incomplete: say what a good face looks like.',
  'Add the check of the specimen marking to the acceptance list.',
  'The customer specification asks for a crack check; add it.',
];
const APPROVAL_COMMENTS = [
  '',
  '',
  'Checked against the customer specification.',
  'Trial cuts on three specimens were good.',
  'Reviewed with the shift lead.',
  'Periodic review done; parameters confirmed.',
];
const WITHDRAW_REASONS = [
  'The part is no longer made here.',
  'Replaced by a recipe for the new machine.',
  'Customer specification withdrawn; do not use until reviewed.',
  'Wheel type discontinued by the supplier.',
];

function checksOf(values: VersionContentValues): CheckResult[] {
  return JSON.parse(values.checks_json) as CheckResult[];
}

function touch(v: PlannedVersion, person: Person, at: number): void {
  const seen = v.editors.get(person.id);
  v.editors.set(person.id, { first: seen?.first ?? at, last: at });
}

export interface HistoryInput {
  count: number;
  /** First recipe created no earlier than this; every step done before `end`. */
  start: number;
  end: number;
  authors: Person[];
  approvers: Person[];
  reviewIntervalMonths: number;
  stock: StockCatalog;
  random: Random;
  plan: TrailPlan;
}

export function planRecipeHistories(input: HistoryInput): RecipeHistory {
  const history: RecipeHistory = {
    recipes: [],
    signatures: [],
    comments: [],
    ids: { recipes: new IdSequence(), versions: new IdSequence(), signatures: new IdSequence(), comments: new IdSequence() },
  };
  const checkCodes = new Set<string>();
  const freeCheckCode = () => {
    let code = newCheckCode();
    while (checkCodes.has(code)) code = newCheckCode();
    checkCodes.add(code);
    return code;
  };
  // The newest recipes still need time for three to five versions before `end`.
  const lastCreation = input.end - 45 * DAY_MS;
  for (let serial = 0; serial < input.count; serial++) {
    const createdAt = input.start + ((lastCreation - input.start) * (serial + input.random.next())) / input.count;
    history.recipes.push(planRecipe(serial, createdAt, input, history, freeCheckCode));
  }
  return history;
}

function planRecipe(serial: number, createdAt: number, input: HistoryInput, history: RecipeHistory, freeCheckCode: () => string): PlannedRecipe {
  const { random, plan, authors, approvers, stock } = input;
  const owner = random.pick(authors);
  const recipe: PlannedRecipe = { id: 0, number: '', title: '', createdBy: owner, createdAt, updatedAt: createdAt, versions: [], current: null };
  const count = random.int(3, 5);
  const outcome = outcomeOf(random);
  // Settled recipes stopped changing a while ago (some now due for their periodic review);
  // open or withdrawn ones moved recently.
  const lifeEnd = input.end - HOUR_MS;
  const settledAt = outcome === 'approved' ? createdAt + (lifeEnd - createdAt) * random.between(0.2, 1) : lifeEnd;
  const segment = (Math.min(lifeEnd, Math.max(settledAt, createdAt + count * 8 * DAY_MS)) - createdAt) / count;
  let planned = firstContent(serial, stock, random);
  recipe.title = planned.title;

  for (let n = 1; n <= count; n++) {
    if (n > 1) planned = nextContent(planned, stock, random);
    const last = n === count;
    const goal: Outcome = last ? outcome : 'approved';
    const s = createdAt + (n - 1) * segment + (n > 1 ? random.between(0, 0.05) * segment : 0);
    // A version's steps take the first half of its segment; a withdrawal comes later.
    const span = segment / 2;
    const at = (fraction: number) => s + fraction * span;
    const creator = random.chance(0.8) ? owner : random.pick(authors);
    const returnedOnce = goal !== 'draft' && goal !== 'in-review' && goal !== 'returned' && random.chance(0.2);
    const fix = returnedOnce ? withReviewFix(planned, stock, random) : null;
    const finalContent = fix ? fix.fixed : planned;
    // The next version starts from what this one ended with.
    planned = finalContent;
    const v: PlannedVersion = {
      id: 0,
      recipe,
      version: n,
      status: 'draft',
      revision: 0,
      planned: finalContent,
      contentHash: null,
      createdBy: creator,
      updatedBy: creator,
      createdAt: s,
      updatedAt: s,
      submittedAt: null,
      approvedAt: null,
      effectiveFrom: null,
      reviewDueOn: null,
      supersededAt: null,
      withdrawnAt: null,
      withdrawnReason: null,
      checkCode: null,
      editors: new Map(),
    };
    recipe.versions.push(v);
    touch(v, creator, s);
    recipe.updatedAt = s;
    const worst = finalContent.values.worst_check;
    const creatorActor = actorOf(creator);

    if (n === 1) {
      plan.add(s, creatorActor, () => {
        recipe.id = history.ids.recipes.next();
        recipe.number = formatRecipeNumber(recipe.id);
        v.id = history.ids.versions.next();
        return {
          type: TRAIL_EVENTS.recipeCreated,
          entityType: 'recipe',
          entityId: recipe.id,
          recipeId: recipe.id,
          before: null,
          after: { number: recipe.number, title: finalContent.title, version: 1, status: 'draft', worstCheck: worst },
        };
      });
    } else {
      const changeReason = finalContent.content.changeReason;
      plan.add(s, creatorActor, () => {
        v.id = history.ids.versions.next();
        return {
          type: TRAIL_EVENTS.versionCreated,
          entityType: 'recipe_version',
          entityId: v.id,
          recipeId: recipe.id,
          before: null,
          after: { version: n, status: 'draft', fromVersion: n - 1, changeReason, photosCopied: 0, worstCheck: worst },
        };
      });
    }

    // Draft saves, now and then by a second author.
    const saves = random.int(goal === 'draft' ? 0 : 1, 3);
    for (let i = 0; i < saves; i++) {
      const saver = random.chance(0.85) ? creator : random.pick(authors);
      save(v, saver, at(0.05 + (0.25 * (i + random.next())) / saves), random.pick(SAVE_CHANGES), false);
    }
    if (goal === 'draft') continue;

    if (fix) {
      submit(v, at(0.35), fix.reviewed);
      returnVersion(v, pickApprover(v), at(0.45));
      save(v, creator, at(0.55), ['acceptanceMd'], true);
    }
    submit(v, at(0.65), finalContent);
    if (goal === 'in-review') continue;
    if (goal === 'returned') {
      returnVersion(v, pickApprover(v), at(0.85));
      continue;
    }
    approve(v, pickApprover(v), at(0.85));
    if (goal === 'withdrawn') withdraw(v, random.pick(approvers), s + span * random.between(1.2, 1.9));
  }
  return recipe;

  // --- steps -------------------------------------------------------------------------

  function save(v: PlannedVersion, saver: Person, t: number, changed: string[], fromReturned: boolean): void {
    const before: Record<string, unknown> = { revision: v.revision };
    const after: Record<string, unknown> = { revision: v.revision + 1, changed };
    if (fromReturned) {
      before['status'] = 'returned';
      after['status'] = 'draft';
      v.status = 'draft';
      v.contentHash = null;
    }
    v.revision += 1;
    v.updatedBy = saver;
    v.updatedAt = t;
    touch(v, saver, t);
    recipe.updatedAt = t;
    plan.add(t, actorOf(saver), () => ({ type: TRAIL_EVENTS.draftSaved, entityType: 'recipe_version', entityId: v.id, recipeId: recipe.id, before, after }));
  }

  function submit(v: PlannedVersion, t: number, content: PlannedContent): void {
    const hash = contentSha256(content.values.content_json);
    const before = { status: 'draft', revision: v.revision };
    const after = { status: 'in-review', revision: v.revision + 1, contentSha256: hash, worstCheck: content.values.worst_check };
    v.status = 'in-review';
    v.revision += 1;
    v.contentHash = hash;
    v.submittedAt = t;
    plan.add(t, actorOf(v.updatedBy), () => ({
      type: TRAIL_EVENTS.versionSubmitted,
      entityType: 'recipe_version',
      entityId: v.id,
      recipeId: recipe.id,
      before,
      after,
    }));
  }

  function returnVersion(v: PlannedVersion, approver: Person, t: number): void {
    const body = random.pick(RETURN_COMMENTS);
    const before = { status: 'in-review', revision: v.revision };
    const revision = v.revision + 1;
    v.status = 'returned';
    v.revision = revision;
    plan.add(t, actorOf(approver), () => {
      const comment: PlannedComment = { id: history.ids.comments.next(), version: v, author: approver, body, createdAt: t };
      history.comments.push(comment);
      return {
        type: TRAIL_EVENTS.versionReturned,
        entityType: 'recipe_version',
        entityId: v.id,
        recipeId: recipe.id,
        before,
        after: { status: 'returned', revision, commentId: comment.id, comment: body },
      };
    });
  }

  function approve(v: PlannedVersion, approver: Person, t: number): void {
    const effectiveFrom = utcDay(new Date(t));
    const reviewDueOn = addMonths(effectiveFrom, input.reviewIntervalMonths);
    const acknowledged = [
      ...new Set(
        checksOf(v.planned.values)
          .filter((c) => c.severity === 'warning')
          .map((c) => c.id),
      ),
    ].sort();
    const comment = random.pick(APPROVAL_COMMENTS);
    const before = { status: 'in-review', revision: v.revision };
    const revision = v.revision + 1;
    const contentHash = v.contentHash!;
    v.status = 'approved';
    v.revision = revision;
    v.approvedAt = t;
    v.effectiveFrom = effectiveFrom;
    v.reviewDueOn = reviewDueOn;
    v.checkCode = freeCheckCode();
    const previous = recipe.current;
    recipe.current = v;
    recipe.updatedAt = t;
    const superseded = previous ? { version: previous, revision: previous.revision } : null;
    if (previous) {
      previous.status = 'superseded';
      previous.revision += 1;
      previous.supersededAt = t;
    }
    plan.add(t, actorOf(approver), () => {
      const signature: PlannedSignature = {
        id: history.ids.signatures.next(),
        version: v,
        signer: approver,
        meaning: 'approved',
        comment,
        signedAt: t,
        contentHash,
        acknowledgedWarnings: acknowledged,
      };
      history.signatures.push(signature);
      return {
        type: TRAIL_EVENTS.versionApproved,
        entityType: 'recipe_version',
        entityId: v.id,
        recipeId: recipe.id,
        before,
        after: {
          status: 'approved',
          revision,
          signatureId: signature.id,
          signerName: approver.displayName,
          meaning: 'approved',
          comment,
          contentSha256: contentHash,
          acknowledgedWarnings: acknowledged,
          effectiveFrom,
          reviewDueOn,
          current: true,
        },
      };
    });
    if (superseded) {
      const old = superseded.version;
      plan.add(t, actorOf(approver), () => ({
        type: TRAIL_EVENTS.versionSuperseded,
        entityType: 'recipe_version',
        entityId: old.id,
        recipeId: recipe.id,
        before: { status: 'approved', revision: superseded.revision },
        after: { status: 'superseded', revision: superseded.revision + 1, supersededByVersion: v.version, supersededByVersionId: v.id },
      }));
    }
  }

  function withdraw(v: PlannedVersion, approver: Person, t: number): void {
    const reason = random.pick(WITHDRAW_REASONS);
    const before = { status: 'approved', revision: v.revision, current: true };
    const revision = v.revision + 1;
    const contentHash = v.contentHash!;
    v.status = 'withdrawn';
    v.revision = revision;
    v.withdrawnAt = t;
    v.withdrawnReason = reason;
    recipe.current = null;
    recipe.updatedAt = t;
    plan.add(t, actorOf(approver), () => {
      const signature: PlannedSignature = {
        id: history.ids.signatures.next(),
        version: v,
        signer: approver,
        meaning: 'withdrawn',
        comment: reason,
        signedAt: t,
        contentHash,
        acknowledgedWarnings: [],
      };
      history.signatures.push(signature);
      return {
        type: TRAIL_EVENTS.versionWithdrawn,
        entityType: 'recipe_version',
        entityId: v.id,
        recipeId: recipe.id,
        before,
        after: { status: 'withdrawn', revision, current: false, signatureId: signature.id, signerName: approver.displayName, meaning: 'withdrawn', reason },
      };
    });
  }

  /** An approver who neither wrote nor edited the version (the service refuses them). */
  function pickApprover(v: PlannedVersion): Person {
    const allowed = approvers.filter((a) => !v.editors.has(a.id));
    if (allowed.length === 0) throw new Error(`No approver is free to approve version ${v.version}: every approver edited it.`);
    return random.pick(allowed);
  }
}

/** Minutes after `t`, never at or past `end`. */
export function shortlyAfter(t: number, end: number, random: Random, maxMinutes: number): number {
  return Math.min(end - 1, t + random.int(1, maxMinutes) * MINUTE_MS);
}
