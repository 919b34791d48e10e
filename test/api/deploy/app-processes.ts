/**
 * Real app processes for the several-processes test: `tsx server/main.ts` with its own
 * environment, started in a process group of its own so that stopping it also ends the
 * node process tsx runs underneath.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { freePort } from '../../../server/tools/free-port';
export { freePort };

const ROOT = fileURLToPath(new URL('../../../', import.meta.url));
const TSX = path.join(ROOT, 'node_modules', '.bin', 'tsx');
/** main.ts prints this once it listens. */
const LISTENING = /Kerfbook is listening on (\S+)/;

export interface AppProcess {
  name: string;
  /** e.g. http://127.0.0.1:41234 */
  url: string;
  /** Everything the process printed so far (for failure messages). */
  output(): string;
  /** SIGTERM (a clean stop), then SIGKILL after `graceMs`. Safe to call twice. */
  stop(graceMs?: number): Promise<void>;
}

// Last resort when mocha exits without running `after` (e.g. killed by --exit mid-hook).
const running = new Set<ChildProcess>();
process.on('exit', () => {
  for (const child of running) killGroup(child, 'SIGKILL');
});

/** Signals the child's whole process group (tsx and the node it runs). */
function killGroup(child: ChildProcess, signal: NodeJS.Signals): void {
  if (child.pid === undefined) return;
  try {
    process.kill(-child.pid, signal);
  } catch {
    // Already gone.
  }
}

export async function startAppProcess(name: string, env: NodeJS.ProcessEnv, timeoutMs = 40000): Promise<AppProcess> {
  const child = spawn(TSX, ['server/main.ts'], { cwd: ROOT, env, detached: true, stdio: ['ignore', 'pipe', 'pipe'] });
  running.add(child);
  let output = '';
  child.stdout!.on('data', (c: Buffer) => (output += c.toString('utf8')));
  child.stderr!.on('data', (c: Buffer) => (output += c.toString('utf8')));
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  void exited.then(() => running.delete(child));

  const stop = async (graceMs = 8000) => {
    killGroup(child, 'SIGTERM');
    const timer = setTimeout(() => killGroup(child, 'SIGKILL'), graceMs);
    await exited;
    clearTimeout(timer);
    // The group may still hold tsx's node child when tsx itself went first (ESRCH when empty).
    killGroup(child, 'SIGKILL');
  };

  try {
    const url = await new Promise<string>((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error(`${name} did not start within ${timeoutMs} ms`)), timeoutMs);
      const onData = () => {
        const m = LISTENING.exec(output);
        if (!m) return;
        clearTimeout(timer);
        resolve(m[1]!);
      };
      child.stdout!.on('data', onData);
      void exited.then(() => {
        clearTimeout(timer);
        reject(new Error(`${name} exited before listening`));
      });
    });
    return { name, url, output: () => output, stop };
  } catch (err) {
    await stop(1000);
    throw new Error(`${(err as Error).message}:\n${output}`);
  }
}
