/** The bench's verdicts: the table on stdout and results.json beside it. */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { SCAN_NOTE_BELOW_ROWS, type ExplainedQuery } from './explain';

export interface Figure {
  name: string;
  /** Absolute numbers in words, e.g. "812 req/s, p50 41 ms, p99 88 ms @50". */
  absolute: string;
  /** The ratio to the baseline of the same run, in words, e.g. "0.61× baseline req/s". */
  ratio: string;
  target: string;
  /** null for a baseline or a figure shown for information (nothing to meet). */
  pass: boolean | null;
  /** A figure for information beside the targets, e.g. latency without queueing. */
  info?: boolean;
  /** Every number, for results.json. */
  values: Record<string, number>;
}

export function machineInfo() {
  const cpus = os.cpus();
  return {
    cpus: cpus.length,
    cpuModel: cpus[0]?.model ?? 'unknown',
    memoryGb: Math.round(os.totalmem() / 2 ** 30),
    node: process.version,
    platform: `${os.type()} ${os.release()} ${os.arch()}`,
    date: new Date().toISOString(),
    /** 1, 5 and 15 minute load averages as the run ends: other work on the machine shows in every absolute figure. */
    loadAverage: os.loadavg().map((n) => Math.round(n * 100) / 100),
  };
}

/** BASELINE, INFO, PASS or MISS as the table and results.json show it. */
export function resultOf(f: Pick<Figure, 'pass' | 'info'>): string {
  return f.pass === null ? (f.info ? 'info' : 'baseline') : f.pass ? 'PASS' : 'MISS';
}

const pad = (s: string, n: number) => (s.length >= n ? s : s + ' '.repeat(n - s.length));

export function printTable(figures: readonly Figure[]): void {
  const head = ['figure', 'absolute', 'ratio', 'target', 'result'];
  const rows = figures.map((f) => [f.name, f.absolute, f.ratio, f.target, resultOf(f)]);
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i]!.length)));
  const line = (cells: string[]) => cells.map((c, i) => pad(c, widths[i]!)).join(' │ ');
  console.log(line(head));
  console.log(widths.map((w) => '─'.repeat(w)).join('─┼─'));
  for (const r of rows) console.log(line(r));
}

export function printExplain(explained: readonly ExplainedQuery[]): void {
  const scans = explained.filter((e) => e.fullScans.length > 0);
  const notes = explained.filter((e) => e.smallScans.length > 0);
  console.log(`\nEXPLAIN: ${explained.length} distinct SELECTs of the list routes checked; ${scans.length} with a full scan of a large table.`);
  for (const e of notes) {
    console.log(`  note: scan of ${e.smallScans.join(', ')} (below ${SCAN_NOTE_BELOW_ROWS.toLocaleString('en')} rows, not a failure) — route ${e.route}`);
  }
  for (const e of scans) {
    console.error(`\n  FULL SCAN of ${e.fullScans.join(', ')} — route ${e.route}\n  SQL: ${e.sql}\n  plan: ${e.plan.join('; ')}`);
  }
}

export function writeResults(file: string, content: Record<string, unknown>): void {
  fs.mkdirSync(path.dirname(file), { recursive: true });
  fs.writeFileSync(file, `${JSON.stringify(content, null, 2)}\n`);
}
