/**
 * Stops the test MariaDB and starts it again while the app keeps running. Needs
 * KERFBOOK_TEST_MARIADB_DIR and KERFBOOK_TEST_MARIADB_PORT (set by the `npm test` runner
 * for its throw-away MariaDB); pending without them.
 */
import { expect } from 'chai';
import { localMariadb, start, stop, type LocalMariadb } from '../../../server/tools/local-mariadb';
import { apiTestContext } from '../support/hooks';
import { createPerson } from '../support/people';
import { signedInAgent, type Agent } from '../support/test-app';

describe('When MariaDB goes away and comes back', function () {
  this.timeout(90_000);
  const dir = process.env['KERFBOOK_TEST_MARIADB_DIR'];
  const port = Number(process.env['KERFBOOK_TEST_MARIADB_PORT'] ?? 0);
  let mariadb: LocalMariadb | null = null;
  const ctx = apiTestContext();
  let admin: Agent;

  before(async function () {
    if (!dir || !port) this.skip();
    mariadb = localMariadb(dir, port);
    const person = await createPerson(ctx.db, { roles: ['admin'] });
    admin = (await signedInAgent(ctx.app, person)).agent;
  });

  after(async () => {
    // Whatever happened above, leave the server running for the rest of the suite.
    if (mariadb) await start(mariadb);
  });

  it('answers 503 DATABASE_UNAVAILABLE while it is down and recovers without a restart', async () => {
    await admin.get('/api/users').expect(200);
    await stop(mariadb!);

    const health = await admin.get('/api/health');
    expect(health.status).to.equal(503);
    expect(health.body.code).to.equal('DATABASE_UNAVAILABLE');
    for (const url of ['/api/session', '/api/users']) {
      const res = await admin.get(url);
      expect(res.status, url).to.equal(503);
      expect(res.body.code, url).to.equal('DATABASE_UNAVAILABLE');
      expect(res.text, url).not.to.match(/ECONNREFUSED|127\.0\.0\.1|select/i);
    }

    await start(mariadb!);

    expect((await admin.get('/api/health')).status).to.equal(200);
    // The session survived in MariaDB: the same cookie still works.
    expect((await admin.get('/api/session')).status).to.equal(200);
    expect((await admin.get('/api/users')).status).to.equal(200);
  });
});
