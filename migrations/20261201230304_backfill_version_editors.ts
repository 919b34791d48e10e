import type { Knex } from 'knex';

/**
 * Fills recipe_version_editors for versions written before the table existed: the creator,
 * the last saver, and everyone the trail shows saving a draft or changing its photos.
 * Idempotent (INSERT IGNORE on the primary key).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    INSERT IGNORE INTO recipe_version_editors (version_id, user_id, first_edited_at, last_edited_at)
    SELECT id, created_by, created_at, updated_at FROM recipe_versions`);
  await knex.raw(`
    INSERT IGNORE INTO recipe_version_editors (version_id, user_id, first_edited_at, last_edited_at)
    SELECT id, updated_by, updated_at, updated_at FROM recipe_versions`);
  await knex.raw(`
    INSERT IGNORE INTO recipe_version_editors (version_id, user_id, first_edited_at, last_edited_at)
    SELECT v.id, a.actor_user_id, MIN(a.occurred_at), MAX(a.occurred_at)
      FROM audit_events a JOIN recipe_versions v ON v.id = CAST(a.entity_id AS UNSIGNED)
     WHERE a.event_type = 'recipe.draft_saved' AND a.entity_type = 'recipe_version' AND a.actor_user_id IS NOT NULL
     GROUP BY v.id, a.actor_user_id`);
  await knex.raw(`
    INSERT IGNORE INTO recipe_version_editors (version_id, user_id, first_edited_at, last_edited_at)
    SELECT v.id, a.actor_user_id, MIN(a.occurred_at), MAX(a.occurred_at)
      FROM audit_events a
      JOIN recipe_versions v ON v.id = CAST(JSON_VALUE(COALESCE(a.after_json, a.before_json), '$.versionId') AS UNSIGNED)
     WHERE a.event_type IN ('attachment.added', 'attachment.deleted') AND a.actor_user_id IS NOT NULL
     GROUP BY v.id, a.actor_user_id`);
}

export async function down(): Promise<void> {
  // The rows stay meaningful facts; dropping the table (previous migration's down) removes them.
}
