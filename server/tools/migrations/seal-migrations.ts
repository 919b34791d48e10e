/**
 * `npm run db:seal-migrations [-- --dir <folder>]`: lands the migrations written since the
 * last seal by recording their SHA-256 in migrations/checksums.json; from then on the
 * folder test fails if one of them changes. Run it when a migration is final, and commit
 * the list with it.
 */
import path from 'node:path';
import { parseArgs } from 'node:util';
import { MIGRATIONS_DIR } from '../../data/db';
import { CHECKSUMS_FILE } from './migration-folder';
import { sealMigrations } from './migration-seal';

try {
  const { values } = parseArgs({ options: { dir: { type: 'string' } } });
  const dir = path.resolve(values.dir ?? MIGRATIONS_DIR);
  const sealed = sealMigrations(dir);
  const list = path.join(dir, CHECKSUMS_FILE);
  const shown = path.relative(process.cwd(), list);
  console.log(sealed.length ? `Sealed in ${shown.startsWith('..') ? list : shown}:\n${sealed.map((f) => `  ${f}`).join('\n')}` : 'Every migration has landed already.');
} catch (err) {
  console.error(err instanceof Error ? err.message : String(err));
  process.exitCode = 1;
}
