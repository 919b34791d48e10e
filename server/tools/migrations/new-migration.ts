/**
 * `npm run db:new-migration -- <name> [--dir <folder>]`: writes
 * `migrations/<YYYYMMDDHHMMSS>_<name>.ts` (now in UTC, or one second after the newest
 * migration when that is later) with an up/down skeleton, and prints its path.
 */
import path from 'node:path';
import { parseArgs } from 'node:util';
import { MIGRATIONS_DIR } from '../../data/db';
import { createMigration } from './migration-folder';

try {
  const { values, positionals } = parseArgs({ options: { dir: { type: 'string' } }, allowPositionals: true });
  if (positionals.length !== 1) throw new Error('Usage: npm run db:new-migration -- <lower_snake_case_name> [--dir <folder>]');
  const file = createMigration(positionals[0]!, path.resolve(values.dir ?? MIGRATIONS_DIR));
  const shown = path.relative(process.cwd(), file);
  console.log(shown.startsWith('..') ? file : shown);
} catch (err) {
  console.error(err instanceof Error ? err.message : String(err));
  process.exitCode = 1;
}
