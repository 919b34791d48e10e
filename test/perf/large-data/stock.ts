/**
 * The large data set's stock: the demo lab's saws, wheels and materials
 * (seeds/data/demo-stock.ts) and the selection table built from Kerfbook's starting table,
 * inserted with the stock service's own row mapping (`kind.values`, `toRecord`) and dated
 * at the start of the data set's history, each with the trail event the service writes.
 */
import type { Knex } from 'knex';
import type { RecipeContext } from '../../../shared/recipe-context';
import type { RecipeContent } from '../../../shared/schemas/recipe';
import { machineBody, materialBody, selectionRowBody, wheelBody } from '../../../shared/schemas/stock';
import type { MachineRecord, MaterialRecord, WheelRecord } from '../../../shared/stock-types';
import { selectionRowsWithWheels } from '../../../shared/selection-table';
import { matchesStarterWheel, STARTER_SELECTION } from '../../../shared/wheel-suggestion';
import { DEMO_MACHINES, DEMO_MATERIALS, DEMO_WHEELS } from '../../../seeds/data/demo-stock';
import { getLabLimits } from '../../../server/services/stock/lab-limits';
import { selectionRowValues, toSelectionRow } from '../../../server/services/stock/selection-rows';
import { MACHINES, MATERIALS, WHEELS, type MachineRow, type MaterialRow, type StockKind, type WheelRow } from '../../../server/services/stock/records';
import { TRAIL_EVENTS } from '../../../server/services/trail/event-types';
import type { SelectionRowRow } from '../../../server/data/selection-rows';
import { MINUTE_MS } from './random';
import type { TrailActor, TrailPlan } from './trail-plan';

/** Stock by name and id, and the context the checks need for a content. */
export interface StockCatalog {
  material(name: string): MaterialRecord;
  machine(name: string): MachineRecord;
  wheel(name: string): WheelRecord;
  machineById(id: number): MachineRecord;
  wheelById(id: number): WheelRecord;
  context(content: RecipeContent): RecipeContext;
  counts: { materials: number; wheels: number; machines: number; selectionRows: number };
}

/** What the trail keeps of a record (the stock service's snapshot): everything but id and times. */
function snapshot(record: { id: number; updatedAt: string }): Record<string, unknown> {
  const { id: _id, updatedAt: _u, ...rest } = record;
  return rest;
}

function byName<R extends { name: string }>(records: readonly R[], what: string): (name: string) => R {
  const map = new Map(records.map((r) => [r.name, r]));
  return (name) => {
    const found = map.get(name);
    if (!found) throw new Error(`The large data set names the ${what} "${name}", which is not in the demo stock.`);
    return found;
  };
}

function byId<R extends { id: number }>(records: readonly R[], what: string): (id: number) => R {
  const map = new Map(records.map((r) => [r.id, r]));
  return (id) => {
    const found = map.get(id);
    if (!found) throw new Error(`There is no ${what} with id ${id} in the large data set.`);
    return found;
  };
}

async function insertKind<B, R extends { id: number; archived: boolean; updatedAt: string }, Row>(
  db: Knex,
  kind: StockKind<B, R>,
  bodies: readonly B[],
  firstAt: number,
  actor: TrailActor,
  plan: TrailPlan,
): Promise<R[]> {
  const rows = bodies.map((body, i) => {
    const at = new Date(firstAt + i * MINUTE_MS);
    return { ...kind.values(body), archived: false, archived_at: null, created_at: at, updated_at: at };
  });
  await db(kind.table).insert(rows);
  const stored = (await db(kind.table).orderBy('id').select('*')) as Row[];
  const records = stored.map((row) => kind.toRecord(row as never));
  records.forEach((record, i) => {
    plan.add(firstAt + i * MINUTE_MS, actor, () => ({
      type: kind.events.created,
      entityType: kind.entityType,
      entityId: record.id,
      recipeId: null,
      before: null,
      after: snapshot(record),
    }));
  });
  return records;
}

/** Inserts the stock (tables must be empty) and plans its trail events from `at` on. */
export async function insertStock(db: Knex, at: number, actor: TrailActor, plan: TrailPlan): Promise<StockCatalog> {
  const machines = await insertKind<unknown, MachineRecord, MachineRow>(
    db,
    MACHINES as never,
    DEMO_MACHINES.map((m) => machineBody.parse(m)),
    at,
    actor,
    plan,
  );
  const wheels = await insertKind<unknown, WheelRecord, WheelRow>(
    db,
    WHEELS as never,
    DEMO_WHEELS.map((w) => wheelBody.parse(w)),
    at + 10 * MINUTE_MS,
    actor,
    plan,
  );
  const materials = await insertKind<unknown, MaterialRecord, MaterialRow>(
    db,
    MATERIALS as never,
    DEMO_MATERIALS.map((m) => materialBody.parse(m)),
    at + 30 * MINUTE_MS,
    actor,
    plan,
  );

  // The selection table: every stocked wheel that fits a starting row (as the demo seed builds it).
  const selectionAt = at + 60 * MINUTE_MS;
  const selection = STARTER_SELECTION.flatMap((row) =>
    wheels
      .filter((w) => matchesStarterWheel(row.wheel, w))
      .map((w) => selectionRowBody.parse({ group: row.group, hardness: row.hardness, wheelId: w.id, note: row.note })),
  );
  if (selection.length > 0) {
    await db('selection_rows').insert(
      selection.map((body, i) => ({
        ...selectionRowValues(body),
        created_at: new Date(selectionAt + i * MINUTE_MS),
        updated_at: new Date(selectionAt + i * MINUTE_MS),
      })),
    );
  }
  const selectionRows = ((await db('selection_rows').orderBy('id').select('*')) as SelectionRowRow[]).map(toSelectionRow);
  selectionRows.forEach((row, i) => {
    const { id: _id, ...rest } = row;
    plan.add(selectionAt + i * MINUTE_MS, actor, () => ({
      type: TRAIL_EVENTS.selectionRowCreated,
      entityType: 'selection_row',
      entityId: row.id,
      recipeId: null,
      before: null,
      after: rest,
    }));
  });

  const limits = await getLabLimits(db);
  const tableWithWheels = selectionRowsWithWheels(selectionRows, wheels);
  const materialById = byId(materials, 'material');
  const machineById = byId(machines, 'machine');
  const wheelById = byId(wheels, 'wheel');
  return {
    material: byName(materials, 'material'),
    machine: byName(machines, 'machine'),
    wheel: byName(wheels, 'wheel'),
    machineById,
    wheelById,
    context: (content) => ({
      material: content.scope.materialId === null ? null : materialById(content.scope.materialId),
      machine: machineById(content.cutting.machineId),
      wheel: wheelById(content.cutting.wheelId),
      limits,
      selectionRows: tableWithWheels,
    }),
    counts: { materials: materials.length, wheels: wheels.length, machines: machines.length, selectionRows: selectionRows.length },
  };
}
