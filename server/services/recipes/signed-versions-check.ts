/**
 * Every version that was submitted, held against its hash and signatures, a batch at a time
 * (what `npm run trail:verify` runs beside the chain).
 */
import type { Knex } from 'knex';
import { listSignatureRows } from '../../data/workflow';
import { versionIntegrity } from './version-integrity';

export interface SignedVersionsResult {
  checked: number;
  failures: { number: string; version: number; problems: string[] }[];
}

export async function checkSignedVersions(db: Knex, batch = 500): Promise<SignedVersionsResult> {
  const result: SignedVersionsResult = { checked: 0, failures: [] };
  let afterId = 0;
  for (;;) {
    const rows = (await db('recipe_versions as v')
      .join('recipes as r', 'r.id', 'v.recipe_id')
      .where('v.id', '>', afterId)
      .andWhere((q) => q.whereNotNull('v.content_hash').orWhereIn('v.status', ['approved', 'superseded', 'withdrawn']))
      .orderBy('v.id')
      .limit(batch)
      .select('v.id', 'v.version', 'v.status', 'v.content_json', 'v.content_hash', 'r.number')) as {
      id: number;
      version: number;
      status: 'approved';
      content_json: string;
      content_hash: string | null;
      number: string;
    }[];
    if (rows.length === 0) return result;
    const signatures = await listSignatureRows(
      db,
      rows.map((r) => r.id),
    );
    for (const row of rows) {
      const integrity = versionIntegrity(
        row,
        signatures.filter((s) => s.version_id === row.id),
      );
      result.checked += 1;
      if (!integrity.ok) result.failures.push({ number: row.number, version: row.version, problems: integrity.problems });
    }
    afterId = rows.at(-1)!.id;
  }
}

export function describeSignedVersions(result: SignedVersionsResult): string {
  if (result.failures.length === 0) return `Signed content intact: ${result.checked} submitted versions match their hashes and signatures.`;
  const lines = result.failures.map((f) => `  ${f.number} v${f.version}: ${f.problems.join(' ')}`);
  return [`Signed content BROKEN: ${result.failures.length} of ${result.checked} submitted versions fail their integrity check:`, ...lines].join('\n');
}
