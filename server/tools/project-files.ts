/** Paths and small files of the project's own local state (all inside the git-ignored `.data/`). */
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

export const ROOT = path.resolve(import.meta.dirname, '../..');
export const DATA_DIR = path.join(ROOT, '.data');
export const BIN = path.join(ROOT, 'node_modules/.bin');

/** A secret made once and kept in `.data/` so sessions survive a restart. */
export function persistentSecret(name: string): string {
  const file = path.join(DATA_DIR, name);
  if (!fs.existsSync(file)) {
    fs.mkdirSync(DATA_DIR, { recursive: true });
    fs.writeFileSync(file, randomBytes(32).toString('base64url'), { mode: 0o600 });
  }
  return fs.readFileSync(file, 'utf8').trim();
}
