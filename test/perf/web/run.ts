/**
 * `npm run bench:web`: the front end's budgets and Lighthouse scores.
 *
 * 1. builds the app when dist/ is missing or stale (ng build: angular.json's budgets apply);
 * 2. measures the initial JavaScript (what index.html loads eagerly), raw and gzipped;
 * 3. starts its own MariaDB with the demo data (or uses DATABASE_URL) and the real server
 *    (NODE_ENV=production);
 * 4. opens Debian's chromium, signs in as the demo person each screen needs and runs
 *    Lighthouse 12 (desktop configuration) on the sign-in, Today, Library, Recipe, Editor
 *    and Finder screens; mobile performance is measured too, for information.
 *
 * Prints a table and writes test/perf/web/results.json. Exit 0 when Lighthouse figures only
 * miss (MISS in the table), 1 when the initial JavaScript is over 250 kB gzipped, 2 when the
 * run failed.
 * Options: --no-mobile (desktop only), --rebuild (build even when dist/ looks current),
 * --runs=N (N desktop runs per screen, the median by performance is kept; default 3),
 * --only=Library,Editor (just those screens, while fixing one).
 */
import fs from 'node:fs';
import path from 'node:path';
import lighthousePackage from 'lighthouse/package.json' with { type: 'json' };
import { ensureBuild, BROWSER_DIR } from './app-build';
import { startAppServer, type AppServer } from './app-server';
import { launchBrowser, type BenchBrowser } from './browser';
import { demoDatabase, type DemoDatabase } from './database';
import { initialBudgetBytes, measureInitialJs } from './initial-js';
import { runLighthouse, type FormFactor, type LighthouseRun, type LighthouseScores } from './lighthouse-run';
import { machine, printTable, TARGETS, writeResults, type ScreenResult, type WebResults } from './report';
import { benchScreens } from './screens';
import { DATA_DIR, ROOT } from '../../../server/tools/project-files';

const args = process.argv.slice(2);
const withMobile = !args.includes('--no-mobile');
const only = args
  .find((a) => a.startsWith('--only='))
  ?.split('=')[1]
  ?.toLowerCase()
  .split(',');
// Three desktop runs by default: the scores move with whatever else the machine is doing.
const runs = Math.max(1, Number(args.find((a) => a.startsWith('--runs='))?.split('=')[1] ?? 3) || 3);
const RESULTS_FILE = path.join(ROOT, 'test/perf/web/results.json');
/** Lighthouse's full reports of the last run (git-ignored); open one in the Lighthouse viewer to see every audit. */
const REPORTS_DIR = path.join(DATA_DIR, 'bench-web');

let database: DemoDatabase | null = null;
let server: AppServer | null = null;
let browser: BenchBrowser | null = null;

async function cleanUp(): Promise<void> {
  await browser?.close().catch(() => undefined);
  await server?.stop().catch(() => undefined);
  await database?.stop().catch(() => undefined);
  browser = server = database = null;
}

/** Runs Lighthouse `count` times with a cold cache; keeps the median run and its full report. */
async function measure(screen: string, url: string, formFactor: FormFactor, count: number): Promise<LighthouseScores> {
  const results: LighthouseRun[] = [];
  for (let i = 0; i < count; i++) {
    await browser!.clearCache();
    results.push(await runLighthouse(url, browser!.port, formFactor, formFactor === 'desktop'));
  }
  results.sort((a, b) => a.scores.performance - b.scores.performance);
  const median = results[Math.floor((results.length - 1) / 2)]!;
  fs.mkdirSync(REPORTS_DIR, { recursive: true });
  fs.writeFileSync(path.join(REPORTS_DIR, `${screen.toLowerCase()}-${formFactor}.json`), JSON.stringify(median.lhr));
  return median.scores;
}

async function main(): Promise<void> {
  ensureBuild(args.includes('--rebuild'));
  const js = measureInitialJs(BROWSER_DIR);
  const gzipKb = js.gzipBytes / 1000;
  const budgetBytes = initialBudgetBytes(path.join(ROOT, 'angular.json'));
  const initialJs = {
    ...js,
    gzipKb: Number(gzipKb.toFixed(1)),
    rawPerGzip: Number((js.rawBytes / js.gzipBytes).toFixed(2)),
    // What angular.json's raw-byte budget would allow once gzipped, at this build's ratio.
    budget: budgetBytes ? { maximumErrorRawKb: budgetBytes / 1000, asGzipKb: Number((budgetBytes / (js.rawBytes / js.gzipBytes) / 1000).toFixed(1)) } : null,
    pass: gzipKb <= TARGETS.initialJsGzipKb,
  };
  console.log(`[js] initial JavaScript: ${(js.rawBytes / 1000).toFixed(1)} kB raw, ${gzipKb.toFixed(1)} kB gzipped in ${js.files.length} files`);

  database = await demoDatabase();
  server = await startAppServer(database.url);
  console.log(`[server] ${server.url} (NODE_ENV=production)`);
  browser = await launchBrowser();

  const screens: ScreenResult[] = [];
  let signedInAs: string | null = null;
  const chosen = benchScreens(database.approvedRecipeId).filter((s) => !only || only.includes(s.name.toLowerCase()));
  for (const screen of chosen) {
    const who = screen.person?.username ?? null;
    if (who !== signedInAs) {
      if (signedInAs) await browser.signOut();
      if (screen.person) await browser.signIn(server.url, screen.person);
      signedInAs = who;
    }
    const url = `${server.url}${screen.path}`;
    console.log(`[lighthouse] ${screen.name} (${screen.path}) as ${who ?? 'signed out'}…`);
    await browser.warmUp(url);
    const desktop = await measure(screen.name, url, 'desktop', runs);
    const mobile = withMobile ? await measure(screen.name, url, 'mobile', 1) : undefined;
    const pass = desktop.performance >= TARGETS.performance && (desktop.accessibility ?? 0) >= TARGETS.accessibility;
    screens.push({ screen: screen.name, path: screen.path, person: who ?? 'signed out', desktop, ...(mobile ? { mobile } : {}), pass });
  }
  await cleanUp();

  const results: WebResults = {
    measuredAt: new Date().toISOString(),
    machine: machine(),
    lighthouse: lighthousePackage.version,
    configuration: `desktop configuration (Lighthouse's desktop preset: 1350×940 screen, simulated 40 ms round trip and 10 Mbit/s, no CPU slow-down)${runs > 1 ? `, median of ${runs} runs` : ''}, cold HTTP cache, production build and server`,
    targets: TARGETS,
    initialJs,
    screens,
    pass: initialJs.pass && screens.every((s) => s.pass),
  };
  writeResults(RESULTS_FILE, results);
  printTable(results);
  console.log(`Written to ${path.relative(ROOT, RESULTS_FILE)}; Lighthouse's full reports in ${path.relative(ROOT, REPORTS_DIR)}/`);
  // As `npm run bench`: a Lighthouse figure that misses is a MISS in the table (scores move
  // with the machine's other work); an initial bundle over its limit fails the run.
  if (!initialJs.pass) process.exitCode = 1;
}

for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.once(signal, () => {
    console.log(`\n[stop] ${signal}: stopping the browser, the server and the database…`);
    void cleanUp().finally(() => process.exit(130));
  });
}

main().catch(async (err: unknown) => {
  console.error(`\n[bench:web] ${err instanceof Error ? err.message : String(err)}`);
  await cleanUp();
  process.exit(2);
});
