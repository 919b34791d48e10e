/**
 * Daily work around the recipes, planned as trail events: people created by the first
 * admin, cuts recorded on current versions (a few not good, some of those flags cleared by
 * an author), bench sheets printed, and sign-ins, sign-outs and failed sign-ins filling the
 * trail up to its size. Payloads are those the services write.
 */
import type { CutOutcome } from '../../../shared/vocabulary';
import { TRAIL_EVENTS } from '../../../server/services/trail/event-types';
import type { Person } from './people';
import type { PlannedRecipe, PlannedVersion } from './recipe-history';
import { DAY_MS, HOUR_MS, MINUTE_MS, type Random } from './random';
import { actorOf, IdSequence, type TrailActor, type TrailPlan } from './trail-plan';

/** Who the trail names for the first admin, made on the command line (server/cli/create-admin.ts). */
const COMMAND_LINE: TrailActor = { userId: null, name: 'command line (admin:create)', clientAddress: 'local' };

/** The trail snapshot of a person (user-dto.ts `trailSnapshot`). */
function personSnapshot(p: Person): Record<string, unknown> {
  return {
    username: p.username,
    displayName: p.displayName,
    email: p.email,
    roles: p.roles,
    active: true,
    mustChangePassword: false,
    units: 'metric',
    machineIds: [],
  };
}

export function planPeopleEvents(people: readonly Person[], plan: TrailPlan): void {
  const [first] = people;
  if (!first) return;
  for (const p of people) {
    plan.add(p.createdAt, p === first ? COMMAND_LINE : actorOf(first), () => ({
      type: TRAIL_EVENTS.userCreated,
      entityType: 'user',
      entityId: p.id,
      recipeId: null,
      before: null,
      after: personSnapshot(p),
    }));
  }
}

/** A current version and since when it is in use. */
interface InUse {
  version: PlannedVersion;
  since: number;
}

export function versionsInUse(recipes: readonly PlannedRecipe[]): InUse[] {
  return recipes.filter((r) => r.current?.approvedAt != null).map((r) => ({ version: r.current!, since: r.current!.approvedAt! }));
}

export interface CutRow {
  id: number;
  version: PlannedVersion;
  specimenId: string;
  partRef: string;
  quantity: number;
  outcome: CutOutcome;
  notes: string;
  operator: Person;
  cutAt: number;
  flagClearedAt: number | null;
  flagClearedBy: Person | null;
}

const PART_REFS = ['Heat 7731', 'Heat 8104', 'Lot A-118', 'Lot B-52', 'Order 5512/3', 'Batch 24-117', 'Heat 9920', 'Lot C-7', ''];
const BAD_NOTES: Record<Exclude<CutOutcome, 'good'>, string> = {
  burnt: 'Temper colours on the face near the centre; coolant flow looked low at the end of the cut.',
  deformed: 'Burr on the exit side and a slight bend of the offcut.',
  'wheel-failure': 'Wheel glazed halfway through; changed the wheel and cut again.',
  other: 'Clamp slipped at the start; specimen re-cut from the same bar.',
};
const GOOD_NOTES = ['', '', '', '', 'Clean face, no burr.', 'Cut as specified.'];

function outcomeOf(random: Random): CutOutcome {
  const r = random.next();
  if (r < 0.96) return 'good';
  if (r < 0.975) return 'burnt';
  if (r < 0.99) return 'deformed';
  if (r < 0.995) return 'wheel-failure';
  return 'other';
}

/** Any moment after `since` and before `end`, a little after the version came into use. */
function momentAfter(since: number, end: number, random: Random): number {
  const from = Math.min(since + HOUR_MS, end - MINUTE_MS);
  return random.between(from, end - MINUTE_MS);
}

