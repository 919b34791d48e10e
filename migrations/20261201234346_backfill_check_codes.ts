import { randomInt } from 'node:crypto';
import type { Knex } from 'knex';

/**
 * Gives every version approved before check codes existed (approved, superseded or
 * withdrawn) its code. Idempotent: versions that have one keep it. The generator is
 * copied here on purpose: a migration must not change when the service's code changes.
 */
const ALPHABET = '0123456789ABCDEFGHJKMNPQRSTVWXYZ';

function newCode(): string {
  let code = '';
  for (let i = 0; i < 8; i += 1) code += ALPHABET[randomInt(ALPHABET.length)];
  return code;
}

export async function up(knex: Knex): Promise<void> {
  const rows = (await knex('recipe_versions')
    .whereIn('status', ['approved', 'superseded', 'withdrawn'])
    .whereNull('check_code')
    .select('id')
    .orderBy('id')) as { id: number }[];
  const taken = new Set(((await knex('recipe_versions').whereNotNull('check_code').select('check_code')) as { check_code: string }[]).map((r) => r.check_code));
  for (const { id } of rows) {
    let code = newCode();
    while (taken.has(code)) code = newCode();
    taken.add(code);
    // Only the workflow column changes: the frozen-content trigger lets it through.
    await knex('recipe_versions').where({ id }).whereNull('check_code').update({ check_code: code });
  }
}

export async function down(): Promise<void> {
  // Nothing to undo: the previous migration's down drops the column.
}
