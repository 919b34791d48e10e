/**
 * Debian's chromium through playwright-core (no browser download; CHROMIUM_PATH names
 * another), with the flags that keep it off the closed network (server/tools/chromium.ts). Each page records console errors, CSP
 * violations and any request that leaves the app's own origin. Every context of a launched
 * browser reports CSP violations, and any e2e test during which one was reported fails.
 */
import fs from 'node:fs';
import path from 'node:path';
import { type Browser, type BrowserContext, type Page, chromium } from 'playwright-core';
import { CHROMIUM_FLAGS, CHROMIUM_PATH } from '../../../server/tools/chromium';

export const BASE_URL = process.env['BASE_URL'] ?? 'http://127.0.0.1:4300';
export const SHOTS_DIR = path.resolve(import.meta.dirname, '../../../.data/screenshots');

/** CSP violations reported by any page since the last check, each with the page's address. */
const cspViolations: string[] = [];

/**
 * The page's own `securitypolicyviolation` events, handed to the test process through a
 * binding (a caught violation, e.g. a refused eval probe, writes nothing to the console).
 */
async function reportCspViolations(context: BrowserContext): Promise<void> {
  await context.exposeBinding('kerfbookCspViolation', ({ page }, text: string) => {
    cspViolations.push(`${page.url()}: ${text}`);
  });
  await context.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (e) => {
      const where = e.sourceFile ? ` at ${e.sourceFile}:${e.lineNumber}` : '';
      (window as unknown as { kerfbookCspViolation(text: string): void }).kerfbookCspViolation(
        `${e.effectiveDirective} refused ${e.blockedURI || 'inline'}${where}`,
      );
    });
  });
}

/** Takes the violations reported so far. */
export function takeCspViolations(): string[] {
  return cspViolations.splice(0);
}

// Root hooks (this module is imported by every e2e file): a CSP violation fails the test it happened in.
if (typeof afterEach === 'function') {
  afterEach(function () {
    const found = takeCspViolations();
    if (found.length > 0) throw new Error(`CSP violations during "${this.currentTest?.fullTitle() ?? ''}":\n${found.join('\n')}`);
  });
  after(function () {
    const found = takeCspViolations();
    if (found.length > 0) throw new Error(`CSP violations after the last test:\n${found.join('\n')}`);
  });
}

export async function launch(): Promise<Browser> {
  const browser = await chromium.launch({
    executablePath: CHROMIUM_PATH,
    args: CHROMIUM_FLAGS,
  });
  // browser.newPage() goes through newContext() too.
  const newContext = browser.newContext.bind(browser);
  browser.newContext = async (options) => {
    const context = await newContext(options);
    await reportCspViolations(context);
    return context;
  };
  return browser;
}

export interface WatchedPage {
  page: Page;
  /** Console errors (CSP violations show up here as "Refused to …"). */
  consoleErrors: string[];
  /** URLs requested outside BASE_URL's origin. */
  foreignRequests: string[];
}

export async function openPage(browser: Browser, viewport = { width: 1280, height: 800 }): Promise<WatchedPage> {
  const context = await browser.newContext({ viewport });
  const page = await context.newPage();
  const watched: WatchedPage = { page, consoleErrors: [], foreignRequests: [] };
  const origin = new URL(BASE_URL).origin;
  page.on('console', (msg) => {
    if (msg.type() === 'error') watched.consoleErrors.push(msg.text());
  });
  page.on('request', (req) => {
    const url = req.url();
    if (!url.startsWith(origin) && !url.startsWith('data:') && !url.startsWith('blob:')) watched.foreignRequests.push(url);
  });
  return watched;
}

export async function screenshot(page: Page, name: string): Promise<void> {
  fs.mkdirSync(SHOTS_DIR, { recursive: true });
  await page.screenshot({ path: path.join(SHOTS_DIR, `${name}.png`), fullPage: true });
}
