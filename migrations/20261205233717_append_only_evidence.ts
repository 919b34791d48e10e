import type { Knex } from 'knex';

/**
 * The records that are evidence stay as written, whoever connects (21 CFR 11.10(e):
 * records are not obscured; ISO/IEC 17025 §7.5 and §8.4: technical records kept, changes
 * traceable): cut records, acknowledgements and sheet prints can no longer be changed or
 * deleted, like signatures and review comments (freeze migration) and the trail.
 *
 * - Cut records: the one change the app makes is clearing the flag of a cut that was not
 *   good (`POST /api/cuts/:id/clear-flag`): `flag_cleared_at` and `flag_cleared_by` go from
 *   empty to set, once, and every other column stays as it was. Nothing else is allowed.
 *   A column added to cut_records later must be added to the comparison below.
 * - A signature is written only together with the step it signs, in the app's order (the
 *   signature first, then the status change, in one transaction): "approved" on a version
 *   in review, "withdrawn" on an approved one, and always on the version's content hash.
 *   The status trigger (guard_version_workflow) asks for that signature in turn.
 *
 * Emptying tables (tests, `seed:large --replace`) uses TRUNCATE, which fires no trigger; a
 * restore loads each table's rows before its triggers. One statement per trigger, as in the
 * freeze migration; with binary logging on, creating triggers needs SUPER or
 * log_bin_trust_function_creators.
 */
const same = (column: string, binary = false) => (binary ? `BINARY NEW.${column} <=> BINARY OLD.${column}` : `NEW.${column} <=> OLD.${column}`);

const CUT_COLUMNS = ['id', 'version_id', 'recipe_id', 'quantity', 'operator_id', 'cut_at'];
const CUT_TEXT = ['specimen_id', 'part_ref', 'outcome', 'notes', 'operator_name'];

function refuse(table: string, event: 'UPDATE' | 'DELETE', message: string): [string, string] {
  const name = `${table}_refuse_${event.toLowerCase()}`;
  return [name, `CREATE TRIGGER ${name} BEFORE ${event} ON ${table} FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = '${message}'`];
}

const TRIGGERS: Record<string, string> = Object.fromEntries([
  [
    'cut_records_refuse_update',
    `CREATE TRIGGER cut_records_refuse_update BEFORE UPDATE ON cut_records FOR EACH ROW
     BEGIN
       IF NOT (OLD.flag_cleared_at IS NULL AND OLD.flag_cleared_by IS NULL AND OLD.outcome <> 'good'
               AND NEW.flag_cleared_at IS NOT NULL AND NEW.flag_cleared_by IS NOT NULL
               AND ${[...CUT_COLUMNS.map((c) => same(c)), ...CUT_TEXT.map((c) => same(c, true))].join(' AND ')})
       THEN
         SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'Kerfbook: cut records are permanent; only the flag of a cut that was not good can be cleared, once.';
       END IF;
     END`,
  ],
  refuse('cut_records', 'DELETE', 'Kerfbook: cut records are permanent and cannot be deleted.'),
  refuse('acknowledgements', 'UPDATE', 'Kerfbook: acknowledgements are permanent and cannot be changed.'),
  refuse('acknowledgements', 'DELETE', 'Kerfbook: acknowledgements are permanent and cannot be deleted.'),
  refuse('sheet_prints', 'UPDATE', 'Kerfbook: sheet prints are permanent records and cannot be changed.'),
  refuse('sheet_prints', 'DELETE', 'Kerfbook: sheet prints are permanent records and cannot be deleted.'),
  [
    'signatures_signed_step',
    `CREATE TRIGGER signatures_signed_step BEFORE INSERT ON signatures FOR EACH ROW
     BEGIN
       IF NOT EXISTS (SELECT 1 FROM recipe_versions v
                       WHERE v.id = NEW.version_id
                         AND v.status = CASE NEW.meaning WHEN 'approved' THEN 'in-review' WHEN 'withdrawn' THEN 'approved' END
                         AND BINARY v.content_hash = BINARY NEW.content_hash)
       THEN
         SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'Kerfbook: a signature is written only with the step it signs: approval of a version in review, withdrawal of an approved one, on its content hash.';
       END IF;
     END`,
  ],
]);

export async function up(knex: Knex): Promise<void> {
  for (const sql of Object.values(TRIGGERS)) await knex.raw(sql);
}

export async function down(knex: Knex): Promise<void> {
  for (const name of Object.keys(TRIGGERS).reverse()) await knex.raw(`DROP TRIGGER IF EXISTS ${name}`);
}
