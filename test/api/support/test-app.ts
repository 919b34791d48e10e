/** The app under test, built with createApp (no port), and agents that talk to it. */
import type { Express, Router } from 'express';
import type { Knex } from 'knex';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { expect } from 'chai';
import { createApp } from '../../../server/app';
import type { Config } from '../../../server/config';
import { CSRF_HEADER } from '../../../shared/api-types';
import type { TestPerson } from './people';

export type Agent = ReturnType<typeof request.agent>;

export function testConfig(overrides: Partial<Config> = {}): Config {
  return {
    databaseUrl: process.env['DATABASE_URL'] ?? '',
    port: 0,
    host: '127.0.0.1',
    sessionSecret: 'test-secret-test-secret-test-secret-0123',
    trustProxy: false,
    distDir: '/nonexistent/kerfbook-dist',
    production: false,
    // Never the working copy's .data/seals: approvals in any test seal the trail.
    sealDir: path.join(os.tmpdir(), `kerfbook-test-seals-${process.pid}`),
    ...overrides,
  };
}

export interface TestApp {
  app: Express;
}

export async function buildTestApp(
  db: Knex,
  options: { config?: Partial<Config>; extraApiRouter?: Router; log?: (...args: unknown[]) => void } = {},
): Promise<TestApp> {
  // No background jobs: tests run supersession and reminders themselves with a chosen
  // `now`, and send the outbox (deliverDueMails) to a catcher they start.
  const built = createApp({
    config: testConfig(options.config),
    db,
    ...(options.extraApiRouter ? { extraApiRouter: options.extraApiRouter } : {}),
    ...(options.log ? { log: options.log } : {}),
  });
  await built.ready;
  return { app: built.app };
}

/** An agent (cookie jar) with the CSRF token of its anonymous session. */
export async function anonymousAgent(app: Express): Promise<{ agent: Agent; csrf: string }> {
  const agent = request.agent(app);
  const res = await agent.get('/api/session/csrf').expect(200);
  return { agent, csrf: res.body.csrfToken as string };
}

/** An agent signed in as the person, with the token for its new session. */
export async function signedInAgent(app: Express, person: Pick<TestPerson, 'username' | 'password'>): Promise<{ agent: Agent; csrf: string }> {
  const { agent, csrf } = await anonymousAgent(app);
  const res = await agent.post('/api/session').set(CSRF_HEADER, csrf).send({ username: person.username, password: person.password });
  expect(res.status, JSON.stringify(res.body)).to.equal(200);
  return { agent, csrf: res.body.csrfToken as string };
}

/** The value of one cookie in a response's Set-Cookie headers, or undefined. */
export function setCookie(res: request.Response, name: string): string | undefined {
  const raw = res.headers['set-cookie'] as unknown as string[] | undefined;
  return raw?.find((c) => c.startsWith(`${name}=`));
}
