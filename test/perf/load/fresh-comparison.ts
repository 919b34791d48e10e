/**
 * What a comparison costs the first time a pair is opened: the server keeps recent word
 * diffs (server/services/recipes/text-diff-memo.ts), so the load run mostly measures kept ones.
 * Here the two 30 kB versions are compared afresh in process, many times over.
 */
import type { Knex } from 'knex';
import { compareVersions, wordDiff, type StockNames } from '../../../shared/recipe-compare';
import type { RecipeContent } from '../../../shared/schemas/recipe';
import { fromJsonColumn } from '../../../server/data/json-column';
import { findVersion } from '../../../server/data/recipes';
import type { Figure } from './report';

const RUNS = 30;

export async function freshComparisonFigure(db: Knex, bigRecipeId: number): Promise<Figure> {
  const [a, b] = [await findVersion(db, bigRecipeId, 1), await findVersion(db, bigRecipeId, 2)];
  if (!a || !b) throw new Error(`The bench recipe ${bigRecipeId} lacks version 1 or 2.`);
  const side = (v: NonNullable<typeof a>) => ({ version: v.version, status: v.status, title: v.title, content: fromJsonColumn<RecipeContent>(v.content_json) });
  const names: StockNames = { materials: new Map(), wheels: new Map(), machines: new Map() };
  const times: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const t = performance.now();
    compareVersions(side(a), side(b), names, 'metric', wordDiff);
    times.push(performance.now() - t);
  }
  times.sort((x, y) => x - y);
  const median = times[Math.floor(RUNS / 2)]!;
  const worst = times[RUNS - 1]!;
  return {
    name: 'comparison computed afresh (in process)',
    absolute: `median ${median.toFixed(1)} ms, slowest ${worst.toFixed(1)} ms of ${RUNS}`,
    ratio: '—',
    target: '— (first opening of a pair)',
    pass: null,
    info: true,
    values: { medianMs: Math.round(median * 10) / 10, slowestMs: Math.round(worst * 10) / 10, runs: RUNS },
  };
}
