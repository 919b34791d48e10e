/** Starts app-process.ts (the app under test) as a child process and stops it again. */
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { BIN, ROOT } from '../../../server/tools/project-files';

export interface BenchServer {
  url: string;
  stop(): Promise<void>;
}

export async function startBenchServer(databaseUrl: string): Promise<BenchServer> {
  const child: ChildProcess = spawn(path.join(BIN, 'tsx'), [path.join(ROOT, 'test/perf/load/app-process.ts')], {
    cwd: ROOT,
    env: { ...process.env, BENCH_DATABASE_URL: databaseUrl },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  const url = await new Promise<string>((resolve, reject) => {
    let seen = '';
    const timer = setTimeout(() => reject(new Error('The bench server did not answer within 60 s.')), 60_000);
    child.stdout!.on('data', (chunk: Buffer) => {
      seen += chunk.toString();
      const m = /READY (\S+)/.exec(seen);
      if (m) {
        clearTimeout(timer);
        resolve(m[1]!);
      }
    });
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`The bench server stopped before it was ready (exit ${code}).`));
    });
  });
  // Anything it prints later (faults) goes to our stderr.
  child.stdout!.on('data', (chunk: Buffer) => process.stderr.write(`[app-process] ${chunk.toString()}`));
  return {
    url,
    stop: () =>
      new Promise<void>((resolve) => {
        if (child.exitCode !== null || child.signalCode !== null) return resolve();
        const force = setTimeout(() => child.kill('SIGKILL'), 10_000);
        child.once('exit', () => {
          clearTimeout(force);
          resolve();
        });
        child.kill('SIGTERM');
      }),
  };
}
