/** The table `npm run bench:web` prints and the JSON it writes to results.json beside it. */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { InitialJs } from './initial-js';
import type { LighthouseScores } from './lighthouse-run';

export const TARGETS = { initialJsGzipKb: 250, performance: 90, accessibility: 95 } as const;

export interface ScreenResult {
  screen: string;
  path: string;
  person: string;
  desktop: LighthouseScores;
  /** For information only: no target applies. */
  mobile?: LighthouseScores;
  pass: boolean;
}

export interface WebResults {
  measuredAt: string;
  machine: { cpus: number; cpuModel: string; node: string };
  lighthouse: string;
  configuration: string;
  targets: typeof TARGETS;
  initialJs: InitialJs & {
    gzipKb: number;
    /** Raw bytes per gzipped byte of the initial files. */
    rawPerGzip: number;
    /** angular.json's `initial` maximumError (raw) and what it comes to gzipped at rawPerGzip. */
    budget: { maximumErrorRawKb: number; asGzipKb: number } | null;
    pass: boolean;
  };
  screens: ScreenResult[];
  pass: boolean;
}

export function machine(): WebResults['machine'] {
  return { cpus: os.cpus().length, cpuModel: os.cpus()[0]?.model ?? 'unknown', node: process.version };
}

const kb = (bytes: number) => (bytes / 1000).toFixed(1);
const mark = (ok: boolean) => (ok ? 'PASS' : 'MISS');

export function printTable(results: WebResults): void {
  const js = results.initialJs;
  console.log(
    `\nInitial JavaScript (files index.html loads eagerly: ${js.files.length}): ${kb(js.rawBytes)} kB raw, ${kb(js.gzipBytes)} kB gzipped — target ≤ ${TARGETS.initialJsGzipKb} kB gzipped: ${mark(js.pass)}`,
  );
  if (js.budget) {
    console.log(
      `angular.json's initial budget: ${js.budget.maximumErrorRawKb} kB raw ≈ ${js.budget.asGzipKb} kB gzipped at this build's ${js.rawPerGzip}:1 ratio.`,
    );
  }
  console.log(
    `\nLighthouse ${results.lighthouse}, ${results.configuration}. Targets: performance ≥ ${TARGETS.performance}, accessibility ≥ ${TARGETS.accessibility}.`,
  );
  const head = ['screen', 'as', 'performance', 'accessibility', 'LCP ms', 'TBT ms', 'CLS', 'mobile perf*', 'result'];
  const rows = results.screens.map((s) => [
    s.screen,
    s.person,
    String(s.desktop.performance),
    String(s.desktop.accessibility ?? '–'),
    String(s.desktop.metrics.lcpMs),
    String(s.desktop.metrics.tbtMs),
    String(s.desktop.metrics.cls),
    s.mobile ? String(s.mobile.performance) : '–',
    mark(s.pass),
  ]);
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i]!.length)));
  const line = (cells: string[]) => cells.map((c, i) => c.padEnd(widths[i]!)).join('  ');
  console.log(`\n${line(head)}\n${widths.map((w) => '-'.repeat(w)).join('  ')}`);
  for (const r of rows) console.log(line(r));
  console.log('* mobile: Lighthouse default (emulated phone, slow 4G, 4× CPU slow-down), for information only; no target applies.');
  for (const s of results.screens) {
    const findings = [...(s.desktop.accessibilityFindings ?? []), ...(s.pass ? [] : s.desktop.performanceFindings)];
    if (!s.pass && findings.length) {
      console.log(`\n${s.screen}: what Lighthouse names`);
      for (const f of findings) console.log(`  - ${f.id}: ${f.title}${f.elements.length ? ` (${f.elements.join(', ')})` : ''}`);
    }
  }
  console.log(`\nOverall: ${mark(results.pass)}`);
}

export function writeResults(file: string, results: WebResults): void {
  fs.mkdirSync(path.dirname(file), { recursive: true });
  fs.writeFileSync(file, `${JSON.stringify(results, null, 2)}\n`);
}
