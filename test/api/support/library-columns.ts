import type { Knex } from 'knex';

const COPIED = ['title', 'version', 'status', 'worst_check', 'material_group', 'material_id', 'shape', 'size_min_mm', 'size_max_mm', 'hardness_min_hv', 'hardness_max_hv', 'machine_id', 'wheel_id', 'updated_at'];

/**
 * Numbers of the recipes whose library columns (`lib_*`, kept by triggers) differ from
 * their latest version's row — the triggers' promise, checked after real writes.
 */
export async function recipesWithStaleLibraryColumns(db: Knex): Promise<string[]> {
  const differs = COPIED.map((c) => `NOT (r.lib_${c} <=> v.${c})`).join(' OR ');
  const rows = (await db.raw(`SELECT r.number FROM recipes r JOIN recipe_versions v ON v.id = r.latest_version_id WHERE ${differs} ORDER BY r.id`)) as [{ number: string }[]];
  return rows[0].map((r) => r.number);
}

/**
 * Numbers of the recipes whose search words (`lib_search`, `current_search`, kept by
 * triggers) differ from what their latest and current versions say.
 */
export async function recipesWithStaleSearchWords(db: Knex): Promise<string[]> {
  const rows = (await db.raw(`
    SELECT r.number FROM recipes r
      JOIN recipe_versions lv ON lv.id = r.latest_version_id
      LEFT JOIN materials lm ON lm.id = lv.material_id
      LEFT JOIN recipe_versions cv ON cv.id = r.current_version_id
      LEFT JOIN materials cm ON cm.id = cv.material_id
    WHERE NOT (r.lib_search <=> CONCAT_WS(' ', r.number, lv.title, lm.name, lm.designation))
       OR NOT (r.current_search <=> IF(cv.id IS NULL, NULL, CONCAT_WS(' ', r.number, cv.title, cm.name, cm.designation)))
    ORDER BY r.id`)) as [{ number: string }[]];
  return rows[0].map((r) => r.number);
}
