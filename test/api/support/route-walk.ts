/**
 * Walking the real route table (server/web/routes.ts): throw-away records the paths point
 * at, a concrete path for every route, and a recorder of which table lines really got
 * through to their own step (validation, then handler). Used by the role walk, the access
 * tests and the API fuzzer.
 */
import type { Knex } from 'knex';
import sharp from 'sharp';
import { CSRF_HEADER } from '../../../shared/api-types';
import type { RouteDefinition } from '../../../server/web/route-definition';
import { routes } from '../../../server/web/routes';
import { startValidationRecording } from '../../../server/web/validation-recorder';
import { createRecipe } from '../../../server/services/recipes/recipes';
import { createSelectionRow } from '../../../server/services/stock/selection-rows';
import { addAttachment } from '../../../server/services/recipes/attachments';
import { insertCut } from '../../../server/data/cuts';
import { createPerson, type TestPerson } from './people';
import { createStockSet, recipeInput } from './stock';
import type { Agent } from './test-app';

/** Existing records the walk's paths point at, so handlers really run (not only 404). */
export interface Targets {
  user: number;
  material: number;
  wheel: number;
  machine: number;
  selectionRow: number;
  recipe: number;
  attachment: number;
  cut: number;
}

/** The records behind `Targets`: an operator, stock, a selection row, a draft recipe with a photo, a flagged cut. */
export async function createTargets(db: Knex): Promise<Targets & { targetPerson: TestPerson }> {
  const targetPerson = await createPerson(db, { roles: ['operator'] });
  const writer = await createPerson(db, { roles: ['author'] });
  const actor = { userId: writer.id, name: writer.displayName, clientAddress: '' };
  const stock = await createStockSet(db);
  const row = await createSelectionRow(db, actor, { group: 'copper', hardness: null, wheelId: stock.wheel.id, note: '' });
  const recipe = await createRecipe(db, actor, recipeInput(stock));
  const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#808080' } })
    .png()
    .toBuffer();
  const attachment = await addAttachment(
    db,
    actor,
    recipe.recipeId,
    1,
    { role: 'setup', caption: '' },
    { bytes: png, fileName: 'walk.png', declaredType: 'image/png' },
  );
  return {
    targetPerson,
    user: targetPerson.id,
    material: stock.material.id,
    wheel: stock.wheel.id,
    machine: stock.machine.id,
    selectionRow: row.id,
    recipe: recipe.recipeId,
    attachment: attachment.id,
    // A flagged cut straight in the table (the walk's recipe is a draft; recording is tested in test/api/operator).
    cut: await insertCut(db, {
      version_id: (await db('recipe_versions').where({ recipe_id: recipe.recipeId, version: 1 }).first('id')).id,
      recipe_id: recipe.recipeId,
      specimen_id: 'WALK-1',
      part_ref: '',
      quantity: 1,
      outcome: 'burnt',
      notes: '',
      operator_id: targetPerson.id,
      operator_name: targetPerson.displayName,
      cut_at: new Date(),
    }),
  };
}

/** The parameters the walk knows how to fill. */
const KNOWN_PARAMS = /\/:(id|n|attachmentId|cutId|code)\b/g;

/** Fills :id by the resource the path names, :n with version 1, :attachmentId, :cutId and :code. */
export function pathFor(route: RouteDefinition, t: Targets): string {
  const left = route.path.replace(KNOWN_PARAMS, '');
  if (left.includes(':')) throw new Error(`The route walk cannot fill the parameters of ${route.path}.`);
  const resource = route.path.split('/')[2];
  const ids: Record<string, number> = {
    users: t.user,
    materials: t.material,
    wheels: t.wheel,
    machines: t.machine,
    'selection-rows': t.selectionRow,
    recipes: t.recipe,
    attachments: t.attachment,
  };
  const id = ids[resource ?? ''];
  if (route.path.includes(':id') && id === undefined) throw new Error(`The route walk has no target for ${route.path}: add one.`);
  return route.path
    .replace(/:id\b/g, String(id))
    .replace(/:n\b/g, '1')
    .replace(/:code\b/g, 'ZZZZ-ZZZZ')
    .replace(/:attachmentId\b/g, String(t.attachment))
    .replace(/:cutId\b/g, String(t.cut));
}

/** The route's path with every parameter replaced by `value` (for odd path values). */
export function pathWithParams(route: RouteDefinition, value: (name: string) => string): string {
  return route.path.replace(/:(\w+)\b/g, (_m, name: string) => value(name));
}

/** The route called on its walk path with the agent's CSRF token, no body. */
export function call(agent: Agent, route: RouteDefinition, t: Targets, csrf: string) {
  return agent[route.method](pathFor(route, t)).set(CSRF_HEADER, csrf);
}

export function label(route: Pick<RouteDefinition, 'method' | 'path'>): string {
  return `${route.method.toUpperCase()} ${route.path}`;
}

/** True for the methods that change state (they need the CSRF token). */
export function isWrite(route: RouteDefinition): boolean {
  return route.method !== 'get';
}

/**
 * Records which lines of the route table got through to their own step (past access, CSRF
 * and body parsing: the validation of the declared request parts, then the handler) until
 * `restore()`. Requests to routes of any app built from the table count alike.
 */
export function recordHandlerCalls(table: readonly RouteDefinition[] = routes): { readonly reached: Set<string>; restore(): void } {
  const recording = startValidationRecording();
  const lines = new Set(table.map(label));
  return {
    get reached() {
      return new Set(recording.requests.map((r) => label({ method: r.method, path: r.routePath })).filter((line) => lines.has(line)));
    },
    restore: () => recording.stop(),
  };
}
