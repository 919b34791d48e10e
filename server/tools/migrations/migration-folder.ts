/**
 * The rules of the migrations folder, shared by `npm run db:new-migration`,
 * `npm run db:seal-migrations` and the test that guards the folder
 * (test/unit/migrations/migration-folder.spec.ts). See migrations/README.md.
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

/** `<YYYYMMDDHHMMSS in UTC>_<lower_snake_words>.ts`: the stamp orders them, Knex runs them by name. */
export const MIGRATION_FILE = /^(\d{14})_([a-z][a-z0-9]*(?:_[a-z0-9]+)*)\.ts$/;
export const MIGRATION_NAME = /^[a-z][a-z0-9]*(?:_[a-z0-9]+)*$/;
/** Landed migrations, in the order they run: file name → SHA-256 of its bytes. Knex loads only `.ts`. */
export const CHECKSUMS_FILE = 'checksums.json';
/** Files of the folder that are not migrations. */
export const OTHER_FILES = [CHECKSUMS_FILE, 'README.md', '.gitattributes'];

export const NEW_COMMAND = 'npm run db:new-migration -- <name>';
export const SEAL_COMMAND = 'npm run db:seal-migrations';

export function formatStamp(time: Date): string {
  return time.toISOString().slice(0, 19).replace(/[-:T]/g, '');
}

/** The moment a stamp names, or null when it names none (month 13, 31 November…). */
export function stampTime(stamp: string): Date | null {
  const m = /^(\d{4})(\d{2})(\d{2})(\d{2})(\d{2})(\d{2})$/.exec(stamp);
  if (!m) return null;
  const [y, mo, d, h, mi, s] = m.slice(1).map(Number) as [number, number, number, number, number, number];
  const time = new Date(Date.UTC(y, mo - 1, d, h, mi, s));
  return formatStamp(time) === stamp ? time : null;
}

/** The stamp of a migration file name (its first 14 digits), or null. */
export function stampOf(file: string): string | null {
  return /^(\d{14})_/.exec(file)?.[1] ?? null;
}

/** The `.ts` files of the folder: everything Knex would run, in the order it runs them. */
export function migrationFiles(dir: string): string[] {
  return fs
    .readdirSync(dir, { withFileTypes: true })
    .filter((e) => e.isFile() && e.name.endsWith('.ts'))
    .map((e) => e.name)
    .sort();
}

export function fileChecksum(file: string): string {
  return createHash('sha256').update(fs.readFileSync(file)).digest('hex');
}

/** The checksum list in its recorded order; empty when the folder has none yet. */
export function readChecksums(dir: string): [name: string, sha256: string][] {
  const file = path.join(dir, CHECKSUMS_FILE);
  if (!fs.existsSync(file)) return [];
  const parsed = JSON.parse(fs.readFileSync(file, 'utf8')) as unknown;
  if (parsed === null || typeof parsed !== 'object' || Array.isArray(parsed)) throw new Error(`${file} is not an object of file name → SHA-256.`);
  return Object.entries(parsed as Record<string, unknown>).map(([name, sha]) => [name, String(sha)]);
}

export function writeChecksums(dir: string, entries: [string, string][]): void {
  fs.writeFileSync(path.join(dir, CHECKSUMS_FILE), `${JSON.stringify(Object.fromEntries(entries), null, 2)}\n`);
}

/** The stamp of a new migration: now, or one second after the newest stamp in the folder when that is later. */
export function nextStamp(dir: string, now: Date): string {
  const stamps = fs.existsSync(dir) ? fs.readdirSync(dir).map(stampOf).filter((s): s is string => s !== null) : [];
  const newest = stamps.sort().at(-1);
  const nowStamp = formatStamp(now);
  if (!newest || newest < nowStamp) return nowStamp;
  const newestTime = stampTime(newest);
  if (!newestTime) throw new Error(`The newest migration in ${dir} has no valid stamp (${newest}).`);
  return formatStamp(new Date(newestTime.getTime() + 1000));
}

/** Its body throws: an empty migration run by mistake would otherwise be recorded as done. */
function skeleton(file: string): string {
  return `import type { Knex } from 'knex';

/**
 * What this migration changes, and why. Schema changes (DDL) and data changes go in
 * separate migrations; a data migration can run twice without harm.
 */
export async function up(knex: Knex): Promise<void> {
  throw new Error('${file}: up() is not written yet.');
}

export async function down(knex: Knex): Promise<void> {
  throw new Error('${file}: down() is not written yet.');
}
`;
}

/** Writes `<stamp>_<name>.ts` with an up/down skeleton into `dir`; returns its path. */
export function createMigration(name: string, dir: string, now = new Date()): string {
  if (!MIGRATION_NAME.test(name)) {
    throw new Error(`"${name}" is not a migration name: lower-case words joined by underscores, starting with a letter (e.g. add_wheel_lot_numbers).`);
  }
  const file = `${nextStamp(dir, now)}_${name}.ts`;
  const target = path.join(dir, file);
  fs.writeFileSync(target, skeleton(file), { flag: 'wx' });
  return target;
}
