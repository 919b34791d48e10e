/** Builds the Angular app (ng build, production) when the output is missing or older than its sources. */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { BIN, ROOT } from '../../../server/tools/project-files';

export const BROWSER_DIR = path.join(ROOT, 'dist/kerfbook/browser');

function newestMtime(entry: string): number {
  const stat = fs.statSync(entry);
  if (!stat.isDirectory()) return stat.mtimeMs;
  return fs.readdirSync(entry).reduce((max, name) => Math.max(max, newestMtime(path.join(entry, name))), stat.mtimeMs);
}

/** True when dist/ has no index.html or any source, angular.json or the lock file changed after it. */
export function buildIsStale(): boolean {
  const index = path.join(BROWSER_DIR, 'index.html');
  if (!fs.existsSync(index)) return true;
  const built = fs.statSync(index).mtimeMs;
  const sources = ['src', 'shared', 'angular.json', 'package-lock.json', 'tsconfig.json'].map((p) => path.join(ROOT, p));
  return sources.filter((p) => fs.existsSync(p)).some((p) => newestMtime(p) > built);
}

/** Runs `ng build` if needed (or always with force); throws when the build (or a budget) fails. */
export function ensureBuild(force: boolean): boolean {
  if (!force && !buildIsStale()) return false;
  console.log('[build] building the app (ng build, production budgets apply)…');
  const build = spawnSync(path.join(BIN, 'ng'), ['build'], { cwd: ROOT, stdio: 'inherit' });
  if (build.status !== 0) throw new Error('ng build failed (a budget in angular.json may be exceeded); see the messages above.');
  return true;
}
