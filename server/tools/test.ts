/**
 * `npm test`: a throw-away MariaDB (unless TEST_DATABASE_URL names a database that may be
 * wiped), then every suite — typecheck, lint and format, shared + server tests (mocha), Angular component
 * tests (ng test), end-to-end tests in Debian's chromium against the built app and the
 * real server. Ends with one line `N passed, N failed` that sums every suite.
 */
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { createDb } from '../data/db';
import { migrate } from '../data/migrate';
import { seedDemoIfEmpty } from './db-setup';
import { ensureAccounts, ensureDebianPackage, initDataDir, localMariadb, start, stop } from './local-mariadb';
import { startMailCatcher } from './mail-catcher';
import { BIN, DATA_DIR, ROOT } from './project-files';
import { type Counts, mochaCounts, vitestCounts } from './suite-counts';
import { freePort } from './free-port';

const env = process.env;
const results: { suite: string; counts: Counts }[] = [];

/** Runs a command, echoing its output, and returns what it printed and its exit code. */
function run(cmd: string, args: string[], extraEnv: NodeJS.ProcessEnv = {}): Promise<{ code: number; output: string }> {
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { cwd: ROOT, env: { ...env, ...extraEnv, FORCE_COLOR: '0' } });
    let output = '';
    const take = (chunk: Buffer, sink: NodeJS.WriteStream) => {
      output += chunk.toString();
      sink.write(chunk);
    };
    child.stdout.on('data', (c: Buffer) => take(c, process.stdout));
    child.stderr.on('data', (c: Buffer) => take(c, process.stderr));
    child.on('close', (code) => resolve({ code: code ?? 1, output }));
  });
}

/** Records a suite; a runner that crashed before reporting counts as one failure. */
function record(suite: string, counts: Counts | null, code: number): void {
  const c = counts ?? { passed: 0, failed: 0, skipped: 0 };
  if (code !== 0 && c.failed === 0) c.failed = 1;
  results.push({ suite, counts: c });
}

async function waitForHealth(url: string, ms: number): Promise<void> {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    try {
      if ((await fetch(`${url}/api/health`)).ok) return;
    } catch {
      /* not listening yet */
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`the e2e server did not answer at ${url}`);
}

async function main(): Promise<number> {
  ensureDebianPackage('chromium', 'chromium');

  // Databases: one for the server tests (tables reset per file), one for e2e (demo data).
  // Each has two accounts as on a real install: the owner (migrations; the tests' resets
  // need it, TRUNCATE being a DROP privilege) and the app's, which may only read and write rows.
  let testUrl = env['TEST_DATABASE_URL'];
  let e2eUrl = env['TEST_E2E_DATABASE_URL'];
  let testAppUrl = env['TEST_APP_DATABASE_URL'];
  let e2eAppUrl = env['TEST_E2E_APP_DATABASE_URL'];
  let local: ReturnType<typeof localMariadb> | null = null;
  if (!testUrl || !e2eUrl) {
    ensureDebianPackage('mariadbd', 'mariadb-server');
    local = localMariadb(path.join(DATA_DIR, `test-mariadb-${process.pid}`), await freePort());
    fs.rmSync(local.dir, { recursive: true, force: true });
    initDataDir(local);
    await start(local);
    ({ ownerUrl: testUrl, appUrl: testAppUrl } = ensureAccounts(local, 'kerfbook_test'));
    ({ ownerUrl: e2eUrl, appUrl: e2eAppUrl } = ensureAccounts(local, 'kerfbook_e2e'));
    console.log(`[test] throw-away MariaDB on 127.0.0.1:${local.port}`);
  }

  try {
    const typecheck = await run(path.join(BIN, 'tsc'), ['-p', 'server/tsconfig.json', '--noEmit']);
    record('typecheck (server, shared, tests)', { passed: typecheck.code === 0 ? 1 : 0, failed: 0, skipped: 0 }, typecheck.code);

    // Lint and format are checks like any other: a rule broken anywhere fails the run.
    const eslint = await run(path.join(BIN, 'eslint'), ['-c', '.config/eslint.config.js', '.']);
    record('lint (eslint)', { passed: eslint.code === 0 ? 1 : 0, failed: 0, skipped: 0 }, eslint.code);
    const prettier = await run(path.join(BIN, 'prettier'), ['--check', '.']);
    record('format (prettier --check)', { passed: prettier.code === 0 ? 1 : 0, failed: 0, skipped: 0 }, prettier.code);

    const serverEnv: NodeJS.ProcessEnv = { DATABASE_URL: testUrl, NODE_ENV: 'test', ...(testAppUrl ? { TEST_APP_DATABASE_URL: testAppUrl } : {}) };
    if (local) {
      // Lets the outage test stop and restart this throw-away MariaDB.
      serverEnv['KERFBOOK_TEST_MARIADB_DIR'] = local.dir;
      serverEnv['KERFBOOK_TEST_MARIADB_PORT'] = String(local.port);
    }
    const mocha = await run(path.join(BIN, 'mocha'), [], serverEnv);
    record('shared + server (mocha)', mochaCounts(mocha.output), mocha.code);

    const ngTest = await run(path.join(BIN, 'ng'), ['test', '--watch=false'], { CI: 'true' });
    record('client components (ng test)', vitestCounts(ngTest.output), ngTest.code);

    const build = await run(path.join(BIN, 'ng'), ['build']);
    if (build.code !== 0) {
      record('app build (ng build)', null, build.code);
    } else {
      try {
        record('e2e (chromium)', await runE2e(e2eUrl!, e2eAppUrl ?? e2eUrl!), 0);
      } catch (err) {
        console.error(`[test] e2e could not run: ${err instanceof Error ? err.message : String(err)}`);
        record('e2e (chromium)', null, 1);
      }
    }
  } finally {
    if (local) {
      await stop(local);
      fs.rmSync(local.dir, { recursive: true, force: true });
    }
  }

  console.log('\nSuites:');
  let passed = 0;
  let failed = 0;
  let skipped = 0;
  for (const { suite, counts } of results) {
    console.log(`  ${suite.padEnd(36)} ${counts.passed} passed, ${counts.failed} failed${counts.skipped ? `, ${counts.skipped} skipped` : ''}`);
    passed += counts.passed;
    failed += counts.failed;
    skipped += counts.skipped;
  }
  console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
  return failed === 0 && passed > 0 ? 0 : 1;
}

