/**
 * The load figures (README.md in this folder), each measured against a baseline of the same run: the load runs
 * (autocannon against the bench server) and the in-process chain verification.
 */
import type { Knex } from 'knex';
import { chainBatch } from '../../../server/data/trail-events';
import { verifyChain, VERIFY_BATCH } from '../../../server/services/trail/verify';
import type { HttpSession } from './http-session';
import { measure, type LoadFigures } from './measure';
import type { Figure } from './report';
import type { Samples } from './samples';

export interface FigureContext {
  baseUrl: string;
  sessions: { author: HttpSession; auditor: HttpSession };
  samples: Samples;
  bigRecipeId: number;
  durationS: number;
  log: (line: string) => void;
}

const pick = <T>(list: readonly T[]): T => list[Math.floor(Math.random() * list.length)]!;
const jitter = (n: number) => Math.floor(Math.random() * n);
const ms = (n: number) => `${n.toFixed(n < 10 ? 1 : 0)} ms`;
const abs = (f: LoadFigures) => `${f.rps.toFixed(0)} req/s, p50 ${ms(f.p50Ms)}, p99 ${ms(f.p99Ms)} @${f.connections}`;
const values = (f: LoadFigures, extra: Record<string, number> = {}) => ({
  rps: round(f.rps),
  p50Ms: f.p50Ms,
  p99Ms: f.p99Ms,
  meanMs: round(f.meanMs),
  requests: f.requests,
  connections: f.connections,
  durationS: round(f.durationS),
  ...extra,
});
const round = (n: number, digits = 2) => Math.round(n * 10 ** digits) / 10 ** digits;

async function load(ctx: FigureContext, session: HttpSession, what: string, connections: number, nextPath: () => string): Promise<LoadFigures> {
  ctx.log(`  measuring ${what} (${connections} connections, ${ctx.durationS} s)…`);
  return measure({ baseUrl: ctx.baseUrl, cookie: session.cookie, connections, durationS: ctx.durationS, nextPath }, what);
}

/** A latency figure: p99 against its target, with the ratios to the baseline at the same connections. */
function latencyFigure(name: string, f: LoadFigures, base: LoadFigures, p99TargetMs: number): Figure {
  return {
    name,
    absolute: abs(f),
    ratio: `p99 ${(f.p99Ms / base.p99Ms).toFixed(2)}× baseline; ${(f.rps / base.rps).toFixed(2)}× its req/s`,
    target: `p99 ≤ ${p99TargetMs} ms`,
    pass: f.p99Ms <= p99TargetMs,
    values: values(f, { p99TargetMs, p99RatioToBaseline: round(f.p99Ms / base.p99Ms, 3), rpsRatioToBaseline: round(f.rps / base.rps, 3) }),
  };
}

