/**
 * The server that `npm test` starts runs on the app's database account (rows only), not on
 * the owner account that migrated the database. An account without the PROCESS privilege sees
 * its own connections only: after a request to the server, the app's account sees the
 * server's connection, and only the server uses that account.
 */
import { expect } from 'chai';
import mysql from 'mysql2/promise';
import { BASE_URL } from './support/browser';

describe('the e2e server’s database account', function () {
  it('serves requests over connections of the app’s account, which may not change the schema', async function () {
    const appUrl = process.env['E2E_APP_DATABASE_URL'];
    const ownerUrl = process.env['E2E_DATABASE_URL'];
    if (!appUrl || !ownerUrl) {
      console.warn('    E2E_APP_DATABASE_URL or E2E_DATABASE_URL is not set (the npm test runner sets both): skipped.');
      this.skip();
    }
    expect(appUrl, 'the runner gives the server an account of its own').to.not.equal(ownerUrl);
    const c = await mysql.createConnection({ uri: appUrl! });
    try {
      const [[me]] = (await c.query('SELECT CURRENT_USER() AS who, DATABASE() AS db')) as unknown as [{ who: string; db: string }[]];
      const user = me!.who.slice(0, me!.who.lastIndexOf('@'));
      for (let i = 0; i < 3; i++) expect((await fetch(`${BASE_URL}/api/health`)).status).to.equal(200);
      const [server] = (await c.query('SELECT ID AS id FROM information_schema.PROCESSLIST WHERE USER = ? AND DB = ? AND ID <> CONNECTION_ID()', [
        user,
        me!.db,
      ])) as unknown as [{ id: number }[]];
      expect(server.length, 'connections of the server on the app’s account').to.be.above(0);
      const refused = await c.query('CREATE TABLE e2e_sneaked_in (id INT PRIMARY KEY)').then(
        () => null,
        (e: { code?: string }) => e.code,
      );
      expect(refused).to.equal('ER_TABLEACCESS_DENIED_ERROR');
    } finally {
      await c.end();
    }
  });
});
