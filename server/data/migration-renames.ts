/**
 * Names the migrations had before they were renamed to the moment each was written, in
 * the order they run (unchanged by the rename). A database migrated under the old names
 * keeps its rows: migrate() renames them before Knex compares the table with the folder.
 * Fixed once: a name in the right-hand column is final, as is every name that came later.
 */
export const MIGRATION_RENAMES: ReadonlyArray<readonly [from: string, to: string]> = [
  ['20261201120000_create_users.ts', '20261201220511_create_users.ts'],
  ['20261201120100_create_sessions.ts', '20261201220512_create_sessions.ts'],
  ['20261201120200_create_sign_in_failures.ts', '20261201220513_create_sign_in_failures.ts'],
  ['20261201120300_create_audit_events.ts', '20261201220514_create_audit_events.ts'],
  ['20261201120400_create_lab_settings.ts', '20261201220515_create_lab_settings.ts'],
  ['20261201120500_insert_default_lab_settings.ts', '20261201220516_insert_default_lab_settings.ts'],
  ['20261208090000_create_stock.ts', '20261201222728_create_stock.ts'],
  ['20261208090100_add_feed_ceilings_to_lab_settings.ts', '20261201222729_add_feed_ceilings_to_lab_settings.ts'],
  ['20261208090200_insert_default_feed_ceilings.ts', '20261201222730_insert_default_feed_ceilings.ts'],
  ['20261208090300_create_recipes.ts', '20261201222731_create_recipes.ts'],
  ['20261208090400_insert_recipe_number_counter.ts', '20261201222732_insert_recipe_number_counter.ts'],
  ['20261208090500_create_attachments.ts', '20261201222733_create_attachments.ts'],
  ['20261215090000_chain_audit_events.ts', '20261201230150_chain_audit_events.ts'],
  ['20261216100000_create_review_workflow.ts', '20261201230303_create_review_workflow.ts'],
  ['20261216100100_backfill_version_editors.ts', '20261201230304_backfill_version_editors.ts'],
  ['20261216100200_freeze_submitted_versions.ts', '20261201230305_freeze_submitted_versions.ts'],
  ['20261222090000_add_check_codes.ts', '20261201234345_add_check_codes.ts'],
  ['20261222090100_backfill_check_codes.ts', '20261201234346_backfill_check_codes.ts'],
  ['20261222090200_create_sheet_prints.ts', '20261201234347_create_sheet_prints.ts'],
  ['20261222100000_create_cut_records.ts', '20261201234348_create_cut_records.ts'],
  ['20261229090000_create_mail_outbox.ts', '20261202000010_create_mail_outbox.ts'],
  ['20270105090000_create_mail_features.ts', '20261202003506_create_mail_features.ts'],
  ['20270112090000_add_cut_records_flagged_index.ts', '20261202013423_add_cut_records_flagged_index.ts'],
  ['20270113090000_keep_library_columns_on_recipes.ts', '20261202022722_keep_library_columns_on_recipes.ts'],
  ['20270201090000_search_words_on_recipes.ts', '20261202030504_search_words_on_recipes.ts'],
];

const NEW_NAME = new Map(MIGRATION_RENAMES);

/** Today's name of a migration recorded under `name` (the name itself when it was not renamed). */
export function currentMigrationName(name: string): string {
  return NEW_NAME.get(name) ?? name;
}
