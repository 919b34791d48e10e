/**
 * The faults the soak injects while the load runs: MariaDB killed and started again, the
 * app process killed (SIGKILL) in the middle of approvals and started again, the mail
 * service gone for a while. Each writes down when it began and ended (ms since the run
 * started) so that the checks can tell expected failures from real ones.
 */
import fs from 'node:fs';
import { alive, start, type LocalMariadb } from '../../server/tools/local-mariadb';
import { startMailCatcher, type CaughtMail, type MailCatcher } from '../../server/tools/mail-catcher';
import type { SoakApp } from './app';
import { type SoakClient } from './client';

export interface Probe {
  path: string;
  status: number;
  code: string | null;
  ms: number;
}

export interface DatabaseOutage {
  downMs: number;
  /** MariaDB answers again (started, crash recovery done). */
  upMs: number;
  /** The app answers a signed-in read with 200 again. */
  recoveredMs: number | null;
  /** What the app answered while MariaDB was down. */
  probes: Probe[];
  appPidBefore: number | null;
  appPidAfter: number | null;
}

export interface AppCrash {
  killMs: number;
  upMs: number;
  approvesInFlight: number;
}

export interface MailOutage {
  downMs: number;
  upMs: number;
}

export interface FaultLog {
  database?: DatabaseOutage;
  app?: AppCrash;
  mail?: MailOutage;
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Kills mariadbd outright (a crash, not a clean shutdown), keeps it down for `seconds`, starts it again. */
export async function databaseOutage(mariadb: LocalMariadb, app: SoakApp, probe: SoakClient, clock: () => number, seconds: number): Promise<DatabaseOutage> {
  const pid = Number(fs.readFileSync(mariadb.pidFile, 'utf8').trim());
  const appPidBefore = app.pid();
  const downMs = clock();
  process.kill(pid, 'SIGKILL');
  while (alive(pid)) await sleep(20);

  const probes: Probe[] = [];
  while (clock() < downMs + seconds * 1000) {
    for (const path of ['/api/health', '/api/recipes?pageSize=5']) {
      const t = clock();
      const res = await probe.call('fault-probe', 'GET', path);
      probes.push({ path, status: res.status, code: (res.body as { code?: string } | null)?.code ?? null, ms: clock() - t });
    }
    await sleep(500);
  }
  await start(mariadb);
  const upMs = clock();
  let recoveredMs: number | null = null;
  while (clock() < upMs + 60_000) {
    const res = await probe.call('fault-probe', 'GET', '/api/recipes?pageSize=5');
    if (res.status === 200) {
      recoveredMs = clock();
      break;
    }
    await sleep(250);
  }
  return { downMs, upMs, recoveredMs, probes, appPidBefore, appPidAfter: app.pid() };
}

/** Waits (at most 20 s) until an approval is on its way, then SIGKILLs the app and starts it again. */
export async function appCrash(app: SoakApp, approvesInFlight: { n: number }, clock: () => number): Promise<AppCrash> {
  const until = clock() + 20_000;
  while (approvesInFlight.n === 0 && clock() < until) await sleep(5);
  const inFlight = approvesInFlight.n;
  const killMs = clock();
  await app.kill('SIGKILL');
  await app.start();
  return { killMs, upMs: clock(), approvesInFlight: inFlight };
}

/** The mail catcher as a service that can go away and come back on the same port; keeps what every incarnation caught. */
export class MailService {
  private catcher: MailCatcher | null = null;
  private readonly earlier: CaughtMail[] = [];
  port = 0;

  async start(): Promise<void> {
    this.catcher = await startMailCatcher(this.port, { dir: null });
    this.port = this.catcher.port;
  }

  async stop(): Promise<void> {
    if (!this.catcher) return;
    const c = this.catcher;
    this.catcher = null;
    // Collected after the close: a message accepted while it was closing is kept too.
    await c.stop();
    this.earlier.push(...c.messages());
  }

  messages(): CaughtMail[] {
    return [...this.earlier, ...(this.catcher?.messages() ?? [])];
  }
}

export async function mailOutage(mail: MailService, clock: () => number, seconds: number): Promise<MailOutage> {
  const downMs = clock();
  await mail.stop();
  await sleep(seconds * 1000);
  await mail.start();
  return { downMs, upMs: clock() };
}
