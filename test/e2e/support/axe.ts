/**
 * axe-core in chromium through @axe-core/playwright. The builder injects axe itself (the
 * app's CSP blocks page.addScriptTag), which needs a page made by context.newPage().
 * Rules: WCAG 2.0 and 2.1, levels A and AA (axe's tags wcag2a, wcag2aa, wcag21a, wcag21aa).
 */
import { AxeBuilder } from '@axe-core/playwright';
import type { Page } from 'playwright-core';

export const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'];
/** The impacts that fail a screen; moderate and minor ones are printed only. */
export const BLOCKING_IMPACTS = ['serious', 'critical'];

export interface Finding {
  screen: string;
  id: string;
  impact: string;
  help: string;
  targets: string[];
}

/** Waits until the screen has loaded its data: no request in flight, no progress bar. */
export async function settle(page: Page): Promise<void> {
  await page.waitForLoadState('networkidle');
  await page
    .waitForFunction(() => document.querySelector('mat-progress-bar, mat-spinner, mat-progress-spinner') === null, undefined, { timeout: 15_000 })
    .catch(() => {
      /* a screen may keep an indicator on purpose; axe still runs */
    });
  // Colours are measured as painted: let enter animations and transitions (an error message
  // fading in, a dialog growing) finish first, or axe sees a half-faded colour. Endless ones
  // (progress bars) are left alone.
  await page.evaluate(async () => {
    const finite = document.getAnimations().filter((a) => Number.isFinite(Number(a.effect?.getComputedTiming().endTime)));
    await Promise.race([Promise.all(finite.map((a) => a.finished.catch(() => undefined))), new Promise((r) => setTimeout(r, 3000))]);
  });
}

/** Runs axe on the page (or inside `include`) and prints every violation with its targets. */
export async function audit(page: Page, screen: string, include?: string): Promise<Finding[]> {
  let builder = new AxeBuilder({ page }).withTags(WCAG_TAGS);
  if (include) builder = builder.include(include);
  const result = await builder.analyze();
  const findings = result.violations.map((v) => ({
    screen,
    id: v.id,
    impact: v.impact ?? 'unknown',
    help: v.help,
    targets: v.nodes.map((n) => `${n.target.join(' ')}${n.failureSummary ? ` — ${n.failureSummary.replace(/\s+/g, ' ').slice(0, 200)}` : ''}`),
  }));
  for (const f of findings) {
    console.log(`    [axe] ${screen}: ${f.impact} ${f.id} (${f.help})`);
    for (const t of f.targets) console.log(`          ${t}`);
  }
  return findings;
}

/** The findings that fail a screen, one readable line each. */
export function blocking(findings: Finding[]): string[] {
  return findings.filter((f) => BLOCKING_IMPACTS.includes(f.impact)).map((f) => `${f.screen}: ${f.impact} ${f.id} at ${f.targets.join(' | ')}`);
}
