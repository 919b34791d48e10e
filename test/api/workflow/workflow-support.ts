/** Helpers for the review workflow tests: people per role, signed-in agents and the calls they make. */
import { expect } from 'chai';
import type { Express } from 'express';
import type { Knex } from 'knex';
import { CSRF_HEADER } from '../../../shared/api-types';
import type { RecipeVersionDto } from '../../../shared/recipe-types';
import type { Role } from '../../../shared/roles';
import { createPerson, type TestPerson } from '../support/people';
import { recipeInput, type StockSet } from '../support/stock';
import { signedInAgent, type Agent } from '../support/test-app';

export interface Session {
  person: TestPerson;
  agent: Agent;
  csrf: string;
}

export async function sessionFor(app: Express, db: Knex, roles: Role[], displayName?: string): Promise<Session> {
  const person = await createPerson(db, { roles, ...(displayName ? { displayName } : {}) });
  return { person, ...(await signedInAgent(app, person)) };
}

const versionPath = (v: Pick<RecipeVersionDto, 'recipeId' | 'version'>) => `/api/recipes/${v.recipeId}/versions/${v.version}`;

export const post = (who: Session, path: string, body: object = {}) => who.agent.post(path).set(CSRF_HEADER, who.csrf).send(body);

export const act = {
  submit: (who: Session, v: RecipeVersionDto, body: object = { revision: v.revision }) => post(who, `${versionPath(v)}/submit`, body),
  return: (who: Session, v: RecipeVersionDto, comment = 'Please give the clamping positions in mm.', body: object = { revision: v.revision, comment }) =>
    post(who, `${versionPath(v)}/return`, body),
  approve: (who: Session, v: RecipeVersionDto, over: object = {}) =>
    post(who, `${versionPath(v)}/approve`, {
      revision: v.revision,
      // Both signature components, as a first signing in a session needs them.
      username: who.person.username,
      password: who.person.password,
      meaning: 'approved',
      acknowledgedWarnings: v.checks.filter((c) => c.severity === 'warning').map((c) => c.id),
      ...over,
    }),
  withdraw: (who: Session, v: RecipeVersionDto, over: object = {}) =>
    post(who, `${versionPath(v)}/withdraw`, {
      revision: v.revision,
      username: who.person.username,
      password: who.person.password,
      meaning: 'withdrawn',
      reason: 'Wheel no longer stocked.',
      ...over,
    }),
  newVersion: (who: Session, recipeId: number, fromVersion: number, changeReason = 'Lower feed after burn marks.') =>
    post(who, `/api/recipes/${recipeId}/versions`, { fromVersion, changeReason }),
  save: (who: Session, v: RecipeVersionDto, change: Partial<RecipeVersionDto['content']> = {}) =>
    who.agent
      .put(versionPath(v))
      .set(CSRF_HEADER, who.csrf)
      .send({ revision: v.revision, title: v.title, content: { ...v.content, ...change } }),
  get: (who: Session, v: Pick<RecipeVersionDto, 'recipeId' | 'version'>) => who.agent.get(versionPath(v)),
};

/** Expects a 2xx answer and returns its body as a version. */
export function ok(res: { status: number; body: unknown }, status = 200): RecipeVersionDto {
  expect(res.status, JSON.stringify(res.body)).to.equal(status);
  return res.body as RecipeVersionDto;
}

export async function createDraft(author: Session, stock: StockSet, over: Parameters<typeof recipeInput>[1] = {}): Promise<RecipeVersionDto> {
  return ok(await post(author, '/api/recipes', recipeInput(stock, over)), 201);
}

/** A version in review: created and submitted by the author. */
export async function inReview(author: Session, stock: StockSet, over: Parameters<typeof recipeInput>[1] = {}): Promise<RecipeVersionDto> {
  return ok(await act.submit(author, await createDraft(author, stock, over)));
}

/** An approved version: created, submitted, approved (effective today). */
export async function approved(author: Session, approver: Session, stock: StockSet, over: Parameters<typeof recipeInput>[1] = {}): Promise<RecipeVersionDto> {
  return ok(await act.approve(approver, await inReview(author, stock, over)));
}
