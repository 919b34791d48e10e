import type { Knex } from 'knex';

/**
 * Submitted content is frozen by the database, not only by the API (ISO/IEC 17025
 * §7.11, 21 CFR 11.10(e)): once a version has a content hash, MariaDB itself refuses
 * to change its content, title or identity, or to delete it; signatures and review comments
 * are never changed or deleted; photos of a frozen version are never added, changed or
 * removed. Workflow columns (status, revision, dates) stay writable.
 *
 * The one way back is the workflow's own: a returned version that its author edits again
 * becomes a draft, and that single UPDATE clears the hash together with the new content.
 *
 * Each trigger is one statement (Knex sends statements one by one; no DELIMITER is
 * needed through the driver). The local MariaDB runs with --skip-log-bin, so creating
 * triggers needs no SUPER privilege; a server with binary logging on needs
 * log_bin_trust_function_creators=1 (or SUPER) for the migration user.
 *
 * Text is compared as BINARY: the columns' collation is case-insensitive, and a change of
 * case is a change of content.
 */
const TRIGGERS: Record<string, string> = {
  recipe_versions_frozen_update: `
    CREATE TRIGGER recipe_versions_frozen_update BEFORE UPDATE ON recipe_versions FOR EACH ROW
    BEGIN
      IF OLD.content_hash IS NOT NULL
         AND (NOT (BINARY NEW.content_json <=> BINARY OLD.content_json)
              OR NOT (NEW.content_hash <=> OLD.content_hash)
              OR NOT (BINARY NEW.title <=> BINARY OLD.title)
              OR NEW.recipe_id <> OLD.recipe_id
              OR NEW.version <> OLD.version)
         AND NOT (OLD.status = 'returned' AND NEW.status = 'draft' AND NEW.content_hash IS NULL)
      THEN
        SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'Kerfbook: this recipe version was submitted; its content is frozen and cannot be changed.';
      END IF;
    END`,
  recipe_versions_frozen_delete: `
    CREATE TRIGGER recipe_versions_frozen_delete BEFORE DELETE ON recipe_versions FOR EACH ROW
    BEGIN
      IF OLD.content_hash IS NOT NULL THEN
        SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'Kerfbook: this recipe version was submitted; it cannot be deleted.';
      END IF;
    END`,
  signatures_no_update: `
    CREATE TRIGGER signatures_no_update BEFORE UPDATE ON signatures FOR EACH ROW
    BEGIN
      SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'Kerfbook: signatures are permanent and cannot be changed.';
    END`,
  signatures_no_delete: `
    CREATE TRIGGER signatures_no_delete BEFORE DELETE ON signatures FOR EACH ROW
    BEGIN
      SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'Kerfbook: signatures are permanent and cannot be deleted.';
    END`,
  review_comments_no_update: `
    CREATE TRIGGER review_comments_no_update BEFORE UPDATE ON review_comments FOR EACH ROW
    BEGIN
      SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'Kerfbook: review comments are permanent and cannot be changed.';
    END`,
  review_comments_no_delete: `
    CREATE TRIGGER review_comments_no_delete BEFORE DELETE ON review_comments FOR EACH ROW
    BEGIN
      SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'Kerfbook: review comments are permanent and cannot be deleted.';
    END`,
  attachments_frozen_insert: `
    CREATE TRIGGER attachments_frozen_insert BEFORE INSERT ON attachments FOR EACH ROW
    BEGIN
      IF (SELECT content_hash FROM recipe_versions WHERE id = NEW.version_id) IS NOT NULL THEN
        SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'Kerfbook: this recipe version was submitted; photos cannot be added to it.';
      END IF;
    END`,
  attachments_frozen_update: `
    CREATE TRIGGER attachments_frozen_update BEFORE UPDATE ON attachments FOR EACH ROW
    BEGIN
      IF (SELECT content_hash FROM recipe_versions WHERE id = OLD.version_id) IS NOT NULL
         OR (SELECT content_hash FROM recipe_versions WHERE id = NEW.version_id) IS NOT NULL THEN
        SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'Kerfbook: this recipe version was submitted; its photos cannot be changed.';
      END IF;
    END`,
  attachments_frozen_delete: `
    CREATE TRIGGER attachments_frozen_delete BEFORE DELETE ON attachments FOR EACH ROW
    BEGIN
      IF (SELECT content_hash FROM recipe_versions WHERE id = OLD.version_id) IS NOT NULL THEN
        SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'Kerfbook: this recipe version was submitted; its photos cannot be removed.';
      END IF;
    END`,
};

export async function up(knex: Knex): Promise<void> {
  for (const sql of Object.values(TRIGGERS)) await knex.raw(sql);
}

export async function down(knex: Knex): Promise<void> {
  for (const name of Object.keys(TRIGGERS).reverse()) await knex.raw(`DROP TRIGGER IF EXISTS ${name}`);
}