export async function loadFigures(ctx: FigureContext): Promise<Figure[]> {
  const { author, auditor } = ctx.sessions;
  const s = ctx.samples;
  const figures: Figure[] = [];

  // 1. Library search against the baseline route, both at 50 connections.
  const base50 = await load(ctx, author, 'baseline route', 50, () => '/api/bench/baseline');
  figures.push({ name: 'baseline route (PK select)', absolute: abs(base50), ratio: '1.00×', target: '—', pass: null, values: values(base50) });
  const library = await load(ctx, author, 'library search', 50, () => {
    const f = pick(s.filters);
    return `/api/recipes?q=${encodeURIComponent(f.q)}&group=${encodeURIComponent(f.group)}&machineId=${f.machineId}&page=${jitter(2)}`;
  });
  const libRatio = library.rps / base50.rps;
  figures.push({
    name: 'library search, q+group+machine',
    absolute: abs(library),
    ratio: `${libRatio.toFixed(2)}× baseline req/s`,
    target: '≥ 0.5× baseline; p99 ≤ 100 ms',
    pass: libRatio >= 0.5 && library.p99Ms <= 100,
    values: values(library, { rpsRatioToBaseline: round(libRatio, 3), p99TargetMs: 100, ratioTarget: 0.5 }),
  });

  // 2. Latency figures at 10 connections, against the baseline at 10.
  const base10 = await load(ctx, author, 'baseline route', 10, () => '/api/bench/baseline');
  figures.push({ name: 'baseline route (PK select)', absolute: abs(base10), ratio: '1.00×', target: '—', pass: null, values: values(base10) });
  const big = ctx.bigRecipeId;
  const page = await load(ctx, author, 'recipe page data (30 kB)', 10, () => `/api/recipes/${big}/versions/${1 + jitter(2)}`);
  figures.push(latencyFigure('recipe page data, 30 kB version', page, base10, 50));
  const compare = await load(ctx, author, 'comparison (30 kB each)', 10, () => `/api/recipes/${big}/compare?from=1&to=2`);
  figures.push(latencyFigure('comparison of two 30 kB versions', compare, base10, 50));

  const { minId, maxId } = s.trail;
  const mid = Math.floor((minId + maxId) / 2);
  // Pages start within a small spread of each depth (never below the first event).
  const spread = Math.max(1, Math.min(10_000, Math.floor((maxId - minId) / 10)));
  const before = (at: number) => `/api/trail?before=${Math.max(minId + 1, at)}`;
  const depths: [string, () => string][] = [
    ['top', () => before(maxId + 1 - jitter(spread))],
    ['middle', () => before(mid - jitter(spread))],
    ['bottom', () => before(minId + 51 + jitter(spread))],
  ];
  for (const [depth, next] of depths) {
    const trail = await load(ctx, auditor, `trail page at the ${depth}`, 10, next);
    figures.push(latencyFigure(`trail page (keyset) at the ${depth}`, trail, base10, 30));
  }
  // The same pages one request at a time: what a page costs without waiting in line
  // (at 10 connections even the baseline route's p99 is near 30 ms on 2 cores).
  const base1 = await load(ctx, author, 'baseline route', 1, () => '/api/bench/baseline');
  figures.push({ name: 'baseline route (PK select), one at a time', absolute: abs(base1), ratio: '1.00×', target: '—', pass: null, values: values(base1) });
  const unqueued = await load(ctx, auditor, 'trail pages, one at a time', 1, () => pick(depths)[1]());
  figures.push({
    ...latencyFigure('trail page (keyset), any depth, one at a time', unqueued, base1, 30),
    target: 'p99 ≤ 30 ms (information: the target is judged at 10 connections)',
    pass: null,
    info: true,
  });

  // 3. The bench sheet against a bare pdfkit page with the same fonts, both at 4 connections.
  const bare = await load(ctx, author, 'bare pdfkit page', 4, () => '/api/bench/bare-pdf');
  const barePageMs = 1000 / bare.rps;
  figures.push({
    name: 'bare pdfkit page, sheet fonts',
    absolute: `${abs(bare)}; ${ms(barePageMs)}/page`,
    ratio: '1.00×',
    target: '—',
    pass: null,
    values: values(bare, { msPerPage: round(barePageMs) }),
  });
  if (s.currentVersions.length > 0) {
    const sheet = await load(ctx, author, 'bench sheet PDF', 4, () => {
      const v = pick(s.currentVersions);
      return `/api/recipes/${v.recipeId}/versions/${v.version}/sheet.pdf`;
    });
    const sheetMs = 1000 / sheet.rps;
    const times = sheetMs / barePageMs;
    figures.push({
      name: 'bench sheet PDF',
      absolute: `${sheet.rps.toFixed(1)} sheets/s, p50 ${ms(sheet.p50Ms)}, p99 ${ms(sheet.p99Ms)} @4; ${ms(sheetMs)}/sheet`,
      ratio: `${times.toFixed(2)}× bare page time`,
      target: '≥ 20 sheets/s; ≤ 4× bare page',
      pass: sheet.rps >= 20 && times <= 4,
      values: values(sheet, { msPerSheet: round(sheetMs), ratioToBarePage: round(times, 3), sheetsPerSecondTarget: 20, ratioTarget: 4 }),
    });
  }
  return figures;
}

/**
 * Chain verification with the app's own code on the whole trail, against a plain walk that
 * reads the same batches without hashing (what the database and driver alone cost).
 */
export async function chainFigures(db: Knex, log: (line: string) => void, readSample = 200_000): Promise<Figure[]> {
  log('  reading the trail without verifying (baseline)…');
  let t = performance.now();
  let read = 0;
  for (let after = 0; read < readSample;) {
    const rows = await chainBatch(db, after, VERIFY_BATCH);
    if (rows.length === 0) break;
    read += rows.length;
    after = Number(rows[rows.length - 1]!.id);
  }
  const readRate = read / ((performance.now() - t) / 1000);
  log('  verifying the whole chain…');
  t = performance.now();
  const result = await verifyChain(db);
  const seconds = (performance.now() - t) / 1000;
  const rate = result.checked / seconds;
  if (!result.ok) throw new Error(`The trail's chain is broken at event ${result.firstBroken?.id}: ${result.firstBroken?.reason}`);
  return [
    {
      name: 'trail read without hashing',
      absolute: `${Math.round(readRate).toLocaleString('en')} events/s (${read.toLocaleString('en')} events)`,
      ratio: '1.00×',
      target: '—',
      pass: null,
      values: { eventsPerSecond: Math.round(readRate), events: read },
    },
    {
      name: 'chain verification, whole trail',
      absolute: `${Math.round(rate).toLocaleString('en')} events/s (${result.checked.toLocaleString('en')} events, ${seconds.toFixed(1)} s)`,
      ratio: `${(rate / readRate).toFixed(2)}× plain read`,
      target: '≥ 100,000 events/s',
      pass: rate >= 100_000,
      values: {
        eventsPerSecond: Math.round(rate),
        events: result.checked,
        seconds: round(seconds),
        ratioToPlainRead: round(rate / readRate, 3),
        target: 100_000,
      },
    },
  ];
}
