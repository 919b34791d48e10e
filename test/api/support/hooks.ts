/**
 * Per-file set-up for API tests: empty tables, a fresh app. Call `apiTestContext()` at
 * the top of a describe block; its fields are filled in before the first test.
 */
import type { Express } from 'express';
import type { Knex } from 'knex';
import type { Config } from '../../../server/config';
import { resetTables, testDb } from './test-database';
import { buildTestApp } from './test-app';

export interface ApiTestContext {
  db: Knex;
  app: Express;
}

export function apiTestContext(config: Partial<Config> = {}): ApiTestContext {
  const ctx = {} as ApiTestContext;
  before(async function () {
    this.timeout(60000);
    ctx.db = await testDb();
    await resetTables(ctx.db);
    const built = await buildTestApp(ctx.db, { config });
    ctx.app = built.app;
  });
  return ctx;
}
