/** Steps several journeys share, written the way a person uses the app. */
import type { Page } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../../../seeds/data/demo-accounts';
import { BASE_URL } from './browser';

/** The demo data's admin. */
export const demoAdmin = DEMO_ACCOUNTS.find((a) => a.roles.includes('admin'))!;

export async function signIn(page: Page, username: string, password: string): Promise<void> {
  await page.goto(`${BASE_URL}/sign-in`);
  await page.getByLabel('Username').fill(username);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

export async function signOut(page: Page, displayName: string): Promise<void> {
  await page.getByRole('button', { name: `Account menu for ${displayName}` }).click();
  await page.getByRole('menuitem', { name: /sign out/i }).click();
  await page.waitForURL(/\/sign-in/);
}

/** Names of the entries in the side navigation. */
export async function navEntries(page: Page): Promise<string[]> {
  const nav = page.getByRole('navigation', { name: 'Sections' });
  await nav.getByRole('link').first().waitFor();
  return (await nav.getByRole('link').allInnerTexts()).map((t) => t.replace(/^\s*\S+\s+/, '').trim());
}

/** The browser logs every 401 of the anonymous session probe; that one is expected. */
export function unexpectedErrors(errors: string[]): string[] {
  return errors.filter((e) => !/status of 401/.test(e));
}

/** Opens a Material select by its label and picks the option whose text matches. */
export async function choose(page: Page, label: string, option: RegExp): Promise<void> {
  await page.getByRole('combobox', { name: label, exact: true }).click();
  await page.getByRole('option', { name: option }).click();
}

/** A dialog moves focus to its first field once it has opened; typing before that races it. */
export async function dialogSettled(page: Page): Promise<void> {
  await page.waitForFunction(() => document.activeElement?.closest('[role="dialog"]') != null);
}

/** Signs in as the demo admin and waits for Today, where a sign-in lands. */
export async function signInAsAdmin(page: Page): Promise<void> {
  await signIn(page, demoAdmin.username, demoAdmin.password);
  await page.waitForURL(/\/today/);
}
