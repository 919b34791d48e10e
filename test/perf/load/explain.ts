/**
 * The EXPLAIN check: every SELECT a list route runs must reach the large tables through an
 * index. A row of EXPLAIN with `type = ALL` on one of them is a full table scan: it grows
 * with the data and is reported, naming the route and the query.
 */
import type { Knex } from 'knex';
import type { CapturedQuery } from './extra-routes';

/** The tables that grow with a company's use (at full scale 10,000 recipes, 1,000,000 events…). */
export const LARGE_TABLES = ['recipes', 'recipe_versions', 'trail_events', 'cut_records', 'users', 'sheet_prints', 'signatures'] as const;

/**
 * Below this many rows MariaDB reads a whole table rather than walk an index even when one
 * fits (the 200 people of the large data set: `ORDER BY username LIMIT 26` is planned as a
 * scan although the unique username index gives that order). Such scans are listed as notes;
 * from this size on they fail the bench.
 */
export const SCAN_NOTE_BELOW_ROWS = 1000;

interface ExplainRow {
  id: number | null;
  table: string | null;
  type: string | null;
  key: string | null;
  rows: number | null;
  Extra: string | null;
}

export interface ExplainedQuery {
  route: string;
  sql: string;
  /** One entry per EXPLAIN row: "alias→table type key rows". */
  plan: string[];
  /** Full scans of large tables, e.g. "recipes (as r)". */
  fullScans: string[];
  /** Full scans of a large table that holds fewer than SCAN_NOTE_BELOW_ROWS rows here. */
  smallScans: string[];
}

/** alias → table, from knex's `from`/`join` clauses (`recipes` as `r`). */
function aliasesOf(sql: string): Map<string, string> {
  const map = new Map<string, string>();
  for (const m of sql.matchAll(/\b(?:from|join)\s+`(\w+)`(?:\s+as\s+`(\w+)`)?/gi)) {
    map.set(m[2] ?? m[1]!, m[1]!);
  }
  return map;
}

/** Every distinct SELECT of the capture (the same query text once per route). */
export function selectsOf(queries: readonly CapturedQuery[]): CapturedQuery[] {
  const seen = new Set<string>();
  return queries.filter((q) => {
    if (!/^\s*select\b/i.test(q.sql) || /\bfor update\b/i.test(q.sql) || seen.has(q.sql)) return false;
    seen.add(q.sql);
    return true;
  });
}

/** Rows in each large table of the bench database, for SCAN_NOTE_BELOW_ROWS. */
export async function largeTableSizes(db: Knex): Promise<Map<string, number>> {
  const sizes = new Map<string, number>();
  for (const table of LARGE_TABLES) {
    const row = (await db(table).count<{ n: number }[]>({ n: '*' }).first()) as { n: number } | undefined;
    sizes.set(table, Number(row?.n ?? 0));
  }
  return sizes;
}

export async function explainQuery(db: Knex, route: string, q: CapturedQuery, sizes: Map<string, number>): Promise<ExplainedQuery> {
  const result = (await db.raw(`EXPLAIN ${q.sql}`, q.bindings as Knex.RawBinding[])) as [ExplainRow[], unknown];
  const aliases = aliasesOf(q.sql);
  const plan: string[] = [];
  const fullScans: string[] = [];
  const smallScans: string[] = [];
  for (const row of result[0]) {
    const shown = row.table ?? '';
    const table = aliases.get(shown) ?? shown;
    plan.push(`${shown === table ? table : `${table} as ${shown}`}: ${row.type ?? '-'}${row.key ? ` via ${row.key}` : ''} (~${row.rows ?? '?'} rows)`);
    if (row.type !== 'ALL' || !(LARGE_TABLES as readonly string[]).includes(table)) continue;
    const rows = sizes.get(table) ?? 0;
    const name = `${shown === table ? table : `${table} (as ${shown})`}, ${rows.toLocaleString('en')} rows`;
    (rows < SCAN_NOTE_BELOW_ROWS ? smallScans : fullScans).push(name);
  }
  return { route, sql: q.sql, plan, fullScans, smallScans };
}
