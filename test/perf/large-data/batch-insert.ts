/**
 * Multi-row INSERTs, a few thousand rows per statement and several statements per
 * transaction: the large data set goes in at the speed of the disk, not of round trips.
 */
import type { Knex } from 'knex';

/** Rows per INSERT statement. MariaDB's max_allowed_packet (16 MB) bounds a statement. */
export const ROWS_PER_STATEMENT = 2000;
/** Statements per transaction (one commit, one log flush each). */
const STATEMENTS_PER_TRANSACTION = 10;

export type Row = Record<string, unknown>;

/** Inserts `rows` in order; `rowsPerStatement` lower for tables with long text columns. */
export async function insertBatches(db: Knex, table: string, rows: readonly Row[], rowsPerStatement = ROWS_PER_STATEMENT): Promise<void> {
  const perTransaction = rowsPerStatement * STATEMENTS_PER_TRANSACTION;
  for (let start = 0; start < rows.length; start += perTransaction) {
    const slice = rows.slice(start, start + perTransaction);
    await db.transaction(async (trx) => {
      for (let i = 0; i < slice.length; i += rowsPerStatement) await trx(table).insert(slice.slice(i, i + rowsPerStatement));
    });
  }
}

/**
 * Writes rows as they are produced: buffered, then one transaction per full buffer. The
 * next buffer fills while the previous one is being written, so making rows and MariaDB
 * storing them run side by side on the two cores. For the trail's million rows.
 */
export class BatchWriter {
  private buffer: Row[] = [];
  private pending: Promise<void> = Promise.resolve();
  written = 0;

  constructor(
    private readonly db: Knex,
    private readonly table: string,
    private readonly rowsPerStatement = ROWS_PER_STATEMENT,
  ) {}

  async add(row: Row): Promise<void> {
    this.buffer.push(row);
    if (this.buffer.length >= this.rowsPerStatement * STATEMENTS_PER_TRANSACTION) await this.startWrite();
  }

  /** Waits for the write before (one at a time, in order), then starts this one. */
  private async startWrite(): Promise<void> {
    await this.pending;
    const rows = this.buffer;
    this.buffer = [];
    this.pending = insertBatches(this.db, this.table, rows, this.rowsPerStatement).then(() => {
      this.written += rows.length;
    });
    // A failure shows at the next add or at flush; keep it from being reported as unhandled meanwhile.
    this.pending.catch(() => undefined);
  }

  /** Writes what is left and waits until everything is stored. */
  async flush(): Promise<void> {
    if (this.buffer.length > 0) await this.startWrite();
    await this.pending;
  }
}
