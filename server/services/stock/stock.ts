/**
 * Materials, wheels and machines: list, read, create, update, archive and
 * delete. A record any recipe version references is never deleted: DELETE archives it
 * instead and says so. Every change writes its trail event in the same transaction.
 */
import type { Knex } from 'knex';
import type { Page } from '../../../shared/api-types';
import type { StockListQuery } from '../../../shared/schemas/stock';
import { AppError } from '../../app-error';
import { deleteStockRow, findStockRow, insertStockRow, isStockReferenced, listStockRows, updateStockRow } from '../../data/stock';
import type { Actor } from '../actor';
import { appendTrailEvent } from '../trail/append';
import { diff } from '../trail/changes';
import type { StockKind } from './records';
import { ownValue } from '../../../shared/own-key';

type AnyRecord = { id: number; archived: boolean; updatedAt: string };

/** What the trail keeps of a record: everything but id and times. */
function snapshot(record: AnyRecord): Record<string, unknown> {
  const { id: _id, updatedAt: _u, ...rest } = record;
  return rest;
}

export async function listStock<B, R extends AnyRecord>(db: Knex, kind: StockKind<B, R>, query: StockListQuery): Promise<Page<R>> {
  const sortColumn = ownValue(kind.sortColumns, query.sort);
  if (!sortColumn) {
    throw AppError.validation([{ path: 'sort', message: `Sort by one of: ${Object.keys(kind.sortColumns).join(', ')}.` }]);
  }
  const { rows, total } = await listStockRows(db, kind.table, {
    page: query.page,
    pageSize: query.pageSize,
    sortColumn,
    dir: query.dir,
    q: query.q || undefined,
    searchColumns: kind.searchColumns,
    group: kind.groupFilter ? query.group : undefined,
    archived: query.archived,
  });
  return { items: rows.map((row) => kind.toRecord(row as never)), total, page: query.page, pageSize: query.pageSize };
}

async function mustFind<B, R extends AnyRecord>(db: Knex, kind: StockKind<B, R>, id: number, forUpdate = false): Promise<R> {
  const row = await findStockRow(db, kind.table, id, forUpdate);
  if (!row) throw AppError.notFound(`There is no ${kind.noun} with id ${id}.`);
  return kind.toRecord(row as never);
}

export function getStock<B, R extends AnyRecord>(db: Knex, kind: StockKind<B, R>, id: number): Promise<R> {
  return mustFind(db, kind, id);
}

export async function createStock<B, R extends AnyRecord>(db: Knex, actor: Actor, kind: StockKind<B, R>, body: B): Promise<R> {
  return db.transaction(async (trx) => {
    const now = new Date();
    const id = await insertStockRow(trx, kind.table, { ...kind.values(body), archived: false, archived_at: null, created_at: now, updated_at: now });
    const created = await mustFind(trx, kind, id);
    await appendTrailEvent(trx, actor, { type: kind.events.created, entityType: kind.entityType, entityId: id, before: null, after: snapshot(created) }, now);
    return created;
  });
}

export async function updateStock<B, R extends AnyRecord>(db: Knex, actor: Actor, kind: StockKind<B, R>, id: number, body: B): Promise<R> {
  return db.transaction(async (trx) => {
    const before = await mustFind(trx, kind, id, true);
    const now = new Date();
    await updateStockRow(trx, kind.table, id, { ...kind.values(body), updated_at: now });
    const after = await mustFind(trx, kind, id);
    const changes = diff(snapshot(before), snapshot(after));
    if (Object.keys(changes.after).length > 0) {
      await appendTrailEvent(trx, actor, { type: kind.events.updated, entityType: kind.entityType, entityId: id, ...changes }, now);
    }
    return after;
  });
}

async function setArchived<B, R extends AnyRecord>(trx: Knex, actor: Actor, kind: StockKind<B, R>, id: number, archived: boolean, now: Date): Promise<R> {
  await updateStockRow(trx, kind.table, id, { archived, archived_at: archived ? now : null, updated_at: now });
  await appendTrailEvent(
    trx,
    actor,
    {
      type: archived ? kind.events.archived : kind.events.unarchived,
      entityType: kind.entityType,
      entityId: id,
      before: { archived: !archived },
      after: { archived },
    },
    now,
  );
  return mustFind(trx, kind, id);
}

export async function archiveStock<B, R extends AnyRecord>(db: Knex, actor: Actor, kind: StockKind<B, R>, id: number): Promise<R> {
  return db.transaction(async (trx) => {
    const before = await mustFind(trx, kind, id, true);
    if (before.archived) throw AppError.conflict(`This ${kind.noun} is already archived.`);
    return setArchived(trx, actor, kind, id, true, new Date());
  });
}

export async function unarchiveStock<B, R extends AnyRecord>(db: Knex, actor: Actor, kind: StockKind<B, R>, id: number): Promise<R> {
  return db.transaction(async (trx) => {
    const before = await mustFind(trx, kind, id, true);
    if (!before.archived) throw AppError.conflict(`This ${kind.noun} is not archived.`);
    return setArchived(trx, actor, kind, id, false, new Date());
  });
}

function isReferencedError(err: unknown): boolean {
  const code = (err as { code?: string } | null)?.code;
  return code === 'ER_ROW_IS_REFERENCED_2' || code === 'ER_ROW_IS_REFERENCED';
}

/**
 * Deletes a record nobody references; archives a referenced one (recipes must keep
 * pointing at what they were written for). Answers whether it was archived.
 */
export async function deleteStock<B, R extends AnyRecord>(db: Knex, actor: Actor, kind: StockKind<B, R>, id: number): Promise<{ archived: boolean }> {
  const archiveInstead = () =>
    db.transaction(async (trx) => {
      const current = await mustFind(trx, kind, id, true);
      if (!current.archived) await setArchived(trx, actor, kind, id, true, new Date());
      return { archived: true };
    });
  try {
    return await db
      .transaction(async (trx) => {
        const before = await mustFind(trx, kind, id, true);
        if (await isStockReferenced(trx, kind.table, id)) return null;
        await deleteStockRow(trx, kind.table, id);
        await appendTrailEvent(trx, actor, { type: kind.events.deleted, entityType: kind.entityType, entityId: id, before: snapshot(before), after: null });
        return { archived: false };
      })
      .then((result) => result ?? archiveInstead());
  } catch (err) {
    // A recipe saved between our look and the delete: the foreign key refuses; archive.
    if (isReferencedError(err)) return archiveInstead();
    throw err;
  }
}
