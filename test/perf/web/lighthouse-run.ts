/**
 * One Lighthouse 12 run on a page of the running app, in the browser at `port`, keeping
 * its cookies (disableStorageReset). Desktop uses Lighthouse's own desktop configuration;
 * mobile its default (emulated phone, slow 4G, 4× CPU slow-down).
 */
import lighthouse, { desktopConfig, type Flags, type Result } from 'lighthouse';

export type FormFactor = 'desktop' | 'mobile';

export interface Finding {
  id: string;
  title: string;
  /** A few of the elements the audit names (CSS selectors), when it names any. */
  elements: string[];
}

export interface LighthouseScores {
  performance: number;
  accessibility: number | null;
  metrics: { fcpMs: number; lcpMs: number; tbtMs: number; cls: number; speedIndexMs: number };
  /** Accessibility audits that failed, with what they point at. */
  accessibilityFindings: Finding[];
  /** Performance opportunities that cost time (e.g. text compression, caching). */
  performanceFindings: Finding[];
}

export interface LighthouseRun {
  scores: LighthouseScores;
  /** Lighthouse's whole report, for a closer look (kept in .data/bench-web/). */
  lhr: Result;
}

const ATTEMPTS = 3;
const RETRIED_ERRORS = new Set(['NO_NAVSTART', 'NO_TRACING_STARTED', 'PROTOCOL_TIMEOUT']);

export async function runLighthouse(url: string, port: number, formFactor: FormFactor, withAccessibility: boolean): Promise<LighthouseRun> {
  const flags: Flags = {
    port,
    output: 'json',
    logLevel: 'error',
    onlyCategories: withAccessibility ? ['performance', 'accessibility'] : ['performance'],
    disableStorageReset: true,
  };
  let lhr: Result | undefined;
  for (let attempt = 1; ; attempt++) {
    const result = await lighthouse(url, flags, formFactor === 'desktop' ? desktopConfig : undefined);
    if (!result) throw new Error(`Lighthouse returned nothing for ${url}.`);
    lhr = result.lhr;
    const code = lhr.runtimeError?.code;
    if (!code) break;
    // Trace-recording hiccups ("Please run Lighthouse again") are Lighthouse's, not the page's.
    if (!RETRIED_ERRORS.has(code) || attempt === ATTEMPTS) throw new Error(`Lighthouse could not load ${url}: ${lhr.runtimeError!.message}`);
    console.log(`  (Lighthouse: ${code} on ${url}; running it again, ${attempt + 1} of ${ATTEMPTS})`);
  }
  const score = (id: string) => {
    const s = lhr.categories[id]?.score;
    return s === null || s === undefined ? null : Math.round(s * 100);
  };
  const numeric = (id: string) => lhr.audits[id]?.numericValue ?? NaN;
  const scores: LighthouseScores = {
    performance: score('performance') ?? 0,
    accessibility: withAccessibility ? score('accessibility') : null,
    metrics: {
      fcpMs: Math.round(numeric('first-contentful-paint')),
      lcpMs: Math.round(numeric('largest-contentful-paint')),
      tbtMs: Math.round(numeric('total-blocking-time')),
      cls: Number(numeric('cumulative-layout-shift').toFixed(3)),
      speedIndexMs: Math.round(numeric('speed-index')),
    },
    accessibilityFindings: withAccessibility ? failedAudits(lhr, 'accessibility') : [],
    performanceFindings: failedAudits(lhr, 'performance'),
  };
  return { scores, lhr };
}

function failedAudits(lhr: Result, category: string): Finding[] {
  const refs = lhr.categories[category]?.auditRefs ?? [];
  return (
    refs
      // The metrics themselves are in the table; name what makes them slow.
      .filter((ref) => ref.group !== 'metrics')
      .map((ref) => lhr.audits[ref.id])
      .filter(
        (a): a is Result['audits'][string] =>
          !!a &&
          a.score !== null &&
          a.score < 0.9 &&
          a.scoreDisplayMode !== 'informative' &&
          a.scoreDisplayMode !== 'manual' &&
          a.scoreDisplayMode !== 'notApplicable',
      )
      .map((a) => ({ id: a.id, title: a.title, elements: elementsOf(a.details) }))
  );
}

function elementsOf(details: unknown): string[] {
  const items = (details as { items?: { node?: { selector?: string; snippet?: string }; url?: string }[] } | undefined)?.items ?? [];
  return items
    .map((i) => i.node?.selector ?? i.url)
    .filter((s): s is string => typeof s === 'string')
    .slice(0, 5);
}
