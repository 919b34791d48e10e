/**
 * `npm run bench` (README.md in this folder): the large data set's MariaDB (largeDatabase: its own on port
 * 33307, or LARGE_DATABASE_URL), migrated and — when it has no people yet — filled with the
 * large data set; the app in a separate process (app-process.ts) driven over loopback
 * by autocannon; every figure with its absolute numbers and its ratio to a baseline measured
 * in the same run. Prints a table and writes test/perf/load/results.json.
 *
 * Exit 0 when the run completed (figures that miss are reported as MISS), 1 when EXPLAIN
 * finds a full scan of a large table, 2 when the run itself failed.
 *
 *   npm run bench -- [--scale <fraction>] [--duration <seconds>] [--explain-only]
 *   --scale     size of the large data set when it has to be made (default 1)
 *   --duration  seconds of each measured load run (default 10; a 2 s warm-up comes first)
 *   --explain-only  only the EXPLAIN check (no load, no results file)
 */
import path from 'node:path';
import type { Knex } from 'knex';
import { createDb } from '../../../server/data/db';
import { largeDatabase, type LargeDatabase } from '../large-data/large-database';
import { migrate } from '../../../server/data/migrate';
import { seedLarge, type LargeDataSummary } from '../large-data/seed-large';
import { ROOT } from '../../../server/tools/project-files';
import { ensureBenchUsers, BENCH_ROLES, type BenchRole } from './users';
import { ensureBigRecipe } from './big-recipe';
import { runExplainCheck } from './explain-check';
import { chainFigures, loadFigures } from './figures';
import { freshComparisonFigure } from './fresh-comparison';
import { signIn, type HttpSession } from './http-session';
import { machineInfo, printExplain, printTable, resultOf, writeResults, type Figure } from './report';
import { readSamples } from './samples';
import { startBenchServer, type BenchServer } from './server-process';

const RESULTS_FILE = path.join(ROOT, 'test/perf/load/results.json');

function option(name: string, fallback: number): number {
  const i = process.argv.indexOf(`--${name}`);
  if (i < 0) return fallback;
  const value = Number(process.argv[i + 1]);
  if (!Number.isFinite(value) || value <= 0) {
    console.error(`--${name} needs a positive number, e.g. --${name} ${fallback}.`);
    process.exit(2);
  }
  return value;
}

const log = (line: string) => console.log(line);
let database: LargeDatabase | null = null;
let db: Knex | null = null;
let server: BenchServer | null = null;

async function cleanUp(): Promise<void> {
  if (server) await server.stop().catch(() => undefined);
  server = null;
  if (db) await db.destroy().catch(() => undefined);
  db = null;
  if (database) await database.stop().catch(() => undefined);
  database = null;
}

let interrupted = false;
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.once(signal, () => {
    interrupted = true;
    console.error(`\n[bench] ${signal}: stopping the bench server and the MariaDB it started…`);
    void cleanUp().then(() => process.exit(130));
  });
}

/** Fills an empty database with the large data set (test/perf/large-data). */
async function fillIfEmpty(conn: Knex, scale: number): Promise<Omit<LargeDataSummary, 'password'> | null> {
  const row = (await conn('users').count<{ n: number }[]>({ n: '*' }).first()) as { n: number } | undefined;
  if (Number(row?.n ?? 0) > 0) {
    if (process.argv.includes('--scale')) log('[bench] the database already holds data: --scale applies only when the run has to fill it.');
    return null;
  }
  log(`[bench] the database is empty: making the large data set (scale ${scale}); a few minutes at scale 1…`);
  const { password: _password, ...summary } = await seedLarge(conn, { scale, log });
  log(`[bench] large data set made in ${summary.seconds.toFixed(0)} s.`);
  return summary;
}

