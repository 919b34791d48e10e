/** The soak's figures: requests by kind with p50/p99, and failures by status. */
import type { RequestRecord } from './client';

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return 0;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;
}

function figures(list: RequestRecord[]): { n: number; p50: number; p99: number; failed: string } {
  const ms = list.map((r) => r.endMs - r.startMs).sort((a, b) => a - b);
  const failures = new Map<string, number>();
  for (const r of list) {
    if (r.status >= 200 && r.status < 300) continue;
    const label = r.status === 0 ? (r.code ?? 'no answer') : `${r.status}${r.code ? ` ${r.code}` : ''}`;
    failures.set(label, (failures.get(label) ?? 0) + 1);
  }
  const failed = [...failures]
    .sort((a, b) => b[1] - a[1])
    .map(([k, n]) => `${k}×${n}`)
    .join(', ');
  return { n: list.length, p50: Math.round(percentile(ms, 50)), p99: Math.round(percentile(ms, 99)), failed };
}

/** `calm`: true for a request that overlapped no app crash or database outage. */
export function printSummary(records: RequestRecord[], seconds: number, calm: (r: RequestRecord) => boolean = () => true): void {
  const users = records.filter((r) => r.kind !== 'fault-probe');
  const all = figures(users);
  const quiet = figures(users.filter(calm));
  console.log(`\nRequests: ${all.n} in ${seconds} s (${(all.n / seconds).toFixed(1)}/s), p50 ${all.p50} ms, p99 ${all.p99} ms`);
  console.log(
    `Outside the app crash and the database outage: ${quiet.n} requests, p50 ${quiet.p50} ms, p99 ${quiet.p99} ms, not 2xx: ${quiet.failed || 'none'}`,
  );
  console.log(`  ${'kind'.padEnd(14)} ${'count'.padStart(7)} ${'p50 ms'.padStart(8)} ${'p99 ms'.padStart(8)}  not 2xx`);
  const kinds = [...new Set(users.map((r) => r.kind))].sort();
  for (const kind of kinds) {
    const f = figures(users.filter((r) => r.kind === kind));
    console.log(`  ${kind.padEnd(14)} ${String(f.n).padStart(7)} ${String(f.p50).padStart(8)} ${String(f.p99).padStart(8)}  ${f.failed}`);
  }
  console.log(`Not 2xx, all kinds: ${all.failed || 'none'}`);
}
