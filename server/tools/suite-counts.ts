/** Reads pass/fail counts from the closing lines of the test runners we use. */
export interface Counts {
  passed: number;
  failed: number;
  skipped: number;
}

const ANSI = /\x1b\[[0-9;]*m/g;

/** mocha's spec reporter: "12 passing (3s)", "1 failing", "2 pending". */
export function mochaCounts(output: string): Counts | null {
  const text = output.replace(ANSI, '');
  const passing = /^\s*(\d+) passing/m.exec(text);
  const failing = /^\s*(\d+) failing/m.exec(text);
  const pending = /^\s*(\d+) pending/m.exec(text);
  if (!passing && !failing) return null;
  return { passed: Number(passing?.[1] ?? 0), failed: Number(failing?.[1] ?? 0), skipped: Number(pending?.[1] ?? 0) };
}

/** vitest: "Tests  3 failed | 40 passed | 1 skipped (44)". */
export function vitestCounts(output: string): Counts | null {
  const text = output.replace(ANSI, '');
  const line = /^\s*Tests\s+(.*\(\d+\))\s*$/m.exec(text);
  if (!line) return null;
  const n = (word: string) => Number(new RegExp(`(\\d+) ${word}`).exec(line[1])?.[1] ?? 0);
  return { passed: n('passed'), failed: n('failed'), skipped: n('skipped') + n('todo') };
}
