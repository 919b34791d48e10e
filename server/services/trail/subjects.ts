/**
 * The trail's "What": each event's record named as people know it (KB-0017 v1, the person's
 * name, the material's name). Names are looked up once per kind of record on a page; a
 * record that is gone (a deleted material) keeps the name its event recorded.
 */
import type { Knex } from 'knex';
import type { TrailEventDto } from '../../../shared/recipe-types';
import { MATERIAL_GROUP_LABELS, type MaterialGroup, TRAIL_ENTITY_LABELS } from '../../../shared/vocabulary';
import { attachmentNames, personNames, recipeNumbers, selectionRowNames, stockNames, versionNames } from '../../data/trail-subjects';

type Event = Pick<TrailEventDto, 'entityType' | 'entityId' | 'before' | 'after'>;

const key = (entityType: string, id: number | string) => `${entityType}:${id}`;

/** The ids of one kind of record on the page. */
function idsOf(events: Event[], entityType: string): number[] {
  const ids = events.filter((e) => e.entityType === entityType && e.entityId !== null).map((e) => Number(e.entityId));
  return [...new Set(ids.filter((id) => Number.isSafeInteger(id) && id > 0))];
}

/** A name the event itself recorded, for records that no longer exist. */
function recordedName(e: Event): string | null {
  for (const side of [e.after, e.before]) {
    if (typeof side !== 'object' || side === null) continue;
    const s = side as Record<string, unknown>;
    for (const field of ['name', 'displayName', 'number', 'fileName']) {
      if (typeof s[field] === 'string' && s[field] !== '') return s[field];
    }
  }
  return null;
}

/** A stand-in when no name can be found: the kind of record and its id. */
export function fallbackWhat(e: Pick<Event, 'entityType' | 'entityId'>): string {
  const label = TRAIL_ENTITY_LABELS[e.entityType] ?? e.entityType;
  return e.entityId ? `${label} · id ${e.entityId}` : label;
}

/** Names for every event of a page, in order. */
export async function nameSubjects(db: Knex, events: Event[]): Promise<string[]> {
  const names = new Map<string, string>();
  const [recipes, versions, photos, materials, wheels, machines, rows, people] = await Promise.all([
    recipeNumbers(db, idsOf(events, 'recipe')),
    versionNames(db, idsOf(events, 'recipe_version')),
    attachmentNames(db, idsOf(events, 'attachment')),
    stockNames(db, 'materials', idsOf(events, 'material')),
    stockNames(db, 'wheels', idsOf(events, 'wheel')),
    stockNames(db, 'machines', idsOf(events, 'machine')),
    selectionRowNames(db, idsOf(events, 'selection_row')),
    personNames(db, idsOf(events, 'user')),
  ]);
  for (const r of recipes) names.set(key('recipe', r.id), `${r.number} · ${r.title}`);
  for (const v of versions) names.set(key('recipe_version', v.id), `${v.number} v${v.version}`);
  for (const a of photos) names.set(key('attachment', a.id), `${a.file_name} · ${a.number} v${a.version}`);
  for (const m of materials) names.set(key('material', m.id), m.name);
  for (const w of wheels) names.set(key('wheel', w.id), w.name);
  for (const m of machines) names.set(key('machine', m.id), m.name);
  for (const s of rows)
    names.set(key('selection_row', s.id), `${MATERIAL_GROUP_LABELS[s.material_group as MaterialGroup] ?? s.material_group} → ${s.wheel_name}`);
  for (const p of people) names.set(key('user', p.id), p.display_name);
  return events.map((e) => (e.entityId !== null && names.get(key(e.entityType, Number(e.entityId)))) || recordedName(e) || fallbackWhat(e));
}
