/**
 * Debian's chromium through playwright-core (no browser download; CHROMIUM_PATH names
 * another), with the flags that keep it off the closed network (server/tools/chromium.ts). Each page records console errors, CSP
 * violations and any request that leaves the app's own origin.
 */
import fs from 'node:fs';
import path from 'node:path';
import { type Browser, type Page, chromium } from 'playwright-core';
import { CHROMIUM_FLAGS, CHROMIUM_PATH } from '../../../server/tools/chromium';

export const BASE_URL = process.env['BASE_URL'] ?? 'http://127.0.0.1:4300';
export const SHOTS_DIR = path.resolve(import.meta.dirname, '../../../.data/screenshots');

export function launch(): Promise<Browser> {
  return chromium.launch({
    executablePath: CHROMIUM_PATH,
    args: CHROMIUM_FLAGS,
  });
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
