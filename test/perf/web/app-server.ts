/**
 * The real server as a lab runs it: `tsx server/main.ts` in its own process with
 * NODE_ENV=production, a throw-away session secret and no mail (no SMTP_URL), serving the
 * built app from dist/.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import path from 'node:path';
import { BIN, ROOT } from '../../../server/tools/project-files';
import { freePort } from '../../../server/tools/free-port';

export interface AppServer {
  url: string;
  stop(): Promise<void>;
}

export async function startAppServer(databaseUrl: string): Promise<AppServer> {
  const port = await freePort();
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: 'production',
    DATABASE_URL: databaseUrl,
    SESSION_SECRET: randomBytes(32).toString('base64url'),
    HOST: '127.0.0.1',
    PORT: String(port),
  };
  delete env['SMTP_URL'];
  const child = spawn(path.join(BIN, 'tsx'), ['server/main.ts'], { cwd: ROOT, env, stdio: ['ignore', 'pipe', 'pipe'] });
  let output = '';
  child.stdout?.on('data', (d: Buffer) => (output += d.toString()));
  child.stderr?.on('data', (d: Buffer) => (output += d.toString()));
  await waitUntilListening(child, () => output);
  return { url: `http://127.0.0.1:${port}`, stop: () => stopChild(child) };
}

async function waitUntilListening(child: ChildProcess, output: () => string): Promise<void> {
  for (let i = 0; i < 600; i++) {
    if (/listening on/i.test(output())) return;
    if (child.exitCode !== null) break;
    await new Promise((r) => setTimeout(r, 100));
  }
  child.kill('SIGKILL');
  throw new Error(`The server did not start. Its output:\n${output().split('\n').slice(-20).join('\n')}`);
}

function stopChild(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    const force = setTimeout(() => child.kill('SIGKILL'), 8000);
    child.once('exit', () => {
      clearTimeout(force);
      resolve();
    });
    child.kill('SIGTERM');
  });
}