/**
 * Serves the built app from a real server process on the e2e database, on the app's account
 * (`appUrl`), and runs the browser tests; they get the owner's URL to set up their data.
 */
async function runE2e(databaseUrl: string, appUrl: string): Promise<Counts | null> {
  const db = createDb(databaseUrl);
  await migrate(db);
  await seedDemoIfEmpty(db);
  await db.destroy();

  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  // The local mail catcher stands in for a mail service; the browser tests read what it
  // caught from its folder (they run in another process) and follow the links.
  const mailDir = path.join(DATA_DIR, `test-mail-${process.pid}`);
  fs.rmSync(mailDir, { recursive: true, force: true });
  // The e2e approvals seal the trail: into a folder of this run, not the checkout's own seals.
  const sealDir = path.join(DATA_DIR, `test-seals-${process.pid}`);
  fs.rmSync(sealDir, { recursive: true, force: true });
  const catcher = await startMailCatcher(0, { dir: mailDir });
  console.log(`[test] mail catcher on smtp://127.0.0.1:${catcher.port}`);
  const server = spawn(path.join(BIN, 'tsx'), ['server/main.ts'], {
    cwd: ROOT,
    env: {
      ...env,
      DATABASE_URL: appUrl,
      PORT: String(port),
      HOST: '127.0.0.1',
      SESSION_SECRET: 'e2e-'.padEnd(48, 'x'),
      SMTP_URL: `smtp://127.0.0.1:${catcher.port}`,
      APP_BASE_URL: baseUrl,
      MAIL_INTERVAL_MS: '500',
      SEAL_DIR: sealDir,
    },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  try {
    await waitForHealth(baseUrl, 30_000);
    const e2e = await run(path.join(BIN, 'mocha'), ['--config', 'test/e2e/.mocharc.json'], {
      BASE_URL: baseUrl,
      E2E_DATABASE_URL: databaseUrl,
      E2E_APP_DATABASE_URL: appUrl,
      E2E_MAIL_DIR: mailDir,
    });
    const counts = mochaCounts(e2e.output);
    if (e2e.code !== 0 && counts && counts.failed === 0) counts.failed = 1;
    return counts ?? { passed: 0, failed: 1, skipped: 0 };
  } finally {
    if (server.exitCode === null) {
      server.kill('SIGTERM');
      await new Promise((r) => server.once('exit', r));
    }
    await catcher.stop();
    fs.rmSync(mailDir, { recursive: true, force: true });
    fs.rmSync(sealDir, { recursive: true, force: true });
  }
}

main().then(
  (code) => process.exit(code),
  (err: unknown) => {
    console.error(`\n[test] ${err instanceof Error ? err.stack : String(err)}`);
    console.log('0 passed, 1 failed');
    process.exit(1);
  },
);
