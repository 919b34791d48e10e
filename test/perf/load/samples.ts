/**
 * Real values from the bench database to put in requests: filters that match something,
 * a version with cuts, a specimen, the trail's id range. Read once, in-process.
 */
import type { Knex } from 'knex';

export interface Samples {
  /** Library filters that each match some recipes: a material group with one of its machines. */
  filters: { group: string; machineId: number; q: string }[];
  /** Approved current versions (for sheets and acknowledgements). */
  currentVersions: { recipeId: number; version: number }[];
  /** A version with cut records, and one of its specimens. */
  versionWithCuts: { recipeId: number; version: number } | null;
  specimenId: string | null;
  /** Any recipe with more than one version. */
  anyRecipeId: number;
  actorUserId: number | null;
  eventType: string;
  trail: { minId: number; maxId: number; count: number };
}

/** Words that occur in titles: the search text of a library query. */
function titleWords(titles: string[]): string[] {
  const words = new Set<string>();
  for (const t of titles) for (const w of t.split(/[^\p{L}\p{N}]+/u)) if (w.length >= 4) words.add(w.toLowerCase());
  return [...words].slice(0, 40);
}

export async function readSamples(db: Knex): Promise<Samples> {
  const pairs = (await db('recipes as r')
    .join('recipe_versions as v', 'v.id', 'r.latest_version_id')
    .groupBy('v.material_group', 'v.machine_id')
    .orderByRaw('count(*) desc')
    .limit(20)
    .select('v.material_group as grp', 'v.machine_id as machineId')) as { grp: string; machineId: number }[];
  const titles = ((await db('recipes').orderBy('id', 'desc').limit(300).pluck('title')) as string[]).filter((t) => !t.startsWith('Bench'));
  const words = titleWords(titles);
  if (pairs.length === 0 || words.length === 0) throw new Error('The bench database has no recipes to search.');
  const filters = pairs.flatMap((p, i) => [0, 1].map((k) => ({ group: p.grp, machineId: Number(p.machineId), q: words[(i * 2 + k) % words.length]! })));

  const currentVersions = (
    (await db('recipes as r')
      .join('recipe_versions as v', 'v.id', 'r.current_version_id')
      .where('v.status', 'approved')
      .orderBy('r.id')
      .limit(40)
      .select('r.id as recipeId', 'v.version')) as { recipeId: number; version: number }[]
  ).map((r) => ({ recipeId: Number(r.recipeId), version: Number(r.version) }));

  const cut = (await db('cut_records as c')
    .join('recipe_versions as v', 'v.id', 'c.version_id')
    .orderBy('c.id', 'desc')
    .first('v.recipe_id', 'v.version', 'c.specimen_id')) as { recipe_id: number; version: number; specimen_id: string } | undefined;
  const multi = (await db('recipe_versions').where('version', 2).orderBy('id').first('recipe_id')) as { recipe_id: number } | undefined;
  const actor = (await db('trail_events').whereNotNull('actor_user_id').orderBy('id', 'desc').first('actor_user_id', 'event_type')) as
    { actor_user_id: number; event_type: string } | undefined;
  const range = (await db('trail_events').min({ minId: 'id' }).max({ maxId: 'id' }).first()) as { minId: number | null; maxId: number | null };
  const count = (await db('trail_chain_head').where({ id: 1 }).first('last_event_id')) as { last_event_id: number } | undefined;

  return {
    filters,
    currentVersions,
    versionWithCuts: cut ? { recipeId: Number(cut.recipe_id), version: Number(cut.version) } : null,
    specimenId: cut?.specimen_id ?? null,
    anyRecipeId: Number(multi?.recipe_id ?? currentVersions[0]?.recipeId ?? 1),
    actorUserId: actor ? Number(actor.actor_user_id) : null,
    eventType: actor?.event_type ?? 'sheet.printed',
    trail: { minId: Number(range.minId ?? 0), maxId: Number(range.maxId ?? 0), count: Number(count?.last_event_id ?? 0) },
  };
}
