import type { Knex } from 'knex';
import { machineBody, materialBody, selectionRowBody, wheelBody } from '../shared/schemas/stock';
import type { WheelRecord } from '../shared/stock-types';
import { matchesStarterWheel, STARTER_SELECTION } from '../shared/wheel-suggestion';
import type { Actor } from '../server/services/actor';
import { createSelectionRow } from '../server/services/stock/selection-rows';
import { createStock, listStock } from '../server/services/stock/stock';
import { MACHINES, MATERIALS, WHEELS } from '../server/services/stock/records';
import { DEMO_MACHINES, DEMO_MATERIALS, DEMO_WHEELS } from './data/demo-stock';
import { demoAuthor } from './data/demo-author';

/**
 * The invented lab's saws, wheels and materials, entered by the demo author through the
 * same services as the API (so the trail has them), and the selection table built from
 * Kerfbook's starting table with the lab's matching wheels. Skips anything already there.
 */
export async function seed(knex: Knex): Promise<void> {
  const actor: Actor = await demoAuthor(knex);
  const has = async (table: string, name: string) => Boolean(await knex(table).where({ name }).first());

  for (const raw of DEMO_MACHINES) if (!(await has('machines', raw.name))) await createStock(knex, actor, MACHINES, machineBody.parse(raw));
  for (const raw of DEMO_WHEELS) if (!(await has('wheels', raw.name))) await createStock(knex, actor, WHEELS, wheelBody.parse(raw));
  for (const raw of DEMO_MATERIALS) if (!(await has('materials', raw.name))) await createStock(knex, actor, MATERIALS, materialBody.parse(raw));

  if (await knex('selection_rows').first()) return;
  const wheels: WheelRecord[] = (await listStock(knex, WHEELS, { page: 0, pageSize: 200, sort: 'name', dir: 'asc', archived: 'no' })).items;
  for (const row of STARTER_SELECTION) {
    // Every stocked wheel that fits the row, so each saw gets a suggestion of its own size.
    for (const wheel of wheels.filter((w) => matchesStarterWheel(row.wheel, w))) {
      await createSelectionRow(knex, actor, selectionRowBody.parse({ group: row.group, hardness: row.hardness, wheelId: wheel.id, note: row.note }));
    }
  }
}
