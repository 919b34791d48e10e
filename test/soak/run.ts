/**
 * `npm run test:soak [-- --users 200 --seconds 120 --think-ms 2000 --no-faults]`: the load
 * and fault run, too long for `npm test`. A throw-away MariaDB in .data/soak-mariadb, the
 * demo seeds plus the soak's people, the real app process (`server/main.ts`) and a local
 * mail catcher; then every person works in a loop over loopback while the faults come one
 * after another: the mail service goes away for a while, MariaDB is killed and started
 * again, the app is SIGKILLed in the middle of an approval and started again. Afterwards
 * every 2xx write is looked up in MariaDB, the database is checked for half-done
 * transitions and the trail chain is verified. Ends with `N passed, N failed`; exit code 0
 * only when every check holds. Everything it started is stopped on exit, Ctrl-C included.
 */
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import type { Knex } from 'knex';
import { createDb } from '../../server/data/db';
import { migrate } from '../../server/data/migrate';
import { seedDemoIfEmpty } from '../../server/tools/db-setup';
import { ensureAccounts, ensureDebianPackage, initDataDir, isRunning, localMariadb, start, stop, type LocalMariadb } from '../../server/tools/local-mariadb';
import { DATA_DIR } from '../../server/tools/project-files';
import { CheckList, checkAnswers, checkConsistency, checkFaults, checkLedger, checkMail, waitForOutbox } from './checks';
import { appCrash, databaseOutage, mailOutage, MailService, type FaultLog } from './faults';
import { soakApp, type SoakApp } from './app';
import { SoakClient, type RequestRecord } from './client';
import { createSoakLab } from './people';
import { printSummary } from './summary';
import { emptyLedger, runPerson, type WorkloadContext } from './workload';
import { freePort } from '../../server/tools/free-port';

interface Options {
  users: number;
  seconds: number;
  thinkMs: number;
  faults: boolean;
}

function readOptions(argv: string[]): Options {
  const options: Options = { users: 200, seconds: 120, thinkMs: 2000, faults: true };
  for (let i = 0; i < argv.length; i++) {
    const flag = argv[i]!;
    const number = (min: number) => {
      const n = Number(argv[++i]);
      if (!Number.isInteger(n) || n < min) throw new Error(`${flag} needs a whole number of at least ${min}.`);
      return n;
    };
    if (flag === '--users') options.users = number(4);
    else if (flag === '--seconds') options.seconds = number(10);
    else if (flag === '--think-ms') options.thinkMs = number(0);
    else if (flag === '--no-faults') options.faults = false;
    else throw new Error(`Unknown option ${flag}. Use --users N --seconds S [--think-ms MS] [--no-faults].`);
  }
  return options;
}

/** The app's output of the last run (kept: the story behind a failed check). */
const APP_LOG = path.join(DATA_DIR, 'soak-app.log');
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

// What to stop on the way out, whichever way out it is.
let mariadb: LocalMariadb | null = null;
let app: SoakApp | null = null;
let mail: MailService | null = null;
let db: Knex | null = null;
let cleaning: Promise<void> | null = null;

function cleanUp(): Promise<void> {
  cleaning ??= (async () => {
    await app?.kill('SIGTERM').catch(() => undefined);
    await mail?.stop().catch(() => undefined);
    await db?.destroy().catch(() => undefined);
    if (mariadb) {
      if (isRunning(mariadb)) await stop(mariadb);
      fs.rmSync(mariadb.dir, { recursive: true, force: true });
    }
  })();
  return cleaning;
}

for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.once(signal, () => {
    console.error(`\n[soak] ${signal}: stopping everything it started…`);
    void cleanUp().finally(() => process.exit(130));
  });
}

