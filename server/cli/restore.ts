/**
 * `npm run restore FILE`: replaces the Kerfbook database with a backup made by
 * `npm run backup`. Refuses, changing nothing, when the file is missing, not a Kerfbook
 * backup, damaged, from a newer schema, or while anything else is connected to the
 * database (stop the server first). The sequence is in backup/restore-backup.ts.
 */
import fs from 'node:fs';
import path from 'node:path';
import { RestoreRefusedError, restoreBackup } from './backup/restore-backup';
import { openTarget } from './backup/target';

async function main(): Promise<number> {
  const arg = process.argv[2];
  if (!arg) {
    console.error('Usage: npm run restore backups/<file>.tar.gz   (stop the Kerfbook server first)');
    return 2;
  }
  // npm runs scripts from the project folder; a path is meant from where the user typed it.
  const file = path.resolve(process.env['INIT_CWD'] ?? process.cwd(), arg);
  // Said before any MariaDB is started for nothing; restoreBackup checks it again.
  if (!fs.existsSync(file)) {
    console.error(`[restore] refused: There is no file ${file}.\n[restore] Nothing was changed.`);
    return 1;
  }
  const target = await openTarget(true);
  try {
    console.log(`[restore] restoring ${file} into ${target.description}…`);
    const started = Date.now();
    const result = await restoreBackup(target.databaseUrl, file, {
      ...(target.prepareScratch ? { prepareScratch: target.prepareScratch } : {}),
      ...(target.appDatabaseUrl ? { appDatabaseUrl: target.appDatabaseUrl } : {}),
      ...(target.regrant ? { regrant: target.regrant } : {}),
      log: (line) => console.log(`[restore] ${line}`),
    });
    if (result.migrationsRun.length) console.log(`[restore] the backup had an older schema; migrated it: ${result.migrationsRun.join(', ')}`);
    console.log(`[restore] done in ${Date.now() - started} ms: the database now holds the backup of ${result.manifest.createdAt}.`);
    return 0;
  } catch (err) {
    if (err instanceof RestoreRefusedError) {
      console.error(`[restore] refused: ${err.message}\n[restore] Nothing was changed.`);
      return 1;
    }
    throw err;
  } finally {
    await target.close();
  }
}

main().then(
  (code) => process.exit(code),
  (err: unknown) => {
    console.error(`[restore] failed: ${err instanceof Error ? err.message : String(err)}`);
    process.exit(2);
  },
);
