/**
 * The session store's touch runs after the answer is written. When MariaDB is gone at that
 * moment the touch must not fail the request: express-session would pass the error to
 * next() after the headers went out, and Express would destroy the socket — the client of a
 * committed write saw a reset connection instead of its 200 (found by `npm run test:soak`).
 */
import { expect } from 'chai';
import type { SessionData } from 'express-session';
import { createDb } from '../../../server/data/db';
import { SessionStore } from '../../../server/web/session-store';
import { testDatabaseUrl, testDb } from '../support/test-database';

describe('Session touch while the database is gone', () => {
  it('calls back without an error (the old expiry stays)', async () => {
    await testDb(); // migrated: the sessions table exists
    const db = createDb(testDatabaseUrl());
    const store = new SessionStore(db);
    await store.ready;
    await db.destroy(); // every later query fails, as with MariaDB away
    const session = { cookie: { expires: new Date(Date.now() + 3600_000), originalMaxAge: 3600_000 } } as unknown as SessionData;
    const err = await new Promise<unknown>((resolve) => void store.touch('some-session-id', session, (e?: unknown) => resolve(e)));
    expect(err).to.equal(undefined);
  });
});
