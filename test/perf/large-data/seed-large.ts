/**
 * The large data set: at scale 1, 10,000 recipes of 3–5 versions, 200 people,
 * 1,000,000 trail events in one valid chain and 100,000 cut records, over three years of
 * history ending now. `npm run seed:large` and `npm run bench` call `seedLarge`.
 *
 * The whole history is planned in memory first (people, stock, each recipe's workflow,
 * cuts, prints, sign-ins), then written with multi-row INSERTs: people, the trail in time
 * order (which hands out the ids, growing with time as in the app), then the rows the
 * trail's events refer to. The freeze, workflow and append-only triggers stay on: signed
 * versions are inserted in review, and reach their state the way the database allows —
 * approval signatures, then approved; withdrawal signatures, then superseded or withdrawn.
 */
import type { Knex } from 'knex';
import type { Role } from '../../../shared/roles';
import { ROLES } from '../../../shared/roles';
import type { RecipeStatus } from '../../../shared/vocabulary';
import { findLabSettings } from '../../../server/data/lab-settings';
import { hashPassword } from '../../../server/services/auth/passwords';
import { DEFAULT_REVIEW_INTERVAL_MONTHS } from '../../../server/services/recipes/workflow';
import { migrate } from '../../../server/data/migrate';
import { planCuts, planDailyWork, planPeopleEvents, versionsInUse } from './activity';
import { insertBatches, type Row } from './batch-insert';
import { scaledCounts } from './counts';
import { emptyTables, restoreLabSettings } from '../../../server/data/empty-tables';
import { firstWithRole, LARGE_DATA_PASSWORD, planPeople, withRole, type Person } from './people';
import { DAY_MS, Random } from './random';
import { planRecipeHistories, type PlannedVersion } from './recipe-history';
import { insertStock } from './stock';
import { actorOf, TrailPlan } from './trail-plan';
import { writeTrail } from './trail-writer';

export interface SeedLargeOptions {
  /** Multiplies every count (each at least 1); 1 = full scale. */
  scale: number;
  log?: (line: string) => void;
  /** Empty a database that already holds data first; without it such a database is refused. */
  replace?: boolean;
  /** The end of the history (default: now). */
  now?: Date;
  /** Seed of the random choices: the same seed and scale give the same data set. */
  seed?: number;
}

export interface LargeDataSummary {
  scale: number;
  counts: {
    users: number;
    recipes: number;
    recipeVersions: number;
    trailEvents: number;
    cutRecords: number;
    sheetPrints: number;
    signatures: number;
    reviewComments: number;
    materials: number;
    wheels: number;
    machines: number;
    selectionRows: number;
  };
  /** Every generated person signs in with this password. */
  password: string;
  /** One username per role, e.g. `large.author.001`. */
  usernames: Record<Role, string>;
  seconds: number;
}

const YEAR_MS = 365 * DAY_MS;

async function hasData(db: Knex): Promise<boolean> {
  for (const table of ['users', 'recipes', 'materials', 'trail_events']) {
    if (await db(table).first(db.raw('1 as one'))) return true;
  }
  return false;
}

/** The database already has data and `replace` was not asked for. */
export class DatabaseNotEmptyError extends Error {}

