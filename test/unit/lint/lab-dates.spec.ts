/**
 * Every date the client shows follows the lab's one date format (the `labDate` pipe over
 * shared/date-format.ts). Angular's `date` pipe and the browser's locale formatting write
 * "5 Dec 2026" or the browser's own order instead, so no template or component may use them.
 */
import { expect } from 'chai';
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';

const ROOT = path.resolve(import.meta.dirname, '../../..');
const APP = path.join(ROOT, 'src/app');

/** Templates and component code; specs may build dates any way they like. */
function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return sourceFiles(full);
    return /\.(ts|html)$/.test(entry.name) && !entry.name.endsWith('.spec.ts') ? [full] : [];
  });
}

const FORBIDDEN: { what: string; pattern: RegExp }[] = [
  { what: "Angular's date pipe (use labDate)", pattern: /\|\s*date\s*(?=[:}|)\s])/ },
  { what: "Angular's DatePipe (use LabDatePipe)", pattern: /\bDatePipe\b/ },
  { what: 'toLocaleDateString (use formatDate from shared/date-format)', pattern: /\.toLocaleDateString\s*\(/ },
  { what: 'toLocaleTimeString (use formatDateTime from shared/date-format)', pattern: /\.toLocaleTimeString\s*\(/ },
];

/** "src/app/x.html:12: Angular's date pipe …" for every forbidden use in `text`. */
export function dateFormattingFaults(file: string, text: string): string[] {
  return text
    .split('\n')
    .flatMap((line, i) => FORBIDDEN.filter((f) => f.pattern.test(line)).map((f) => `${path.relative(ROOT, file)}:${i + 1}: ${f.what}: ${line.trim()}`));
}

describe('dates on screen follow the lab format', () => {
  it('finds the forbidden forms (the guard can fail)', () => {
    const file = path.join(APP, 'probe/probe.html');
    expect(dateFormattingFaults(file, "<time>{{ at | date: 'd MMM y' }}</time>")).to.have.length(1);
    expect(dateFormattingFaults(file, '<time>{{ at | date }}</time>')[0]).to.match(/^src\/app\/probe\/probe\.html:1: Angular's date pipe/);
    expect(dateFormattingFaults(file, "import { DatePipe } from '@angular/common';")).to.have.length(1);
    expect(dateFormattingFaults(file, "d.toLocaleDateString('en-GB')")).to.have.length(1);
    expect(dateFormattingFaults(file, "d.toLocaleTimeString('en-GB')")).to.have.length(1);
    expect(dateFormattingFaults(file, "<time>{{ at | labDate: 'time' }}</time> {{ n | dateless }} LabDatePipe")).to.deep.equal([]);
  });

  it("no template or component in src/app uses Angular's date pipe or the browser's locale dates", () => {
    const faults = sourceFiles(APP).flatMap((file) => dateFormattingFaults(file, readFileSync(file, 'utf8')));
    expect(faults, `Show dates with the labDate pipe (core/dates/lab-date-pipe.ts):\n${faults.join('\n')}`).to.deep.equal([]);
  });
});
