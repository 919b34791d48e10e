/** The lab's wheel-selection table: material group × hardness band → a wheel of its stock. */
import type { Knex } from 'knex';
import type { SelectionRowBody } from '../../../shared/schemas/stock';
import type { SelectionRow, SelectionRowWheel } from '../../../shared/stock-types';
import type { HardnessScale, MaterialGroup, WheelKind } from '../../../shared/vocabulary';
import { AppError } from '../../app-error';
import {
  deleteSelectionRowRow,
  findSelectionRowRow,
  insertSelectionRowRow,
  listSelectionRowRows,
  listSelectionRowRowsWithWheels,
  updateSelectionRowRow,
  type SelectionRowRow,
  type SelectionRowValues,
} from '../../data/selection-rows';
import { findStockRow } from '../../data/stock';
import type { Actor } from '../actor';
import { TRAIL_EVENTS } from '../trail/event-types';
import { appendTrailEvent } from '../trail/append';
import { diff } from '../trail/changes';
import type { WheelRow } from './records';

export function toSelectionRow(row: SelectionRowRow): SelectionRow {
  return {
    id: row.id,
    group: row.material_group as MaterialGroup,
    hardness:
      row.hardness_scale === null || row.hardness_min === null || row.hardness_max === null
        ? null
        : { min: row.hardness_min, max: row.hardness_max, scale: row.hardness_scale as HardnessScale },
    wheelId: row.wheel_id,
    note: row.note,
  };
}

/** The table's columns for a validated body (also used by the large data set). */
export function selectionRowValues(body: SelectionRowBody): SelectionRowValues {
  return {
    material_group: body.group,
    hardness_min: body.hardness?.min ?? null,
    hardness_max: body.hardness?.max ?? null,
    hardness_scale: body.hardness?.scale ?? null,
    wheel_id: body.wheelId,
    note: body.note,
  };
}

/** The wheel must exist and be in use: a suggestion must never point at an archived wheel. */
async function assertWheelUsable(db: Knex, wheelId: number): Promise<void> {
  const wheel = await findStockRow<WheelRow>(db, 'wheels', wheelId);
  if (!wheel) throw AppError.validation([{ path: 'wheelId', message: `There is no wheel with id ${wheelId}.` }]);
  if (wheel.archived) throw AppError.validation([{ path: 'wheelId', message: `The wheel "${wheel.name}" is archived; choose a wheel in use.` }]);
}

function snapshot(row: SelectionRow): Record<string, unknown> {
  const { id: _id, ...rest } = row;
  return rest;
}

export async function listSelectionRows(db: Knex): Promise<SelectionRow[]> {
  return (await listSelectionRowRows(db)).map(toSelectionRow);
}

/**
 * The table as the recipe checks read it: rows whose wheel is in use, with its kind and
 * marking (what selectionRowsWithWheels gives the editor from the same rows and wheels).
 */
export async function listSelectionRowsWithWheels(db: Knex): Promise<SelectionRowWheel[]> {
  return (await listSelectionRowRowsWithWheels(db)).map((row) => ({
    ...toSelectionRow(row),
    wheel: { kind: row.wheel_kind as WheelKind, specification: row.wheel_specification },
  }));
}

async function mustFind(db: Knex, id: number, forUpdate = false): Promise<SelectionRow> {
  const row = await findSelectionRowRow(db, id, forUpdate);
  if (!row) throw AppError.notFound(`There is no selection row with id ${id}.`);
  return toSelectionRow(row);
}

export async function createSelectionRow(db: Knex, actor: Actor, body: SelectionRowBody): Promise<SelectionRow> {
  return db.transaction(async (trx) => {
    await assertWheelUsable(trx, body.wheelId);
    const now = new Date();
    const id = await insertSelectionRowRow(trx, selectionRowValues(body), now);
    const created = await mustFind(trx, id);
    await appendTrailEvent(
      trx,
      actor,
      { type: TRAIL_EVENTS.selectionRowCreated, entityType: 'selection_row', entityId: id, before: null, after: snapshot(created) },
      now,
    );
    return created;
  });
}

export async function updateSelectionRow(db: Knex, actor: Actor, id: number, body: SelectionRowBody): Promise<SelectionRow> {
  return db.transaction(async (trx) => {
    const before = await mustFind(trx, id, true);
    if (body.wheelId !== before.wheelId) await assertWheelUsable(trx, body.wheelId);
    const now = new Date();
    await updateSelectionRowRow(trx, id, selectionRowValues(body), now);
    const after = await mustFind(trx, id);
    const changes = diff(snapshot(before), snapshot(after));
    if (Object.keys(changes.after).length > 0) {
      await appendTrailEvent(trx, actor, { type: TRAIL_EVENTS.selectionRowUpdated, entityType: 'selection_row', entityId: id, ...changes }, now);
    }
    return after;
  });
}

export async function deleteSelectionRow(db: Knex, actor: Actor, id: number): Promise<void> {
  await db.transaction(async (trx) => {
    const before = await mustFind(trx, id, true);
    await deleteSelectionRowRow(trx, id);
    await appendTrailEvent(trx, actor, {
      type: TRAIL_EVENTS.selectionRowDeleted,
      entityType: 'selection_row',
      entityId: id,
      before: snapshot(before),
      after: null,
    });
  });
}
