import type { Knex } from 'knex';

/**
 * The library lists each recipe by its latest version. Joining 10,000 recipes to their
 * latest versions for every count read one wide version row per recipe (~25 ms, and a full
 * scan of `recipes` by EXPLAIN; `npm run bench`). The columns the library filters, sorts
 * and shows are kept on the recipe row instead (`lib_*`), narrow and indexed.
 *
 * The database keeps them, whatever path writes (app, seeds, the large data set): a recipe
 * whose latest version changes copies that version's columns (BEFORE INSERT / UPDATE on
 * recipes), and a change to the latest version's row copies itself over (AFTER UPDATE on
 * recipe_versions). Each trigger is one statement, as in the freeze migration; the same
 * note on binary logging applies.
 */
const COPIED = [
  ['title', 'lib_title'],
  ['version', 'lib_version'],
  ['status', 'lib_status'],
  ['worst_check', 'lib_worst_check'],
  ['material_group', 'lib_material_group'],
  ['material_id', 'lib_material_id'],
  ['shape', 'lib_shape'],
  ['size_min_mm', 'lib_size_min_mm'],
  ['size_max_mm', 'lib_size_max_mm'],
  ['hardness_min_hv', 'lib_hardness_min_hv'],
  ['hardness_max_hv', 'lib_hardness_max_hv'],
  ['machine_id', 'lib_machine_id'],
  ['wheel_id', 'lib_wheel_id'],
  ['updated_at', 'lib_updated_at'],
] as const;

// MariaDB takes no SELECT … INTO NEW.column: one primary-key subquery per column (only
// when the latest version changes, which is rare).
const copyLatest = () =>
  `SET ${COPIED.map(([v, r]) => `NEW.${r} = (SELECT ${v} FROM recipe_versions WHERE id = NEW.latest_version_id)`).join(', ')}`;

const TRIGGERS: Record<string, string> = {
  recipes_library_insert: `
    CREATE TRIGGER recipes_library_insert BEFORE INSERT ON recipes FOR EACH ROW
    BEGIN
      IF NEW.latest_version_id IS NOT NULL THEN
        ${copyLatest()};
      END IF;
    END`,
  recipes_library_update: `
    CREATE TRIGGER recipes_library_update BEFORE UPDATE ON recipes FOR EACH ROW
    BEGIN
      IF NOT (NEW.latest_version_id <=> OLD.latest_version_id) THEN
        IF NEW.latest_version_id IS NULL THEN
          SET ${COPIED.map(([, r]) => `NEW.${r} = NULL`).join(', ')};
        ELSE
          ${copyLatest()};
        END IF;
      END IF;
    END`,
  recipe_versions_library_update: `
    CREATE TRIGGER recipe_versions_library_update AFTER UPDATE ON recipe_versions FOR EACH ROW
      UPDATE recipes SET ${COPIED.map(([v, r]) => `${r} = NEW.${v}`).join(', ')} WHERE latest_version_id = NEW.id`,
};

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('recipes', (t) => {
    t.string('lib_title', 160).nullable();
    t.integer('lib_version').unsigned().nullable();
    t.enum('lib_status', ['draft', 'in-review', 'returned', 'approved', 'superseded', 'withdrawn']).nullable();
    t.enum('lib_worst_check', ['blocker', 'warning', 'note']).nullable();
    t.string('lib_material_group', 40).nullable();
    t.integer('lib_material_id').unsigned().nullable();
    t.string('lib_shape', 20).nullable();
    t.double('lib_size_min_mm').nullable();
    t.double('lib_size_max_mm').nullable();
    t.double('lib_hardness_min_hv').nullable();
    t.double('lib_hardness_max_hv').nullable();
    t.integer('lib_machine_id').unsigned().nullable();
    t.integer('lib_wheel_id').unsigned().nullable();
    t.datetime('lib_updated_at', { precision: 3 }).nullable();
    // One per way the library filters and sorts; a filter plus the sort column where both are common.
    t.index(['lib_material_group', 'lib_title'], 'recipes_lib_group_title');
    t.index(['lib_status', 'lib_updated_at'], 'recipes_lib_status_updated');
    // The finder-like filter (machine, size, hardness) counted from the index alone.
    t.index(['lib_machine_id', 'lib_size_max_mm', 'lib_size_min_mm', 'lib_hardness_min_hv', 'lib_hardness_max_hv'], 'recipes_lib_machine_size');
    t.index(['lib_shape'], 'recipes_lib_shape');
    t.index(['lib_title'], 'recipes_lib_title');
    t.index(['lib_updated_at'], 'recipes_lib_updated');
    t.index(['lib_size_max_mm'], 'recipes_lib_size_max');
  });
  await knex.raw(
    `UPDATE recipes r JOIN recipe_versions v ON v.id = r.latest_version_id SET ${COPIED.map(([v, r]) => `r.${r} = v.${v}`).join(', ')}`,
  );
  for (const sql of Object.values(TRIGGERS)) await knex.raw(sql);
}

export async function down(knex: Knex): Promise<void> {
  for (const name of Object.keys(TRIGGERS)) await knex.raw(`DROP TRIGGER IF EXISTS ${name}`);
  await knex.schema.alterTable('recipes', (t) => {
    for (const name of ['recipes_lib_group_title', 'recipes_lib_status_updated', 'recipes_lib_machine_size', 'recipes_lib_shape', 'recipes_lib_title', 'recipes_lib_updated', 'recipes_lib_size_max']) t.dropIndex([], name);
    for (const [, column] of COPIED) t.dropColumn(column);
  });
}