export async function seedLarge(db: Knex, options: SeedLargeOptions): Promise<LargeDataSummary> {
  const log = options.log ?? (() => undefined);
  const began = performance.now();
  let lap = began;
  const step = (what: string) => {
    const now = performance.now();
    log(`[seed:large] ${what} (${((now - lap) / 1000).toFixed(1)} s)`);
    lap = now;
  };

  await migrate(db);
  if (await hasData(db)) {
    if (!options.replace) throw new DatabaseNotEmptyError('The database already holds data. Use --replace to empty it and make the large data set.');
    await emptyTables(db);
    await restoreLabSettings(db);
    step('emptied the tables');
  }

  const counts = scaledCounts(options.scale);
  const random = new Random(options.seed ?? 20_261_202);
  const end = (options.now ?? new Date()).getTime();
  const start = end - 3 * YEAR_MS;
  const plan = new TrailPlan();

  // --- plan ---------------------------------------------------------------------------
  const people = planPeople(counts.users, start, random);
  planPeopleEvents(people, plan);
  const authors = withRole(people, 'author');
  const approvers = withRole(people, 'approver');
  const operators = withRole(people, 'operator');
  const stock = await insertStock(db, start + DAY_MS, actorOf(authors[0]!), plan);
  step(
    `stock: ${stock.counts.machines} machines, ${stock.counts.wheels} wheels, ${stock.counts.materials} materials, ${stock.counts.selectionRows} selection rows`,
  );

  const months = (await findLabSettings(db))?.review_interval_months;
  const history = planRecipeHistories({
    count: counts.recipes,
    start: start + 7 * DAY_MS,
    end,
    authors,
    approvers,
    reviewIntervalMonths: typeof months === 'number' && months > 0 ? months : DEFAULT_REVIEW_INTERVAL_MONTHS,
    stock,
    random,
    plan,
  });
  const inUse = versionsInUse(history.recipes);
  const cuts = planCuts(counts.cutRecords, inUse, operators, authors, end, random, plan);
  const prints = planDailyWork(Math.max(0, counts.trailEvents - plan.size), inUse, people, operators, end, random, plan);
  step(`planned ${history.recipes.length} recipes, ${plan.size} trail events`);

  // --- write --------------------------------------------------------------------------
  const passwordHash = await hashPassword(LARGE_DATA_PASSWORD);
  await insertBatches(
    db,
    'users',
    people.map((p) => userRow(p, passwordHash)),
  );
  await insertBatches(
    db,
    'user_roles',
    people.flatMap((p) => p.roles.map((role) => ({ user_id: p.id, role }))),
  );
  step(`users: ${people.length}`);

  const trail = await writeTrail(db, plan, (n) => log(`[seed:large]   trail: ${n} events…`));
  step(`trail_events: ${trail.events} (chain head ${trail.lastHash.slice(0, 12)}…)`);

  const recipes = history.recipes;
  const versions = recipes.flatMap((r) => r.versions).sort((a, b) => a.id - b.id);
  await insertBatches(
    db,
    'recipes',
    recipes.map((r) => ({
      id: r.id,
      number: r.number,
      title: r.title,
      latest_version_id: null,
      current_version_id: null,
      created_by: r.createdBy.id,
      created_at: new Date(r.createdAt),
      updated_at: new Date(r.updatedAt),
    })),
  );
  await insertBatches(db, 'recipe_versions', versions.map(versionRow), 500);
  // Now that the versions exist, each recipe points at its latest and current one.
  const links = recipes.map((r) => ({
    id: r.id,
    number: r.number,
    title: r.title,
    latest_version_id: r.versions[r.versions.length - 1]!.id,
    current_version_id: r.current?.id ?? null,
    created_by: r.createdBy.id,
    created_at: new Date(r.createdAt),
    updated_at: new Date(r.updatedAt),
  }));
  for (let i = 0; i < links.length; i += 2000) {
    await db('recipes')
      .insert(links.slice(i, i + 2000))
      .onConflict('id')
      .merge(['latest_version_id', 'current_version_id']);
  }
  await db('recipe_number_counter').where({ id: 1 }).update({ last_number: recipes.length });
  step(`recipes: ${recipes.length}, recipe_versions: ${versions.length}`);

  await insertBatches(
    db,
    'recipe_version_editors',
    versions.flatMap((v) =>
      [...v.editors].map(([userId, e]) => ({ version_id: v.id, user_id: userId, first_edited_at: new Date(e.first), last_edited_at: new Date(e.last) })),
    ),
  );
  const signatures = history.signatures.sort((a, b) => a.id - b.id);
  const signatureRow = (s: (typeof signatures)[number]): Row => ({
    id: s.id,
    version_id: s.version.id,
    signer_id: s.signer.id,
    signer_name: s.signer.displayName.slice(0, 100),
    meaning: s.meaning,
    comment: s.comment,
    signed_at: new Date(s.signedAt),
    content_hash: s.contentHash,
    acknowledged_warnings_json: JSON.stringify(s.acknowledgedWarnings),
  });
  const signedIds = (status: RecipeStatus) => versions.filter((v) => v.status === status).map((v) => v.id);
  await insertBatches(db, 'signatures', signatures.filter((s) => s.meaning === 'approved').map(signatureRow));
  await setStatus(db, SIGNED.flatMap(signedIds), 'approved');
  await insertBatches(db, 'signatures', signatures.filter((s) => s.meaning === 'withdrawn').map(signatureRow));
  await setStatus(db, signedIds('superseded'), 'superseded');
  await setStatus(db, signedIds('withdrawn'), 'withdrawn');
  await insertBatches(
    db,
    'review_comments',
    history.comments.map((c) => ({
      id: c.id,
      version_id: c.version.id,
      author_id: c.author.id,
      author_name: c.author.displayName.slice(0, 100),
      body: c.body,
      path: '',
      created_at: new Date(c.createdAt),
    })),
  );
  step(`recipe_version_editors, signatures: ${signatures.length}, review_comments: ${history.comments.length}`);

  await insertBatches(
    db,
    'cut_records',
    cuts.rows.map((c) => ({
      id: c.id,
      version_id: c.version.id,
      recipe_id: c.version.recipe.id,
      specimen_id: c.specimenId,
      part_ref: c.partRef,
      quantity: c.quantity,
      outcome: c.outcome,
      notes: c.notes,
      operator_id: c.operator.id,
      operator_name: c.operator.displayName.slice(0, 100),
      cut_at: new Date(c.cutAt),
      flag_cleared_at: c.flagClearedAt === null ? null : new Date(c.flagClearedAt),
      flag_cleared_by: c.flagClearedBy?.id ?? null,
    })),
  );
  step(`cut_records: ${cuts.rows.length}`);
  await insertBatches(
    db,
    'sheet_prints',
    prints.prints.map((p) => ({
      id: p.id,
      version_id: p.version.id,
      user_id: p.user.id,
      printed_at: new Date(p.printedAt),
      client_address: p.user.clientAddress.slice(0, 45),
    })),
  );
  step(`sheet_prints: ${prints.prints.length}`);

  const usernames = Object.fromEntries(ROLES.map((role) => [role, firstWithRole(people, role)?.username ?? ''])) as Record<Role, string>;
  const seconds = (performance.now() - began) / 1000;
  log(`[seed:large] done in ${seconds.toFixed(1)} s`);
  return {
    scale: options.scale,
    counts: {
      users: people.length,
      recipes: recipes.length,
      recipeVersions: versions.length,
      trailEvents: trail.events,
      cutRecords: cuts.rows.length,
      sheetPrints: prints.prints.length,
      signatures: signatures.length,
      reviewComments: history.comments.length,
      ...stock.counts,
    },
    password: LARGE_DATA_PASSWORD,
    usernames,
    seconds,
  };
}

