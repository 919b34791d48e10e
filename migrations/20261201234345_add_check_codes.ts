import type { Knex } from 'knex';

/**
 * The check code of an approved version, which tells whoever holds a printed sheet whether
 * it is still current (/check/CODE): 8 Crockford base32 characters, stored uppercase
 * without the dash and printed as XXXX-XXXX on the bench sheet with its QR code. Null
 * until the version is approved. Binary collation so the unique index compares the exact
 * characters.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('recipe_versions', (t) => {
    t.string('check_code', 8).nullable().collate('utf8mb4_bin');
    t.unique(['check_code'], { indexName: 'recipe_versions_check_code_unique' });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('recipe_versions', (t) => {
    t.dropUnique(['check_code'], 'recipe_versions_check_code_unique');
    t.dropColumn('check_code');
  });
}
