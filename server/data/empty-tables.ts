/**
 * Empties every table the app fills — `seed:large --replace` and the API tests' per-file
 * reset. TRUNCATE, not DELETE: the database refuses deleting submitted versions, signatures
 * and trail rows (triggers), and TRUNCATE fires none. It needs the foreign key checks off,
 * which is per connection: a transaction keeps the statements on one.
 */
import type { Knex } from 'knex';
import { DEFAULT_KERF_ALLOWANCE_MM, DEFAULT_WORN_DIAMETER_SHARE } from '../../migrations/20261205183547_insert_default_wheel_wear_and_kerf';
import { DEFAULT_POWER_WARNING_PCT, DEFAULT_SPECIFIC_ENERGY_J_MM3 } from '../../migrations/20261205183430_insert_default_cutting_energy';
import { feedLimitsFrom, STARTER_LONG_CONTACT_MM } from '../../migrations/20261205183803_insert_feed_limits';

/** Children first. lab_settings keeps its row; the counters go back to their start. */
const TABLES = [
  'mail_outbox',
  'review_reminders',
  'acknowledgements',
  'notification_opt_outs',
  'user_tokens',
  'user_machines',
  'sheet_prints',
  'cut_records',
  'signatures',
  'review_comments',
  'recipe_version_editors',
  'attachments',
  'recipe_versions',
  'recipes',
  'selection_rows',
  'materials',
  'wheels',
  'machines',
  'trail_events',
  'trail_seals',
  'sign_in_failures',
  'password_check_failures',
  'sessions',
  'user_roles',
  'users',
];

export async function emptyTables(db: Knex): Promise<void> {
  await db.transaction(async (trx) => {
    await trx.raw('SET FOREIGN_KEY_CHECKS = 0');
    try {
      for (const table of TABLES) await trx.raw('TRUNCATE TABLE ??', [table]);
    } finally {
      await trx.raw('SET FOREIGN_KEY_CHECKS = 1');
    }
  });
  await db('recipe_number_counter').update({ last_number: 0 });
  // The trail starts again from nothing: its chain head too, or the first new event would
  // link to a row that no longer exists (and the verification would rightly say so).
  await db('trail_chain_head').update({ last_event_id: 0, last_hash: '0'.repeat(64) });
}

/** The settings row as the migrations leave it. */
export async function restoreLabSettings(db: Knex): Promise<void> {
  await db('lab_settings')
    .where({ id: 1 })
    .update({
      lab_name: 'Our lab',
      review_interval_months: 24,
      sheet_paper: 'A4',
      default_units: 'metric',
      feed_limits_json: JSON.stringify(feedLimitsFrom({})),
      long_contact_mm: STARTER_LONG_CONTACT_MM,
      worn_diameter_share: DEFAULT_WORN_DIAMETER_SHARE,
      kerf_allowance_mm: DEFAULT_KERF_ALLOWANCE_MM,
      specific_energy_json: JSON.stringify(DEFAULT_SPECIFIC_ENERGY_J_MM3),
      power_warning_pct: DEFAULT_POWER_WARNING_PCT,
      date_format: 'iso',
      seal_interval_hours: 24,
      revision: 1,
      updated_at: new Date(),
    });
}
