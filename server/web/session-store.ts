/**
 * The session store on MariaDB (connect-session-knex 5), made safe for a database that
 * comes and goes. The library calls our callback and then re-throws, and its touch()
 * never calls back on failure; express-session ignores the returned promises, so a
 * database outage would crash the process with an unhandled rejection. Here every
 * failure goes to the callback (→ 503) and nothing is left unhandled.
 */
import { ConnectSessionKnexStore } from 'connect-session-knex';
import type { SessionData } from 'express-session';
import type { Knex } from 'knex';

type Callback = (err?: unknown, value?: unknown) => void;

function quiet<T>(promise: Promise<T>): Promise<T> {
  promise.catch(() => undefined);
  return promise;
}

export class SessionStore extends ConnectSessionKnexStore {
  constructor(db: Knex) {
    super({
      knex: db,
      tableName: 'sessions',
      // The table comes from a migration (migrations/…_create_sessions.ts).
      createTable: false,
      // No timer here: expired sessions are deleted by a job of jobs.ts.
      cleanupInterval: 0,
    });
    quiet(this.ready);
  }

  override get(sid: string, callback: (err: unknown, session?: SessionData | null) => void) {
    return quiet(super.get(sid, callback));
  }

  override set(sid: string, session: SessionData, callback?: (err?: unknown) => void) {
    return quiet(super.set(sid, session, callback));
  }

  override destroy(sid: string, callback?: (err?: unknown) => void) {
    return quiet(super.destroy(sid, callback));
  }

  /**
   * A touch only moves the expiry forward, after the answer is written. express-session
   * hands a touch error to next() once the headers are out, and Express then destroys the
   * socket: an answer on its way (even a committed write's 200) reached the client as a
   * reset connection when MariaDB went away at that moment (found by `npm run test:soak`).
   * A failed touch leaves the old expiry, and the next request touches again.
   */
  override touch(sid: string, session: SessionData, callback?: Callback) {
    return super.touch(sid, session, callback).catch(() => callback?.());
  }
}
