/**
 * Calls every list route once (list-routes.ts) while the bench server records its SQL, then
 * EXPLAINs each distinct SELECT on the bench database.
 */
import type { Knex } from 'knex';
import type { CapturedQuery } from './extra-routes';
import type { BenchRole } from './users';
import { explainQuery, largeTableSizes, selectsOf, type ExplainedQuery } from './explain';
import type { HttpSession } from './http-session';
import { listRouteCalls } from './list-routes';
import type { Samples } from './samples';

export async function runExplainCheck(
  db: Knex,
  sessions: Record<BenchRole, HttpSession>,
  samples: Samples,
  big: { recipeId: number },
): Promise<ExplainedQuery[]> {
  const out: ExplainedQuery[] = [];
  const seen = new Set<string>();
  const sizes = await largeTableSizes(db);
  for (const call of listRouteCalls(samples, big)) {
    await sessions.admin.post('/api/bench/capture');
    const res = await sessions[call.role].fetchRaw(call.path);
    const captured = await sessions.admin.get<CapturedQuery[]>('/api/bench/captured');
    if (res.status !== 200) throw new Error(`GET ${call.path} as ${call.role} answered ${res.status}: ${res.text}`);
    for (const q of selectsOf(captured)) {
      if (seen.has(q.sql)) continue;
      seen.add(q.sql);
      out.push(await explainQuery(db, `GET ${call.path} (${call.role})`, q, sizes));
    }
  }
  return out;
}
