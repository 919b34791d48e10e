/**
 * Puts a verified scratch database in the place of the target: one RENAME TABLE statement
 * moves the target's tables to `previous` and the scratch tables into the target (MariaDB
 * does it atomically, and foreign keys follow their tables).
 *
 * MariaDB refuses to move a table with triggers to another database ("Trigger in wrong
 * schema"), so the triggers are read first (SHOW CREATE TRIGGER, with the sql_mode each was
 * made under), dropped on both sides, and the scratch ones created again on the target
 * after the rename. Any failure puts the target back as it was.
 */
import type mysql from 'mysql2/promise';
import { baseTables, triggerNames } from './manifest';
import { quoteName as q } from './mariadb-clients';

interface TriggerDefinition {
  name: string;
  sqlMode: string;
  /** CREATE TRIGGER … without DEFINER, so it is made by the restoring account. */
  statement: string;
}

type Rows = mysql.RowDataPacket[];

/** The swap failed half-way and the old tables could not be put back: they are kept in `previous`. */
export class SwapUndoFailedError extends Error {}

const DEFINER_CLAUSE = /^CREATE\s+DEFINER\s*=\s*(?:`(?:[^`]|``)*`|\S+)@(?:`(?:[^`]|``)*`|\S+)\s+/i;

/** In the order MariaDB fires them, so triggers sharing a table and event keep their order. */
async function triggerDefinitions(c: mysql.Connection, database: string): Promise<TriggerDefinition[]> {
  const [rows] = await c.query<Rows>(
    `SELECT TRIGGER_NAME AS name FROM information_schema.TRIGGERS WHERE TRIGGER_SCHEMA = ?
      ORDER BY EVENT_OBJECT_TABLE, ACTION_TIMING, EVENT_MANIPULATION, ACTION_ORDER`,
    [database],
  );
  const defs: TriggerDefinition[] = [];
  for (const r of rows) {
    const name = String(r['name']);
    const [[def]] = await c.query<Rows>(`SHOW CREATE TRIGGER ${q(database)}.${q(name)}`);
    defs.push({ name, sqlMode: String(def!['sql_mode']), statement: String(def!['SQL Original Statement']).replace(DEFINER_CLAUSE, 'CREATE ') });
  }
  return defs;
}

async function dropTriggers(c: mysql.Connection, database: string): Promise<void> {
  for (const name of await triggerNames(c, database)) await c.query(`DROP TRIGGER ${q(database)}.${q(name)}`);
}

/** Creates triggers in the connection's own database (their ON clause names no database). */
async function createTriggers(c: mysql.Connection, defs: TriggerDefinition[]): Promise<void> {
  const [[mode]] = await c.query<Rows>('SELECT @@SESSION.sql_mode AS m');
  try {
    for (const def of defs) {
      await c.query('SET SESSION sql_mode = ?', [def.sqlMode]);
      await c.query(def.statement);
    }
  } finally {
    await c.query('SET SESSION sql_mode = ?', [String(mode!['m'])]);
  }
}

/**
 * `c` must be connected to `target`. Afterwards `target` holds the scratch tables and
 * triggers, `previous` the target's old tables (without triggers), `scratch` nothing.
 */
export async function swapIn(c: mysql.Connection, target: string, scratch: string, previous: string): Promise<void> {
  const [[current]] = await c.query<Rows>('SELECT DATABASE() AS db');
  if (current!['db'] !== target) throw new Error(`swapIn needs a connection to ${target}.`);
  const incoming = await triggerDefinitions(c, scratch);
  const outgoing = await triggerDefinitions(c, target);
  const oldTables = await baseTables(c, target);
  const newTables = await baseTables(c, scratch);
  const moves = [
    ...oldTables.map((t) => `${q(target)}.${q(t)} TO ${q(previous)}.${q(t)}`),
    ...newTables.map((t) => `${q(scratch)}.${q(t)} TO ${q(target)}.${q(t)}`),
  ];
  const back = [
    ...newTables.map((t) => `${q(target)}.${q(t)} TO ${q(scratch)}.${q(t)}`),
    ...oldTables.map((t) => `${q(previous)}.${q(t)} TO ${q(target)}.${q(t)}`),
  ];

  await dropTriggers(c, scratch);
  let stage: 'dropping triggers' | 'renamed' = 'dropping triggers';
  try {
    await dropTriggers(c, target);
    await c.query(`RENAME TABLE ${moves.join(', ')}`);
    stage = 'renamed';
    await createTriggers(c, incoming);
  } catch (err) {
    try {
      // Whatever triggers the target has now (some of the old, some of the new) go first.
      await dropTriggers(c, target);
      if (stage === 'renamed') await c.query(`RENAME TABLE ${back.join(', ')}`);
      await createTriggers(c, outgoing);
    } catch (undo) {
      throw new SwapUndoFailedError(
        `The swap failed (${err instanceof Error ? err.message : String(err)}) and so did putting the old tables back ` +
          `(${undo instanceof Error ? undo.message : String(undo)}). The old tables are in ${previous} or ${target}; ` +
          `the backup before the restore is in backups/.`,
      );
    }
    throw err;
  }
}
