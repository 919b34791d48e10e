import type { Knex } from 'knex';

/** Data: the settings row every install needs. Idempotent, so a re-run changes nothing. */
export async function up(knex: Knex): Promise<void> {
  const existing = await knex('lab_settings').where({ id: 1 }).first();
  if (existing) return;
  await knex('lab_settings').insert({
    id: 1,
    lab_name: 'Our lab',
    review_interval_months: 24,
    sheet_paper: 'A4',
    default_units: 'metric',
    updated_at: new Date(),
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex('lab_settings').where({ id: 1 }).del();
}
