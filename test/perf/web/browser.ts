/**
 * Debian's chromium, started through playwright-core with a remote debugging port so that
 * Lighthouse can open its own tabs in the same profile. Playwright signs people in through
 * the real sign-in page; the session cookie then stays in the profile (Lighthouse runs with
 * disableStorageReset, so it keeps it).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext } from 'playwright-core';
import type { DemoAccount } from '../../../seeds/data/demo-accounts';
import { CHROMIUM_FLAGS, CHROMIUM_PATH } from '../../../server/tools/chromium';
import { freePort } from '../../../server/tools/free-port';

export interface BenchBrowser {
  /** The remote debugging port Lighthouse connects to. */
  port: number;
  signIn(baseUrl: string, account: DemoAccount): Promise<void>;
  signOut(): Promise<void>;
  /**
   * Opens the page once and waits until it is quiet, so that Lighthouse meets a warm server
   * (compiled code, connection pool, MariaDB's buffers) rather than its first request.
   */
  warmUp(url: string): Promise<void>;
  /** Empties the HTTP cache (not the cookies), so every run measures a first visit. */
  clearCache(): Promise<void>;
  close(): Promise<void>;
}

export async function launchBrowser(): Promise<BenchBrowser> {
  if (!fs.existsSync(CHROMIUM_PATH)) {
    throw new Error(`${CHROMIUM_PATH} is missing: install Debian's chromium (apt-get install -y chromium) or set CHROMIUM_PATH.`);
  }
  const port = await freePort();
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfbook-bench-web-'));
  const context: BrowserContext = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM_PATH,
    headless: true,
    // No viewport of Playwright's own: Lighthouse sets the screen it measures.
    viewport: null,
    args: [...CHROMIUM_FLAGS, `--remote-debugging-port=${port}`],
  });

  return {
    port,
    async signIn(baseUrl, account) {
      const page = await context.newPage();
      try {
        await page.goto(`${baseUrl}/sign-in`);
        await page.getByLabel('Username').fill(account.username);
        await page.getByLabel('Password', { exact: true }).fill(account.password);
        await page.getByRole('button', { name: 'Sign in' }).click();
        await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'), { timeout: 15000 });
      } catch (err) {
        throw new Error(`Could not sign in as ${account.username}: ${err instanceof Error ? err.message : String(err)}`);
      } finally {
        await page.close();
      }
    },
    async signOut() {
      await context.clearCookies();
    },
    async warmUp(url) {
      const page = await context.newPage();
      try {
        await page.goto(url, { waitUntil: 'networkidle', timeout: 30000 });
      } finally {
        await page.close();
      }
    },
    async clearCache() {
      const page = await context.newPage();
      try {
        const cdp = await context.newCDPSession(page);
        await cdp.send('Network.clearBrowserCache');
      } finally {
        await page.close();
      }
    },
    async close() {
      await context.close().catch(() => undefined);
      fs.rmSync(profile, { recursive: true, force: true });
    },
  };
}