export function planCuts(
  count: number,
  inUse: readonly InUse[],
  operators: readonly Person[],
  authors: readonly Person[],
  end: number,
  random: Random,
  plan: TrailPlan,
): { rows: CutRow[]; ids: IdSequence } {
  const rows: CutRow[] = [];
  const ids = new IdSequence();
  if (inUse.length === 0) return { rows, ids };
  for (let i = 0; i < count; i++) {
    const { version, since } = random.pick(inUse);
    const operator = random.pick(operators);
    const outcome = outcomeOf(random);
    const t = momentAfter(since, end, random);
    const cut: CutRow = {
      id: 0,
      version,
      specimenId: '',
      partRef: random.pick(PART_REFS),
      quantity: random.chance(0.8) ? 1 : random.int(2, 4),
      outcome,
      notes: outcome === 'good' ? random.pick(GOOD_NOTES) : BAD_NOTES[outcome],
      operator,
      cutAt: t,
      flagClearedAt: null,
      flagClearedBy: null,
    };
    plan.add(t, actorOf(operator), () => {
      cut.id = ids.next();
      cut.specimenId = `LD-${new Date(t).getUTCFullYear() % 100}-${String(cut.id).padStart(6, '0')}`;
      rows.push(cut);
      return {
        type: TRAIL_EVENTS.cutRecorded,
        entityType: 'recipe_version',
        entityId: version.id,
        recipeId: version.recipe.id,
        before: null,
        after: {
          cutId: cut.id,
          versionId: version.id,
          version: version.version,
          specimenId: cut.specimenId,
          partRef: cut.partRef,
          quantity: cut.quantity,
          outcome,
          notes: cut.notes,
        },
      };
    });
    // An author looks at most flagged cuts within a few days.
    const clearAt = t + random.between(2 * HOUR_MS, 4 * DAY_MS);
    if (outcome !== 'good' && random.chance(0.6) && clearAt < end) {
      const author = random.chance(0.7) ? version.createdBy : random.pick(authors);
      plan.add(clearAt, actorOf(author), () => {
        cut.flagClearedAt = clearAt;
        cut.flagClearedBy = author;
        const base = { cutId: cut.id, versionId: version.id, outcome };
        return {
          type: TRAIL_EVENTS.cutFlagCleared,
          entityType: 'recipe_version',
          entityId: version.id,
          recipeId: version.recipe.id,
          before: { ...base, flagClearedAt: null },
          after: { ...base, flagClearedAt: new Date(clearAt).toISOString() },
        };
      });
    }
  }
  return { rows, ids };
}

export interface PrintRow {
  id: number;
  version: PlannedVersion;
  user: Person;
  printedAt: number;
}

/**
 * Fills the trail up to `events` with prints, sign-ins, sign-outs and failed sign-ins.
 * Answers the print rows (ids handed out as the trail is written).
 */
export function planDailyWork(
  events: number,
  inUse: readonly InUse[],
  people: readonly Person[],
  operators: readonly Person[],
  end: number,
  random: Random,
  plan: TrailPlan,
): { prints: PrintRow[]; ids: IdSequence } {
  const prints: PrintRow[] = [];
  const ids = new IdSequence();
  const printCount = inUse.length === 0 ? 0 : Math.floor(events * 0.3);
  const failures = Math.floor(events * 0.04);
  const sessions = events - printCount - failures;

  for (let i = 0; i < printCount; i++) {
    const { version, since } = random.pick(inUse);
    const user = random.chance(0.85) ? random.pick(operators) : random.pick(people);
    const t = momentAfter(since, end, random);
    const print: PrintRow = { id: 0, version, user, printedAt: t };
    plan.add(t, actorOf(user), () => {
      print.id = ids.next();
      prints.push(print);
      return {
        type: TRAIL_EVENTS.sheetPrinted,
        entityType: 'recipe_version',
        entityId: version.id,
        recipeId: version.recipe.id,
        before: null,
        after: { printId: print.id, number: version.recipe.number, version: version.version, checkCode: version.checkCode, paper: 'A4', current: true },
      };
    });
  }

  for (let i = 0; i < failures; i++) {
    const p = random.pick(people);
    const t = random.between(p.createdAt + HOUR_MS, end - MINUTE_MS);
    // Mostly a known name with a wrong password; sometimes a name nobody has.
    const known = random.chance(0.7);
    const name = known ? p.username : `${p.username.slice(0, -1)}x`;
    plan.add(t, { userId: null, name, clientAddress: p.clientAddress }, () => ({
      type: TRAIL_EVENTS.signInFailed,
      entityType: 'user',
      entityId: known ? p.id : null,
      recipeId: null,
      after: { reason: 'bad credentials' },
    }));
  }

  // Sign-in, and a few hours later sign-out (the odd one stays signed in).
  for (let left = sessions; left > 0;) {
    const p = random.pick(people);
    const t = random.between(p.createdAt + HOUR_MS, end - 10 * HOUR_MS);
    p.lastSignInAt = Math.max(p.lastSignInAt ?? 0, Math.floor(t));
    plan.add(t, actorOf(p), () => ({ type: TRAIL_EVENTS.signedIn, entityType: 'user', entityId: p.id, recipeId: null }));
    left -= 1;
    if (left === 0) break;
    plan.add(t + random.between(HOUR_MS, 9 * HOUR_MS), actorOf(p), () => ({
      type: TRAIL_EVENTS.signedOut,
      entityType: 'user',
      entityId: p.id,
      recipeId: null,
    }));
    left -= 1;
  }
  return { prints, ids };
}
