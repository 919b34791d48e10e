/**
 * Least privilege: the app's database account (TEST_APP_DATABASE_URL, which `npm test` makes
 * beside the owner account in DATABASE_URL) may read and write rows, and nothing more. It
 * cannot drop the triggers that guard the records, change tables or grant itself more; the
 * whole review workflow still runs on it, and the triggers still refuse through it.
 */
import { expect } from 'chai';
import type { Knex } from 'knex';
import { createDb } from '../../../server/data/db';
import { schemaChangeWarning, schemaPrivileges } from '../../../server/data/database-accounts';
import { createStockSet } from '../support/stock';
import { buildTestApp } from '../support/test-app';
import { resetTables, testDb } from '../support/test-database';
import { act, approved, sessionFor } from '../workflow/workflow-support';

/** The privilege errors MariaDB answers with; a missing trigger or table would be another code. */
const DENIED = ['ER_TABLEACCESS_DENIED_ERROR', 'ER_SPECIFIC_ACCESS_DENIED_ERROR', 'ER_DBACCESS_DENIED_ERROR', 'ER_COLUMNACCESS_DENIED_ERROR'];

async function refusal(run: Promise<unknown>): Promise<{ code?: string; message: string } | null> {
  return run.then(
    () => null,
    (e: { code?: string; message: string }) => e,
  );
}

describe('Database accounts: the app’s account cannot change the schema', function () {
  this.timeout(60000);
  let owner: Knex;
  let appDb: Knex;

  before(async function () {
    const appUrl = process.env['TEST_APP_DATABASE_URL'];
    if (!appUrl) {
      // `npm test` always sets it; by hand: a second account with SELECT, INSERT, UPDATE, DELETE only (README, "Database accounts").
      console.warn('    TEST_APP_DATABASE_URL is not set: the database account tests are skipped.');
      this.skip();
    }
    owner = await testDb();
    await resetTables(owner);
    appDb = createDb(appUrl!);
  });

  after(async () => {
    await appDb?.destroy();
  });

  it('are two different accounts on the same database', async () => {
    const [[ownerRow]] = (await owner.raw('SELECT CURRENT_USER() AS who, DATABASE() AS db')) as [{ who: string; db: string }[]];
    const [[appRow]] = (await appDb.raw('SELECT CURRENT_USER() AS who, DATABASE() AS db')) as [{ who: string; db: string }[]];
    expect(appRow!.db).to.equal(ownerRow!.db);
    expect(appRow!.who).to.not.equal(ownerRow!.who);
  });

  it('refuses the app’s account DROP TRIGGER on a trigger that exists, and the trigger stays', async () => {
    const [rows] = (await owner.raw(`SELECT TRIGGER_NAME AS n FROM information_schema.TRIGGERS WHERE TRIGGER_SCHEMA = DATABASE() AND TRIGGER_NAME = ?`, [
      'signatures_no_delete',
    ])) as [{ n: string }[]];
    expect(rows.map((r) => r.n)).to.deep.equal(['signatures_no_delete']);
    const err = await refusal(appDb.raw('DROP TRIGGER signatures_no_delete'));
    expect(err?.code, err?.message).to.be.oneOf(DENIED);
    const [after] = (await owner.raw(`SELECT TRIGGER_NAME AS n FROM information_schema.TRIGGERS WHERE TRIGGER_SCHEMA = DATABASE() AND TRIGGER_NAME = ?`, [
      'signatures_no_delete',
    ])) as [{ n: string }[]];
    expect(after).to.have.length(1);
  });

  it('refuses the app’s account ALTER TABLE, CREATE TABLE, DROP TABLE, TRUNCATE and CREATE TRIGGER', async () => {
    const statements = [
      'ALTER TABLE signatures ADD COLUMN sneaked_in INT NULL',
      'CREATE TABLE sneaked_in (id INT PRIMARY KEY)',
      'DROP TABLE sessions',
      'TRUNCATE TABLE signatures',
      'CREATE TRIGGER sneaked_in BEFORE INSERT ON signatures FOR EACH ROW SET NEW.id = NEW.id',
    ];
    for (const sql of statements) {
      const err = await refusal(appDb.raw(sql));
      expect(err?.code, `${sql}: ${err?.message}`).to.be.oneOf(DENIED);
    }
  });

  it('refuses the app’s account GRANT, to itself or to anyone', async () => {
    for (const sql of ['GRANT ALL PRIVILEGES ON *.* TO CURRENT_USER()', 'GRANT DROP, ALTER, TRIGGER ON `%s`.* TO CURRENT_USER()']) {
      const [[{ db }]] = (await appDb.raw('SELECT DATABASE() AS db')) as [{ db: string }[]];
      const err = await refusal(appDb.raw(sql.replace('%s', db)));
      expect(err, sql).to.not.equal(null);
      expect(err!.code, `${sql}: ${err!.message}`).to.match(
        /^ER_(DBACCESS_DENIED_ERROR|ACCESS_DENIED_ERROR|SPECIFIC_ACCESS_DENIED_ERROR|TABLEACCESS_DENIED_ERROR)$/,
      );
    }
    expect(await schemaPrivileges(appDb)).to.deep.equal([]);
  });

  it('lets the app’s account SELECT, INSERT, UPDATE and DELETE rows', async () => {
    const row = { username: 'least-privilege', client_address: '192.0.2.16', failed_at: new Date() };
    const [id] = await appDb('sign_in_failures').insert(row);
    await appDb('sign_in_failures').where({ id }).update({ client_address: '192.0.2.17' });
    expect(await appDb('sign_in_failures').where({ id }).first('client_address')).to.deep.equal({ client_address: '192.0.2.17' });
    expect(await appDb('sign_in_failures').where({ id }).del()).to.equal(1);
  });

  it('runs the review workflow on the app’s account, with the triggers still refusing through it', async () => {
    const { app } = await buildTestApp(appDb);
    const stock = await createStockSet(owner);
    const author = await sessionFor(app, owner, ['author']);
    const approver = await sessionFor(app, owner, ['approver']);
    const v = await approved(author, approver, stock, { title: 'Signed on the app account' });
    expect(v.status).to.equal('approved');
    expect((await act.get(author, v)).status).to.equal(200);
    const frozen = await refusal(appDb('recipe_versions').where({ recipe_id: v.recipeId, version: v.version }).update({ title: 'Edited behind the app' }));
    expect(frozen?.message).to.match(/content is frozen/);
    const kept = await refusal(appDb('signatures').del());
    expect(kept?.message).to.match(/signatures are permanent/);
  });

  it('warns at start-up when the account the server runs with can change the schema, and only then', async () => {
    expect(await schemaPrivileges(owner)).to.include.members(['ALTER', 'DROP', 'TRIGGER']);
    expect(await schemaChangeWarning(owner)).to.match(/can change the schema.*MIGRATION_DATABASE_URL/s);
    expect(await schemaChangeWarning(appDb)).to.equal(null);
  });
});
