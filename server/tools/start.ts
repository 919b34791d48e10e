/**
 * `npm start`: local MariaDB (unless DATABASE_URL is given) with its two accounts,
 * migrations as the owner account, demo data on an empty database, Angular build, a local mail catcher (unless SMTP_URL is given), then the
 * server on the app's account. Ctrl-C stops the server, the catcher and the MariaDB this script started.
 */
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { readConfig } from '../config';
import { createDb } from '../data/db';
import { schemaChangeWarning } from '../data/database-accounts';
import { startJobs } from '../jobs';
import { serve } from '../serve';
import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { migrate } from '../data/migrate';
import { seedDemoIfEmpty } from './db-setup';
import { ensureAccounts, ensureDebianPackage, initDataDir, isRunning, localMariadb, start, stop } from './local-mariadb';
import { MAIL_DIR, startMailCatcher, type MailCatcher } from './mail-catcher';
import { BIN, DATA_DIR, ROOT, persistentSecret } from './project-files';

const env = process.env;
let stopDatabase: (() => Promise<void>) | null = null;

async function main(): Promise<void> {
  // The app's account (rows only) and the owner account that runs the migrations.
  let databaseUrl = env['DATABASE_URL'];
  let migrationUrl = env['MIGRATION_DATABASE_URL'];
  if (databaseUrl) {
    console.log(`[db] using DATABASE_URL${migrationUrl ? ' (migrations: MIGRATION_DATABASE_URL)' : ''}; nothing is installed or started.`);
    migrationUrl ||= databaseUrl;
  } else {
    if (migrationUrl) console.warn('[db] MIGRATION_DATABASE_URL is ignored without DATABASE_URL: the local MariaDB has its own two accounts.');
    ensureDebianPackage('mariadbd', 'mariadb-server');
    const local = localMariadb(path.join(DATA_DIR, 'mariadb'), Number(env['KERFBOOK_DB_PORT'] ?? 33306));
    const created = initDataDir(local);
    const wasRunning = isRunning(local);
    await start(local);
    if (!wasRunning) stopDatabase = () => stop(local);
    ({ appUrl: databaseUrl, ownerUrl: migrationUrl } = ensureAccounts(local, 'kerfbook'));
    console.log(`[db] MariaDB on 127.0.0.1:${local.port}, data in ${path.relative(ROOT, local.dir)}/${created ? ' (new)' : ''}`);
  }

  let smtpUrl = env['SMTP_URL'];
  let catcher: MailCatcher | null = null;
  if (smtpUrl) {
    console.log('[mail] sending through SMTP_URL.');
  } else {
    catcher = await startMailCatcher(2525).catch(() => startMailCatcher(0));
    smtpUrl = `smtp://127.0.0.1:${catcher.port}`;
    console.log(`[mail] local catcher on ${smtpUrl}; mail lands in ${path.relative(ROOT, MAIL_DIR)}/ (nothing leaves this machine)`);
  }

  const config = readConfig({
    ...env,
    DATABASE_URL: databaseUrl,
    MIGRATION_DATABASE_URL: migrationUrl,
    SMTP_URL: smtpUrl,
    SESSION_SECRET: env['SESSION_SECRET'] ?? persistentSecret('session-secret'),
  });
  const owner = createDb(config.migrationDatabaseUrl ?? config.databaseUrl);
  try {
    const ran = await migrate(owner);
    console.log(`[db] migrations: ${ran.length ? ran.join(', ') : 'up to date'}`);
    const seeded = env['KERFBOOK_DEMO'] === '0' ? false : await seedDemoIfEmpty(owner);
    if (seeded) console.log('[db] demo data loaded');
  } finally {
    await owner.destroy();
  }
  const db = createDb(config.databaseUrl);
  const accountWarning = await schemaChangeWarning(db);
  if (accountWarning) console.warn(`[db] Warning: ${accountWarning}`);

  if (env['KERFBOOK_SKIP_BUILD'] !== '1') {
    console.log('[build] building the app (ng build)…');
    const build = spawnSync(path.join(BIN, 'ng'), ['build'], { cwd: ROOT, stdio: 'inherit' });
    if (build.status !== 0) throw new Error('ng build failed; see the messages above.');
  }

  const server = await serve(config, db);
  const jobs = startJobs({ db, config });
  const shutdown = async (signal: string) => {
    console.log(`\n[stop] ${signal}: stopping the server${catcher ? ', the mail catcher' : ''}${stopDatabase ? ' and MariaDB' : ''}…`);
    jobs.stop();
    await server.close().catch(() => undefined);
    if (catcher) await catcher.stop().catch(() => undefined);
    await db.destroy().catch(() => undefined);
    if (stopDatabase) await stopDatabase();
    process.exit(0);
  };
  process.once('SIGINT', () => void shutdown('SIGINT'));
  process.once('SIGTERM', () => void shutdown('SIGTERM'));

  console.log(`\nKerfbook is running at ${server.url}\n`);
  console.log('Demo accounts (for the demo only — change or deactivate them on a real install):');
  for (const a of DEMO_ACCOUNTS) {
    console.log(`  ${a.roles.join(' + ').padEnd(18)} ${a.username.padEnd(16)} ${a.password}`);
  }
  console.log('\nPress Ctrl-C to stop.');
}

main().catch(async (err: unknown) => {
  console.error(`\n[start] ${err instanceof Error ? err.message : String(err)}`);
  if (stopDatabase) await stopDatabase();
  process.exit(1);
});