function userRow(p: Person, passwordHash: string): Row {
  return {
    id: p.id,
    username: p.username,
    display_name: p.displayName,
    email: p.email,
    password_hash: passwordHash,
    must_change_password: false,
    active: true,
    units: 'metric',
    session_epoch: 0,
    created_at: new Date(p.createdAt),
    updated_at: new Date(p.createdAt),
    last_sign_in_at: p.lastSignInAt === null ? null : new Date(p.lastSignInAt),
    deactivated_at: null,
  };
}

/** Versions that carry signatures; inserted in review, they are signed and moved on afterwards. */
const SIGNED: readonly RecipeStatus[] = ['approved', 'superseded', 'withdrawn'];

async function setStatus(db: Knex, ids: readonly number[], status: RecipeStatus): Promise<void> {
  for (let i = 0; i < ids.length; i += 1000) {
    await db('recipe_versions')
      .whereIn('id', ids.slice(i, i + 1000))
      .update({ status });
  }
}

function versionRow(v: PlannedVersion): Row {
  const date = (t: number | null) => (t === null ? null : new Date(t));
  return {
    id: v.id,
    recipe_id: v.recipe.id,
    version: v.version,
    status: SIGNED.includes(v.status) ? 'in-review' : v.status,
    revision: v.revision,
    ...v.planned.values,
    content_hash: v.contentHash,
    check_code: v.checkCode,
    created_by: v.createdBy.id,
    updated_by: v.updatedBy.id,
    created_at: new Date(v.createdAt),
    updated_at: new Date(v.updatedAt),
    submitted_at: date(v.submittedAt),
    effective_from: v.effectiveFrom,
    review_due_on: v.reviewDueOn,
    superseded_at: date(v.supersededAt),
    withdrawn_at: date(v.withdrawnAt),
    withdrawn_reason: v.withdrawnReason,
  };
}
