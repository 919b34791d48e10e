/**
 * A database migrated before the migrations were renamed upgrades through migrate(): its
 * rows take the new names, nothing runs again, and it ends with the schema of a brand-new
 * database. The old run is today's migration files served to Knex under their old names
 * (the order is the same), so it leaves the rows the old files left.
 *
 * Drops every table of DATABASE_URL's database on the way, and leaves it migrated.
 */
import { expect } from 'chai';
import fs from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Knex } from 'knex';
import { MIGRATIONS_DIR } from '../../../server/data/db';
import { migrate, renameOldMigrations } from '../../../server/data/migrate';
import { MIGRATION_RENAMES, currentMigrationName } from '../../../server/data/migration-renames';
import { testDb } from '../support/test-database';

interface MigrationRow {
  id: number;
  name: string;
  batch: number;
  migration_time: Date;
}

const OLD_NAMES = MIGRATION_RENAMES.map(([from]) => from);
const NEW_NAMES = MIGRATION_RENAMES.map(([, to]) => to);

/** Today's migration modules, each under the name it had before the rename. */
const underOldNames: Knex.MigrationSource<string> = {
  getMigrations: () => Promise.resolve(OLD_NAMES),
  getMigrationName: (name) => name,
  getMigration: (name) => import(pathToFileURL(path.join(MIGRATIONS_DIR, currentMigrationName(name))).href) as Promise<Knex.Migration>,
};

async function dropEverything(db: Knex): Promise<void> {
  await db.transaction(async (trx) => {
    const [tables] = (await trx.raw("SHOW FULL TABLES WHERE Table_type = 'BASE TABLE'")) as [Record<string, string>[]];
    await trx.raw('SET FOREIGN_KEY_CHECKS = 0');
    for (const t of tables.map((r) => Object.values(r)[0]!)) await trx.raw('DROP TABLE ??', [t]);
    await trx.raw('SET FOREIGN_KEY_CHECKS = 1');
  });
}

/** SHOW CREATE TABLE of every table (without the AUTO_INCREMENT counter) and SHOW TRIGGERS (without their creation time). */
async function schemaOf(db: Knex): Promise<string[]> {
  const [tables] = (await db.raw('SHOW FULL TABLES')) as [Record<string, string>[]];
  const out: string[] = [];
  for (const t of tables.map((r) => Object.values(r)[0]!).sort()) {
    const [[row]] = (await db.raw('SHOW CREATE TABLE ??', [t])) as [Record<string, string>[]];
    out.push(String(row!['Create Table'] ?? row!['Create View']).replace(/ AUTO_INCREMENT=\d+/, ''));
  }
  const [triggers] = (await db.raw('SHOW TRIGGERS')) as [Record<string, unknown>[]];
  for (const t of triggers) out.push(JSON.stringify({ ...t, Created: null }));
  return out;
}

const rowsOf = async (db: Knex) => (await db('knex_migrations').orderBy('id')) as MigrationRow[];

describe('Migrations: a database migrated under the old names', function () {
  this.timeout(180000);
  let db: Knex;
  let freshSchema: string[];
  let oldRows: MigrationRow[];
  const files = fs.readdirSync(MIGRATIONS_DIR).filter((f) => f.endsWith('.ts')).sort();
  const newestStamp = files.at(-1)!.slice(0, 14);

  before(async () => {
    db = await testDb();
    await dropEverything(db);
    expect(await migrate(db)).to.deep.equal(files);
    freshSchema = await schemaOf(db);

    await dropEverything(db);
    await db.migrate.latest({ migrationSource: underOldNames });
    oldRows = await rowsOf(db);
  });

  it('starts as the old run left it: every old name, in order, in its own row', () => {
    expect(oldRows.map((r) => r.name)).to.deep.equal(OLD_NAMES);
  });

  it('is refused by Knex itself until the rows are renamed (rows naming files the folder lacks)', async () => {
    let refused: unknown = null;
    await db.migrate.latest().catch((err: unknown) => (refused = err));
    expect(String(refused)).to.match(/corrupt/);
  });

  it('is brought up to date by migrate() without running a renamed migration again', async () => {
    const ran = await migrate(db);
    expect(ran).to.deep.equal(files.filter((f) => !NEW_NAMES.includes(f)));
    const rows = await rowsOf(db);
    expect(rows.slice(0, oldRows.length).map((r) => r.name)).to.deep.equal(NEW_NAMES);
    // Renamed in place: the same rows, batches and times.
    expect(rows.slice(0, oldRows.length).map((r) => [r.id, r.batch, r.migration_time.getTime()])).to.deep.equal(
      oldRows.map((r) => [r.id, r.batch, r.migration_time.getTime()]),
    );
    expect(await db.migrate.currentVersion()).to.equal(newestStamp);
  });

  it('ends with the schema of a brand-new database: every table and trigger', async () => {
    const schema = await schemaOf(db);
    expect(schema.filter((s) => s.startsWith('CREATE TABLE')).length).to.be.at.least(25);
    expect(schema.filter((s) => s.startsWith('{')).length).to.be.at.least(10);
    expect(schema).to.deep.equal(freshSchema);
  });

  it('leaves a database without old names untouched, however often it is asked', async () => {
    const rows = await rowsOf(db);
    expect(await renameOldMigrations(db)).to.equal(0);
    expect(await migrate(db)).to.deep.equal([]);
    expect(await rowsOf(db)).to.deep.equal(rows);
  });

  it('renames a mix of old and new names, and only the old ones', async () => {
    for (const [i, [from, to]] of MIGRATION_RENAMES.entries()) {
      if (i % 2 === 1) await db('knex_migrations').where({ name: to }).update({ name: from });
    }
    expect(await migrate(db)).to.deep.equal([]);
    expect((await rowsOf(db)).map((r) => r.name)).to.deep.equal(files);
  });

  it('refuses, changing nothing, when one migration is recorded under both names', async () => {
    const [from1, to1] = MIGRATION_RENAMES[1]!;
    const [from3, to3] = MIGRATION_RENAMES[3]!;
    await db('knex_migrations').where({ name: to1 }).update({ name: from1 });
    await db('knex_migrations').insert({ name: from3, batch: 99, migration_time: new Date() });
    let refused: unknown = null;
    await migrate(db).catch((err: unknown) => (refused = err));
    expect(String(refused)).to.contain(`records the migration ${to3} twice`);
    // One transaction: the row renamed before the refusal has its old name again.
    const back = (await db('knex_migrations').where({ name: from1 }).count({ n: '*' }).first()) as { n: number };
    expect(Number(back.n)).to.equal(1);

    await db('knex_migrations').where({ name: from3 }).del();
    expect(await migrate(db)).to.deep.equal([]);
    expect((await rowsOf(db)).map((r) => r.name)).to.deep.equal(files);
  });
});
