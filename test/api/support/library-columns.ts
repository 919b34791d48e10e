import type { Knex } from 'knex';

const COPIED = [
  'title',
  'version',
  'status',
  'worst_check',
  'material_group',
  'material_id',
  'shape',
  'size_min_mm',
  'size_max_mm',
  'hardness_min_hv',
  'hardness_max_hv',
  'machine_id',
  'wheel_id',
  'updated_at',
];

/**
 * Numbers of the recipes whose library columns (`lib_*`, kept by triggers) differ from
 * their latest version's row — the triggers' promise, checked after real writes.
 */
export async function recipesWithStaleLibraryColumns(db: Knex): Promise<string[]> {
  const differs = COPIED.map((c) => `NOT (r.lib_${c} <=> v.${c})`).join(' OR ');
  const rows = (await db.raw(`SELECT r.number FROM recipes r JOIN recipe_versions v ON v.id = r.latest_version_id WHERE ${differs} ORDER BY r.id`)) as [
    { number: string }[],
  ];
  return rows[0].map((r) => r.number);
}

/** The kept search text of the given parts, normalized independently of the migration's SQL. */
function keptWords(...parts: (string | null)[]): string {
  return ` ${parts
    .filter((p) => p !== null)
    .join(' ')
    .split(/[^\p{L}\p{N}_]+/u)
    .join(' ')}`;
}

/**
 * Numbers of the recipes whose search words (`lib_search`, `current_search`, kept by
 * triggers) differ from what their latest and current versions say.
 */
export async function recipesWithStaleSearchWords(db: Knex): Promise<string[]> {
  type Row = {
    number: string;
    lib_search: string | null;
    current_search: string | null;
    lt: string;
    ln: string | null;
    ld: string | null;
    ct: string | null;
    cn: string | null;
    cd: string | null;
  };
  const [rows] = (await db.raw(`
    SELECT r.number, r.lib_search, r.current_search, lv.title AS lt, lm.name AS ln, lm.designation AS ld, cv.title AS ct, cm.name AS cn, cm.designation AS cd
    FROM recipes r
      JOIN recipe_versions lv ON lv.id = r.latest_version_id
      LEFT JOIN materials lm ON lm.id = lv.material_id
      LEFT JOIN recipe_versions cv ON cv.id = r.current_version_id
      LEFT JOIN materials cm ON cm.id = cv.material_id
    ORDER BY r.id`)) as [Row[]];
  return rows
    .filter(
      (r) => r.lib_search !== keptWords(r.number, r.lt, r.ln, r.ld) || r.current_search !== (r.ct === null ? null : keptWords(r.number, r.ct, r.cn, r.cd)),
    )
    .map((r) => r.number);
}
