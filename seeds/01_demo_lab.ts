import type { Knex } from 'knex';
import { DEMO_LAB_NAME } from './data/demo-accounts';

/** The invented lab's name on the settings row the migrations created — only if nobody renamed it. */
export async function seed(knex: Knex): Promise<void> {
  await knex('lab_settings').where({ id: 1, lab_name: 'Our lab' }).update({ lab_name: DEMO_LAB_NAME, updated_at: new Date() });
}