async function datasetCounts(conn: Knex): Promise<Record<string, number>> {
  const count = async (table: string) => Number(((await conn(table).count<{ n: number }[]>({ n: '*' }).first()) as { n: number }).n);
  const head = (await conn('trail_chain_head').where({ id: 1 }).first('last_event_id')) as { last_event_id: number } | undefined;
  return {
    recipes: await count('recipes'),
    recipeVersions: await count('recipe_versions'),
    users: await count('users'),
    trailEvents: Number(head?.last_event_id ?? 0),
    cutRecords: await count('cut_records'),
    sheetPrints: await count('sheet_prints'),
  };
}

async function main(): Promise<number> {
  const scale = option('scale', 1);
  const durationS = option('duration', 10);

  database = await largeDatabase();
  db = createDb(database.url);
  const ran = await migrate(db);
  log(`[bench] database ready; migrations: ${ran.length ? ran.join(', ') : 'up to date'}`);
  const seeded = await fillIfEmpty(db, scale);

  const users = await ensureBenchUsers(db);
  const big = await ensureBigRecipe(db, users);
  const samples = await readSamples(db);
  const dataset = await datasetCounts(db);
  log(
    `[bench] data: ${Object.entries(dataset)
      .map(([k, v]) => `${k} ${v.toLocaleString('en')}`)
      .join(', ')}`,
  );

  server = await startBenchServer(database.url);
  log(`[bench] app under test at ${server.url}`);
  const sessions = {} as Record<BenchRole, HttpSession>;
  for (const role of BENCH_ROLES) sessions[role] = await signIn(server.url, users[role].username, users[role].password);

  log('[bench] EXPLAIN of every list query…');
  const explained = await runExplainCheck(db, sessions, samples, big);

  if (process.argv.includes('--explain-only')) {
    printExplain(explained);
    return explained.some((e) => e.fullScans.length > 0) ? 1 : 0;
  }

  log('[bench] load figures…');
  const figures: Figure[] = await loadFigures({
    baseUrl: server.url,
    sessions: { author: sessions.author, auditor: sessions.auditor },
    samples,
    bigRecipeId: big.recipeId,
    durationS,
    log,
  });
  await server.stop();
  server = null;
  log('[bench] chain verification (in-process)…');
  figures.push(...(await chainFigures(db, log)));
  figures.push(await freshComparisonFigure(db, big.recipeId));

  console.log('');
  printTable(figures);
  printExplain(explained);
  const scans = explained.filter((e) => e.fullScans.length > 0);
  const misses = figures.filter((f) => f.pass === false);

  writeResults(RESULTS_FILE, {
    machine: machineInfo(),
    run: { scale, durationS, seeded, dataset, bigRecipe: { recipeId: big.recipeId, textBytes: big.textBytes } },
    figures: figures.map((f) => ({ name: f.name, absolute: f.absolute, ratio: f.ratio, target: f.target, result: resultOf(f), ...f.values })),
    explain: explained.map((e) => ({ route: e.route, sql: e.sql, plan: e.plan, fullScans: e.fullScans, smallScans: e.smallScans })),
    summary: { misses: misses.map((f) => f.name), fullScans: scans.map((e) => `${e.route}: ${e.fullScans.join(', ')}`) },
  });
  log(`\n[bench] results written to ${path.relative(ROOT, RESULTS_FILE)}`);
  if (misses.length > 0) log(`[bench] ${misses.length} figure(s) missed: ${misses.map((f) => f.name).join('; ')} (reported, not a failure).`);
  if (scans.length > 0) {
    console.error(`\n[bench] FAILED: ${scans.length} list quer${scans.length === 1 ? 'y does' : 'ies do'} a full scan of a large table (see above).`);
    return 1;
  }
  return 0;
}

let code = 2;
try {
  code = await main();
} catch (err) {
  if (!interrupted) console.error(`\n[bench] the run failed: ${err instanceof Error ? (err.stack ?? err.message) : String(err)}`);
}
await cleanUp();
if (!interrupted) process.exit(code);
