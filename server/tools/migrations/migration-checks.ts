/**
 * What makes the migrations folder wrong, rule by rule. Each check returns the problems it
 * finds, each naming the file and what to do; the folder test expects none, and
 * `npm run db:seal-migrations` seals only a folder whose sole problem is unsealed files.
 */
import fs from 'node:fs';
import path from 'node:path';
import ts from 'typescript';
import {
  CHECKSUMS_FILE,
  MIGRATION_FILE,
  NEW_COMMAND,
  OTHER_FILES,
  SEAL_COMMAND,
  fileChecksum,
  migrationFiles,
  readChecksums,
  stampOf,
  stampTime,
} from './migration-folder';

export type Rule = 'name' | 'order' | 'future' | 'import' | 'changed' | 'gone' | 'unsealed';

export interface Problem {
  rule: Rule;
  file: string;
  message: string;
}

/** Folders of live code a migration may not import: it would change under a landed migration. */
export const LIVE_CODE = ['server', 'src', 'test', 'seeds'];

/** File names: stamp and lower snake_case words, a stamp that names a real moment, nothing Knex would skip. */
export function nameProblems(dir: string): Problem[] {
  const out: Problem[] = [];
  for (const file of migrationFiles(dir)) {
    const m = MIGRATION_FILE.exec(file);
    if (!m) {
      out.push({ rule: 'name', file, message: `${file} is not named <YYYYMMDDHHMMSS>_<lower_snake_words>.ts. Make migrations with ${NEW_COMMAND}.` });
    } else if (!stampTime(m[1]!)) {
      out.push({ rule: 'name', file, message: `${file}: ${m[1]} is not a moment (YYYYMMDDHHMMSS in UTC).` });
    }
  }
  for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
    if (e.name.endsWith('.ts') || OTHER_FILES.includes(e.name)) continue;
    out.push({ rule: 'name', file: e.name, message: `${e.name}: Knex loads only .ts files from the migrations folder; this one would never run.` });
  }
  return out;
}

/**
 * Stamps strictly increase in the order the checksum list records the landed migrations,
 * and a migration not landed yet is stamped after every landed one: Knex runs them by name,
 * so an earlier stamp would run before migrations it was written after.
 */
export function orderProblems(dir: string): Problem[] {
  const out: Problem[] = [];
  const listed = readChecksums(dir).map(([name]) => name);
  let previous: string | null = null;
  for (const name of listed) {
    const stamp = stampOf(name);
    if (stamp === null) continue;
    if (previous !== null && stamp <= stampOf(previous)!) {
      out.push({ rule: 'order', file: name, message: `${name} is listed after ${previous} in ${CHECKSUMS_FILE} but its stamp is not later.` });
    }
    previous = name;
  }
  const newestListed = previous === null ? null : stampOf(previous);
  const unlisted = migrationFiles(dir).filter((f) => !listed.includes(f) && stampOf(f) !== null);
  let before: string | null = null;
  for (const file of unlisted) {
    if (newestListed !== null && stampOf(file)! <= newestListed) {
      out.push({
        rule: 'order',
        file,
        message: `${file} is stamped before ${previous}, which has landed: it would run before migrations written ahead of it. Make it anew with ${NEW_COMMAND} and move its body there.`,
      });
    } else if (before !== null && stampOf(file) === stampOf(before)) {
      out.push({ rule: 'order', file, message: `${file} has the same stamp as ${before}.` });
    }
    before = file;
  }
  return out;
}

/** No stamp after `now`: a stamp is the moment the migration was written. */
export function futureProblems(dir: string, now: Date): Problem[] {
  const out: Problem[] = [];
  for (const file of migrationFiles(dir)) {
    const stamp = stampOf(file);
    const time = stamp === null ? null : stampTime(stamp);
    if (time && time.getTime() > now.getTime()) {
      out.push({ rule: 'future', file, message: `${file} is stamped in the future (${time.toISOString()}); stamps are the moment a migration was written.` });
    }
  }
  return out;
}

/** Every module a file names: import and export … from, import(), require(), including type-only imports. */
export function importSpecifiers(source: string): string[] {
  return ts.preProcessFile(source, true, true).importedFiles.map((f) => f.fileName);
}

/**
 * No import from live code (`server/`, `src/`, `test/`, `seeds/`): a landed migration must
 * do tomorrow what it did when it landed, so what it needs is copied into it.
 */
export function importProblems(dir: string): Problem[] {
  const root = path.dirname(path.resolve(dir));
  const out: Problem[] = [];
  for (const file of migrationFiles(dir)) {
    for (const spec of importSpecifiers(fs.readFileSync(path.join(dir, file), 'utf8'))) {
      if (!spec.startsWith('.') && !path.isAbsolute(spec)) continue;
      const top = path.relative(root, path.resolve(dir, spec)).split(path.sep)[0]!;
      if (LIVE_CODE.includes(top)) {
        out.push({ rule: 'import', file, message: `${file} imports ${spec} (${top}/): copy what it needs into the migration instead.` });
      }
    }
  }
  return out;
}

/** Landed migrations are there, byte for byte; every migration file has landed. */
export function checksumProblems(dir: string): Problem[] {
  const out: Problem[] = [];
  const files = migrationFiles(dir);
  const listed = readChecksums(dir);
  for (const [name, sha256] of listed) {
    if (!files.includes(name)) {
      out.push({ rule: 'gone', file: name, message: `${name} has landed (${CHECKSUMS_FILE}) but its file is gone: a landed migration is never renamed or removed.` });
    } else if (fileChecksum(path.join(dir, name)) !== sha256) {
      out.push({
        rule: 'changed',
        file: name,
        message: `${name} changed after it landed: put it back as it was and make the change a new migration (${NEW_COMMAND}).`,
      });
    }
  }
  const landed = new Set(listed.map(([name]) => name));
  for (const file of files.filter((f) => !landed.has(f))) {
    out.push({ rule: 'unsealed', file, message: `${file} has not landed: when it is final, run ${SEAL_COMMAND} and commit migrations/${CHECKSUMS_FILE} with it.` });
  }
  return out;
}

export function folderProblems(dir: string, now = new Date()): Problem[] {
  return [...nameProblems(dir), ...orderProblems(dir), ...futureProblems(dir, now), ...importProblems(dir), ...checksumProblems(dir)];
}