async function main(): Promise<number> {
  const options = readOptions(process.argv.slice(2));
  ensureDebianPackage('mariadbd', 'mariadb-server');

  mariadb = localMariadb(path.join(DATA_DIR, 'soak-mariadb'), await freePort());
  fs.rmSync(mariadb.dir, { recursive: true, force: true });
  initDataDir(mariadb);
  await start(mariadb);
  // As `npm start` does: the owner account migrates and seeds (and checks afterwards), the app runs on its rows-only account.
  const { ownerUrl: databaseUrl, appUrl } = ensureAccounts(mariadb, 'kerfbook_soak');
  console.log(`[soak] throw-away MariaDB on 127.0.0.1:${mariadb.port}`);

  db = createDb(databaseUrl);
  await migrate(db);
  await seedDemoIfEmpty(db);
  const lab = await createSoakLab(db, options.users);
  const roles = lab.people.reduce<Record<string, number>>((acc, p) => ({ ...acc, [p.role]: (acc[p.role] ?? 0) + 1 }), {});
  console.log(
    `[soak] demo seeds + ${lab.people.length} people (${Object.entries(roles)
      .map(([r, n]) => `${n} ${r}s`)
      .join(', ')})`,
  );

  mail = new MailService();
  await mail.start();
  app = soakApp(
    await freePort(),
    {
      NODE_ENV: 'test',
      DATABASE_URL: appUrl,
      SESSION_SECRET: randomBytes(32).toString('base64url'),
      SMTP_URL: `smtp://127.0.0.1:${mail.port}`,
      APP_BASE_URL: 'http://127.0.0.1',
      KERFBOOK_DIST: '/nonexistent/kerfbook-dist',
      MAIL_INTERVAL_MS: '1000',
    },
    APP_LOG,
  );
  await app.start();
  console.log(`[soak] app ${app.url}, mail catcher on smtp://127.0.0.1:${mail.port}`);
  console.log(`[soak] ${options.users} people for ${options.seconds} s${options.faults ? ', with faults' : ''}…`);

  const records: RequestRecord[] = [];
  const t0 = Date.now();
  const clock = () => Date.now() - t0;
  const ctx: WorkloadContext = {
    lab,
    baseUrl: () => app!.url,
    clock,
    endMs: options.seconds * 1000,
    thinkMs: options.thinkMs,
    ledger: emptyLedger(),
    record: (r) => records.push(r),
    approvesInFlight: { n: 0 },
  };

  const faults: FaultLog = {};
  const faultScript = async () => {
    const S = options.seconds * 1000;
    const at = async (fraction: number) => sleep(Math.max(0, fraction * S - clock()));
    const probe = new SoakClient(
      () => app!.url,
      (r) => records.push(r),
      clock,
    );
    const auditor = lab.people.find((p) => p.role === 'auditor')!;
    if (!(await probe.signIn(auditor.username, auditor.password))) throw new Error('the fault probe could not sign in');
    await at(0.2);
    console.log(`[soak] ${(clock() / 1000).toFixed(1)} s: mail service down`);
    faults.mail = await mailOutage(mail!, clock, Math.max(3, Math.round(options.seconds * 0.2)));
    console.log(`[soak] ${(clock() / 1000).toFixed(1)} s: mail service back`);
    // The app crash first, so that the database outage happens in the restarted process:
    // outbox rows still held at the end then say by their claim time which fault left them.
    await at(0.5);
    faults.app = await appCrash(app!, ctx.approvesInFlight, clock);
    console.log(
      `[soak] ${(faults.app.killMs / 1000).toFixed(1)} s: app SIGKILLed (${faults.app.approvesInFlight} approvals on their way); listening again at ${(faults.app.upMs / 1000).toFixed(1)} s`,
    );
    await at(0.7);
    console.log(`[soak] ${(clock() / 1000).toFixed(1)} s: MariaDB killed`);
    faults.database = await databaseOutage(mariadb!, app!, probe, clock, Math.max(3, Math.round(options.seconds * 0.08)));
    console.log(
      `[soak] ${(faults.database.upMs / 1000).toFixed(1)} s: MariaDB back; app answering again at ${((faults.database.recoveredMs ?? NaN) / 1000).toFixed(1)} s`,
    );
  };

  const [people, script] = await Promise.allSettled([
    Promise.all(lab.people.map((p) => runPerson(p, ctx))),
    options.faults ? faultScript() : Promise.resolve(),
  ]);
  if (people.status === 'rejected') throw people.reason;
  if (script.status === 'rejected') throw script.reason;
  const seconds = Math.round(clock() / 100) / 10;
  console.log(`[soak] load over after ${seconds} s; waiting for the outbox to empty…`);
  await waitForOutbox(db, faults, t0, 180_000);
  await app.kill('SIGTERM');

  const calm = (r: RequestRecord) =>
    !(faults.app && r.startMs <= faults.app.upMs + 5000 && r.endMs >= faults.app.killMs) &&
    !(faults.database && r.startMs <= (faults.database.recoveredMs ?? Infinity) + 5000 && r.endMs >= faults.database.downMs);
  printSummary(records, seconds, calm);
  const l = ctx.ledger;
  console.log(
    `2xx writes: ${l.created.length} drafts created, ${l.saved.length} saves, ${l.submitted.length} submits, ${l.approved.length} approvals, ` +
      `${l.returned.length} returns, ${l.acknowledged.length} acknowledgements, ${l.printed.length} sheets, ${l.cuts.length} cuts`,
  );
  if (faults.database) {
    const d = faults.database;
    const users503 = records.filter((r) => r.kind !== 'fault-probe' && r.status === 503).length;
    console.log(
      `Database outage: ${((d.upMs - d.downMs) / 1000).toFixed(1)} s down, ${users503} answers 503 to people and ${d.probes.length} to probes, ` +
        `recovered ${d.recoveredMs === null ? 'never' : `${d.recoveredMs - d.upMs} ms`} after MariaDB answered`,
    );
  }
  if (faults.app)
    console.log(
      `App crash: down ${((faults.app.upMs - faults.app.killMs) / 1000).toFixed(1)} s, ${records.filter((r) => r.status === 0 && r.code === 'NETWORK').length} requests without an answer`,
    );
  if (faults.mail) console.log(`Mail outage: ${((faults.mail.upMs - faults.mail.downMs) / 1000).toFixed(1)} s`);

  console.log('\nChecks:');
  const list = new CheckList();
  checkAnswers(list, records, faults);
  await checkLedger(list, db, ctx.ledger);
  await checkConsistency(list, db);
  checkFaults(list, faults, records);
  await checkMail(list, db, faults, t0, mail.messages());
  console.log(`${list.passed} passed, ${list.failed} failed`);
  return list.failed === 0 && list.passed > 0 ? 0 : 1;
}

main()
  .catch((err: unknown) => {
    console.error(`\n[soak] ${err instanceof Error ? err.stack : String(err)}`);
    if (app) console.error(`[soak] the app's last lines:\n${app.tail()}`);
    console.log('0 passed, 1 failed');
    return 1;
  })
  .then(async (code) => {
    await cleanUp();
    process.exit(code);
  });
