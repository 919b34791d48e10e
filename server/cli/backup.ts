/**
 * `npm run backup`: a consistent snapshot of the Kerfbook database (mariadb-dump, one
 * transaction, triggers and routines included; photos are rows, so they are in it) and a
 * manifest, as one .tar.gz in backups/. Prints the file's path. The app may keep running.
 */
import path from 'node:path';
import { makeBackup } from './backup/make-backup';
import { openTarget } from './backup/target';
import { ROOT } from '../tools/project-files';

async function main(): Promise<void> {
  const target = await openTarget(false);
  try {
    console.log(`[backup] backing up ${target.description}…`);
    const started = Date.now();
    const { file, manifest } = await makeBackup(target.databaseUrl);
    const rows = Object.values(manifest.rowCounts).reduce((a, b) => a + b, 0);
    console.log(
      `[backup] ${rows} rows in ${Object.keys(manifest.rowCounts).length} tables, ` +
        (manifest.trail
          ? `${manifest.trail.events} trail events (head #${manifest.trail.headEventId} ${manifest.trail.headHash.slice(0, 12)}…), `
          : 'no trail chain yet, ') +
        `${manifest.attachments.count} photos, ` +
        `schema ${manifest.schema.latestMigration}; ${Date.now() - started} ms`,
    );
    console.log(path.relative(ROOT, file));
  } finally {
    await target.close();
  }
}

main().catch((err: unknown) => {
  console.error(`[backup] failed: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
