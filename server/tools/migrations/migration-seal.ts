import path from 'node:path';
import { folderProblems } from './migration-checks';
import { fileChecksum, readChecksums, writeChecksums } from './migration-folder';

/**
 * Lands the migrations not in the checksum list yet: appends each with the SHA-256 of its
 * bytes, in the order they run, and returns their names. Refuses (changing nothing) while
 * the folder has any other problem: a changed landed migration, a bad name or stamp, an
 * import from live code.
 */
export function sealMigrations(dir: string, now = new Date()): string[] {
  const problems = folderProblems(dir, now);
  const blocking = problems.filter((p) => p.rule !== 'unsealed');
  if (blocking.length) throw new Error(`Nothing sealed; first:\n${blocking.map((p) => `  - ${p.message}`).join('\n')}`);
  const sealed = problems.map((p) => p.file).sort();
  if (sealed.length) writeChecksums(dir, [...readChecksums(dir), ...sealed.map((f): [string, string] => [f, fileChecksum(path.join(dir, f))])]);
  return sealed;
}
