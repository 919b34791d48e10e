import type { Knex } from 'knex';

/**
 * The library's text search read every recipe row (LIKE '%…%' on four columns of two
 * tables: a full scan by EXPLAIN, `npm run bench`). Each recipe now keeps the words it
 * is found by — number, title, material name and designation — once for its latest
 * version (`lib_search`, the library) and once for its current version
 * (`current_search`, the operators' view), each under a FULLTEXT index. Within a group
 * and machine the search reads those rows by their index instead (LIKE ' word%').
 *
 * The database keeps them whatever path writes, as with the library columns: BEFORE
 * triggers on recipes that run after the library-column triggers (FOLLOWS), and an
 * AFTER UPDATE trigger on materials for a renamed material. Current versions are frozen
 * (approved), so a current version's title never changes under its recipe.
 */
/**
 * The words of a text as the search reads them: letters, digits and underscores, each
 * run of anything else one space, and a space in front — so " word%" under LIKE is
 * "a word starts with", and the FULLTEXT parser cuts exactly these words.
 */
const words = (text: string) => `CONCAT(' ', REGEXP_REPLACE(${text}, '[^\\\\p{L}\\\\p{N}_]+', ' '))`;

const LATEST_WORDS = words(`CONCAT_WS(' ', NEW.number, NEW.lib_title,
  (SELECT CONCAT_WS(' ', m.name, m.designation) FROM materials m WHERE m.id = NEW.lib_material_id))`);
const CURRENT_WORDS = `(SELECT ${words(`CONCAT_WS(' ', NEW.number, v.title, m.name, m.designation)`)}
  FROM recipe_versions v LEFT JOIN materials m ON m.id = v.material_id WHERE v.id = NEW.current_version_id)`;

const TRIGGERS: Record<string, string> = {
  recipes_search_insert: `
    CREATE TRIGGER recipes_search_insert BEFORE INSERT ON recipes FOR EACH ROW FOLLOWS recipes_library_insert
    SET NEW.lib_search = ${LATEST_WORDS}, NEW.current_search = ${CURRENT_WORDS}`,
  recipes_search_update: `
    CREATE TRIGGER recipes_search_update BEFORE UPDATE ON recipes FOR EACH ROW FOLLOWS recipes_library_update
    BEGIN
      IF NOT (NEW.number <=> OLD.number AND NEW.lib_title <=> OLD.lib_title AND NEW.lib_material_id <=> OLD.lib_material_id) THEN
        SET NEW.lib_search = ${LATEST_WORDS};
      END IF;
      IF NOT (NEW.number <=> OLD.number AND NEW.current_version_id <=> OLD.current_version_id) THEN
        SET NEW.current_search = ${CURRENT_WORDS};
      END IF;
    END`,
  // Rare (an admin renames a material): the current-version update reads versions by material.
  materials_search_update: `
    CREATE TRIGGER materials_search_update AFTER UPDATE ON materials FOR EACH ROW
    BEGIN
      IF NOT (NEW.name <=> OLD.name AND NEW.designation <=> OLD.designation) THEN
        UPDATE recipes SET lib_search = ${words(`CONCAT_WS(' ', number, lib_title, NEW.name, NEW.designation)`)}
          WHERE lib_material_id = NEW.id;
        UPDATE recipes r JOIN recipe_versions v ON v.id = r.current_version_id
          SET r.current_search = ${words(`CONCAT_WS(' ', r.number, v.title, NEW.name, NEW.designation)`)}
          WHERE v.material_id = NEW.id;
      END IF;
    END`,
};

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('recipes', (t) => {
    t.string('lib_search', 700).nullable();
    t.string('current_search', 700).nullable();
    t.index(['lib_material_id'], 'recipes_lib_material');
    // A search within a group and machine reads these instead: its rows in title order,
    // and its count from the index alone (700 characters fit InnoDB's 3072-byte key).
    t.index(['lib_material_group', 'lib_machine_id', 'lib_title'], 'recipes_lib_group_machine_title');
    t.index(['lib_material_group', 'lib_machine_id', 'lib_search'], 'recipes_lib_group_machine_search');
  });
  await knex.raw(`
    UPDATE recipes r LEFT JOIN materials m ON m.id = r.lib_material_id
    SET r.lib_search = ${words(`CONCAT_WS(' ', r.number, r.lib_title, m.name, m.designation)`)}`);
  await knex.raw(`
    UPDATE recipes r
      JOIN recipe_versions v ON v.id = r.current_version_id
      LEFT JOIN materials m ON m.id = v.material_id
    SET r.current_search = ${words(`CONCAT_WS(' ', r.number, v.title, m.name, m.designation)`)}`);
  // Every word is indexed, however common ("in", "for"). The session setting covers this
  // build only; later rebuilds (TRUNCATE, a restore) follow the server's, and
  // server/data/search-words.ts reads a server's stopwords by LIKE.
  await knex.raw('SET SESSION innodb_ft_enable_stopword = OFF');
  await knex.raw('CREATE FULLTEXT INDEX recipes_lib_search ON recipes (lib_search)');
  await knex.raw('CREATE FULLTEXT INDEX recipes_current_search ON recipes (current_search)');
  for (const sql of Object.values(TRIGGERS)) await knex.raw(sql);
}

export async function down(knex: Knex): Promise<void> {
  for (const name of Object.keys(TRIGGERS)) await knex.raw(`DROP TRIGGER IF EXISTS ${name}`);
  await knex.schema.alterTable('recipes', (t) => {
    t.dropIndex([], 'recipes_lib_search');
    t.dropIndex([], 'recipes_current_search');
    t.dropIndex([], 'recipes_lib_material');
    t.dropIndex([], 'recipes_lib_group_machine_title');
    t.dropIndex([], 'recipes_lib_group_machine_search');
    t.dropColumn('lib_search');
    t.dropColumn('current_search');
  });
}
