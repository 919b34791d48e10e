/**
 * The real app process of the soak: `tsx server/main.ts` in a process group of its own
 * (as test/api/deploy/app-processes.ts starts one), so that a SIGKILL takes tsx and the node
 * it runs together, like a crashed server. It can be started again on the same port.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { BIN, ROOT } from '../../server/tools/project-files';

const LISTENING = /Kerfbook is listening on (\S+)/;

export interface SoakApp {
  url: string;
  /** Starts the process (again) and waits until it listens. */
  start(): Promise<void>;
  /** Kills the whole process group with `signal` and waits for tsx to exit. */
  kill(signal: NodeJS.Signals): Promise<void>;
  /** Pid of the running tsx, or null. */
  pid(): number | null;
  /** The last lines it printed (for failure messages). */
  tail(): string;
}

/** Everything the app prints goes to `logFile` as well (kept after the run, for a failure's story). */
export function soakApp(port: number, env: NodeJS.ProcessEnv, logFile: string): SoakApp {
  let child: ChildProcess | null = null;
  fs.writeFileSync(logFile, '');
  let output = '';
  const url = `http://127.0.0.1:${port}`;

  const group = (signal: NodeJS.Signals) => {
    if (child?.pid === undefined) return;
    try {
      process.kill(-child.pid, signal);
    } catch {
      // Already gone.
    }
  };

  return {
    url,
    pid: () => (child && child.exitCode === null && child.signalCode === null ? (child.pid ?? null) : null),
    tail: () => output.split('\n').slice(-30).join('\n'),
    async start() {
      const started = spawn(path.join(BIN, 'tsx'), ['server/main.ts'], {
        cwd: ROOT,
        env: { ...process.env, ...env, PORT: String(port), HOST: '127.0.0.1' },
        detached: true,
        stdio: ['ignore', 'pipe', 'pipe'],
      });
      child = started;
      fs.appendFileSync(logFile, `--- started at ${new Date().toISOString()} ---\n`);
      let seen = '';
      const take = (c: Buffer) => {
        seen += c.toString('utf8');
        output = (output + c.toString('utf8')).slice(-20000);
        fs.appendFileSync(logFile, c);
      };
      started.stdout!.on('data', take);
      started.stderr!.on('data', take);
      await new Promise<void>((resolve, reject) => {
        const timer = setTimeout(() => reject(new Error(`the app did not listen within 60 s:\n${seen.slice(-2000)}`)), 60_000);
        started.stdout!.on('data', () => {
          if (LISTENING.test(seen)) {
            clearTimeout(timer);
            resolve();
          }
        });
        started.once('exit', (code) => {
          clearTimeout(timer);
          reject(new Error(`the app exited (${code}) before listening:\n${seen.slice(-2000)}`));
        });
      });
    },
    async kill(signal) {
      const c = child;
      if (!c || c.exitCode !== null || c.signalCode !== null) return;
      const exited = new Promise<void>((resolve) => c.once('exit', () => resolve()));
      group(signal);
      const force = setTimeout(() => group('SIGKILL'), 10_000);
      await exited;
      clearTimeout(force);
      // tsx may go first and leave its node child in the group.
      group('SIGKILL');
    },
  };
}
