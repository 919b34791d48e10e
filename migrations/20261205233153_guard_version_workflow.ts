import type { Knex } from 'knex';

/**
 * The workflow held by the database, not only by the API (21 CFR 11.10(f): enforced
 * sequencing of steps; ISO/IEC 17025 §8.3): whoever can write to `recipe_versions` still
 * cannot walk an approved version back to returned, edit it as a draft and approve it again
 * with a new hash.
 *
 * - A status moves only as the app moves it (server/services/recipes/workflow.ts and
 *   supersession.ts): draft → in-review (submit), in-review → returned or approved,
 *   returned → draft (the author's edit), approved → superseded or withdrawn; nothing
 *   leaves superseded or withdrawn. Updates that keep the status (a draft's save, the
 *   revision bump, a check code, dates) are not status changes.
 * - Submitting stores the SHA-256 of the content as its hash, in the same statement.
 * - Approval and withdrawal need their signature (meaning "approved" / "withdrawn", bound to
 *   the version's content hash), which the app inserts first in the same transaction.
 * - Once a version has left draft, the columns copied out of its content — what the Finder,
 *   the library and operators' acknowledgements read: machine, wheel, material, shape, size
 *   window, hardness — and its checks (`checks_json`, `worst_check`) freeze with the content
 *   (the content, hash and title are frozen since the freeze migration). Two steps still
 *   write them: the author's edit of a returned version, which makes it a draft without a
 *   hash in the same statement, and approval (in-review → approved), which stores the checks
 *   as the approver saw them against today's stock.
 *
 * One statement per trigger, sent as is through the driver (no DELIMITER); it runs after
 * the freeze trigger. Text is compared as BINARY (the collation ignores case). With binary
 * logging on, creating triggers needs SUPER or log_bin_trust_function_creators.
 */
const COPIED_FROM_CONTENT = ['machine_id', 'wheel_id', 'material_id', 'size_min_mm', 'size_max_mm', 'hardness_min_hv', 'hardness_max_hv'];
const COPIED_TEXT = ['material_group', 'shape'];

const changed = (column: string, binary = false) =>
  binary ? `NOT (BINARY NEW.${column} <=> BINARY OLD.${column})` : `NOT (NEW.${column} <=> OLD.${column})`;

const hasSignature = (meaning: string) =>
  `EXISTS (SELECT 1 FROM signatures s WHERE s.version_id = NEW.id AND s.meaning = '${meaning}' AND BINARY s.content_hash = BINARY NEW.content_hash)`;

const TRIGGERS: Record<string, string> = {
  recipe_versions_workflow_update: `
    CREATE TRIGGER recipe_versions_workflow_update BEFORE UPDATE ON recipe_versions FOR EACH ROW FOLLOWS recipe_versions_frozen_update
    BEGIN
      DECLARE message VARCHAR(200);
      IF NEW.status <> OLD.status
         AND NOT ((OLD.status = 'draft' AND NEW.status = 'in-review')
               OR (OLD.status = 'in-review' AND NEW.status IN ('returned', 'approved'))
               OR (OLD.status = 'returned' AND NEW.status = 'draft')
               OR (OLD.status = 'approved' AND NEW.status IN ('superseded', 'withdrawn')))
      THEN
        SET message = CONCAT('Kerfbook: a recipe version cannot go from ', OLD.status, ' to ', NEW.status, '; the workflow does not allow that step.');
        SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = message;
      END IF;
      IF OLD.status = 'draft' AND NEW.status = 'in-review'
         AND NOT (BINARY NEW.content_hash <=> BINARY SHA2(NEW.content_json, 256))
      THEN
        SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'Kerfbook: a version is submitted with the SHA-256 of its content as its content hash.';
      END IF;
      IF OLD.status <> 'draft'
         AND NOT (OLD.status = 'returned' AND NEW.status = 'draft' AND NEW.content_hash IS NULL)
         AND (${[...COPIED_FROM_CONTENT.map((c) => changed(c)), ...COPIED_TEXT.map((c) => changed(c, true))].join('\n              OR ')}
              OR ((${changed('worst_check')} OR ${changed('checks_json', true)})
                  AND NOT (OLD.status = 'in-review' AND NEW.status = 'approved')))
      THEN
        SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'Kerfbook: this recipe version was submitted; its machine, wheel, material, size window and checks are frozen with its content.';
      END IF;
      IF OLD.status = 'in-review' AND NEW.status = 'approved' AND NOT ${hasSignature('approved')} THEN
        SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'Kerfbook: a version is approved only together with its approval signature on the same content.';
      END IF;
      IF OLD.status = 'approved' AND NEW.status = 'withdrawn' AND NOT ${hasSignature('withdrawn')} THEN
        SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'Kerfbook: a version is withdrawn only together with its withdrawal signature on the same content.';
      END IF;
    END`,
};

export async function up(knex: Knex): Promise<void> {
  for (const sql of Object.values(TRIGGERS)) await knex.raw(sql);
}

export async function down(knex: Knex): Promise<void> {
  for (const name of Object.keys(TRIGGERS).reverse()) await knex.raw(`DROP TRIGGER IF EXISTS ${name}`);
}
