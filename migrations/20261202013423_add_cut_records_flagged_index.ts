import type { Knex } from 'knex';

/**
 * Flagged cuts not yet cleared (outcome other than good, flag_cleared_at null): the
 * author's Today list (flaggedCutRows in server/data/cuts.ts) looks for them across every
 * recipe. Without this index MariaDB read all recipes and probed each one's cuts — a full
 * scan found by `npm run bench`'s EXPLAIN check on 10,000 recipes and 100,000 cuts. With it,
 * "flag_cleared_at IS NULL and outcome <> 'good'" is two short ranges of one index.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('cut_records', (t) => {
    t.index(['flag_cleared_at', 'outcome'], 'cut_records_flagged_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('cut_records', (t) => {
    t.dropIndex(['flag_cleared_at', 'outcome'], 'cut_records_flagged_index');
  });
}
