/**
 * The trail's hash chain (21 CFR 11.10(e)): every change appends a row linked to
 * the one before, concurrent writers keep the chain whole, the database refuses edits, and
 * an edit made around the database's refusal is found by the route and by the CLI.
 */
import { expect } from 'chai';
import { spawn } from 'node:child_process';
import { CSRF_HEADER } from '../../../shared/api-types';
import type { ChainVerification, RecipeVersionDto } from '../../../shared/recipe-types';
import { createDb } from '../../../server/data/db';
import { appendTrailEvent } from '../../../server/services/trail/append';
import { GENESIS_HASH } from '../../../server/services/trail/hash';
import { apiTestContext } from '../support/hooks';
import { createPerson, type TestPerson } from '../support/people';
import { materialInput, createStockSet, recipeInput } from '../support/stock';
import { anonymousAgent, buildTestApp, signedInAgent, type Agent } from '../support/test-app';
import { testDatabaseUrl } from '../support/test-database';
import { chainRows, insertable, jsonText, lastEventId, linksHold, withoutTrigger } from './support';

/** `npm run trail:verify` as an operator would run it: its own process, DATABASE_URL only. */
function runCli(): Promise<{ code: number; output: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn('npx', ['tsx', 'server/cli/trail-verify.ts'], {
      cwd: process.cwd(),
      env: { ...process.env, DATABASE_URL: testDatabaseUrl(), FORCE_COLOR: '0' },
    });
    let output = '';
    child.stdout.on('data', (c: Buffer) => (output += c.toString()));
    child.stderr.on('data', (c: Buffer) => (output += c.toString()));
    child.on('error', reject);
    child.on('close', (code) => resolve({ code: code ?? -1, output }));
  });
}

describe('Trail hash chain', function () {
  this.timeout(60000);
  const ctx = apiTestContext();
  let admin: TestPerson;
  let auditor: { agent: Agent; csrf: string };

  const verify = async (): Promise<ChainVerification> => {
    const res = await auditor.agent.get('/api/trail/verify');
    expect(res.status, JSON.stringify(res.body)).to.equal(200);
    return res.body as ChainVerification;
  };

  before(async () => {
    admin = await createPerson(ctx.db, { roles: ['admin'], displayName: 'Chain Admin' });
    auditor = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: ['auditor'] }));
  });

  it('links every kind of change to the row before it, from the first row on', async () => {
    const mark = await lastEventId(ctx.db);
    const adminSession = await signedInAgent(ctx.app, admin);
    const created = await adminSession.agent
      .post('/api/users')
      .set(CSRF_HEADER, adminSession.csrf)
      .send({ username: 'chain.author', displayName: 'Chain Author', roles: ['author'], temporaryPassword: 'a temporary one 123' });
    expect(created.status, JSON.stringify(created.body)).to.equal(201);
    await adminSession.agent.patch(`/api/users/${created.body.id}`).set(CSRF_HEADER, adminSession.csrf).send({ displayName: 'Chain Author Two' }).expect(200);

    const authorPerson = await createPerson(ctx.db, { roles: ['author'] });
    const author = await signedInAgent(ctx.app, authorPerson);
    await author.agent
      .post('/api/materials')
      .set(CSRF_HEADER, author.csrf)
      .send(materialInput({ name: 'Chained steel' }))
      .expect(201);
    const stock = await createStockSet(ctx.db);
    const recipe = (await author.agent.post('/api/recipes').set(CSRF_HEADER, author.csrf).send(recipeInput(stock)).expect(201)).body as RecipeVersionDto;
    await author.agent
      .put(`/api/recipes/${recipe.recipeId}/versions/1`)
      .set(CSRF_HEADER, author.csrf)
      .send({ revision: 0, title: recipe.title, content: { ...recipe.content, cutting: { ...recipe.content.cutting, feedMmS: 0.3 } } })
      .expect(200);
    await author.agent.patch('/api/session/preferences').set(CSRF_HEADER, author.csrf).send({ units: 'metric+imperial' }).expect(200);
    const stranger = await anonymousAgent(ctx.app);
    await stranger.agent
      .post('/api/session')
      .set(CSRF_HEADER, stranger.csrf)
      .send({ username: authorPerson.username, password: 'not the password' })
      .expect(401);
    // Sign-out records without a transaction of its own: appendTrailEvent opens one for the chain.
    await author.agent.delete('/api/session').set(CSRF_HEADER, author.csrf).expect(204);

    const rows = await chainRows(ctx.db, mark);
    const types = rows.map((r) => r.event_type);
    expect(types).to.include.members([
      'session.signed_in',
      'user.created',
      'user.details_changed',
      'material.created',
      'recipe.created',
      'recipe.draft_saved',
      'user.preferences_changed',
      'session.sign_in_failed',
      'session.signed_out',
    ]);
    const all = await chainRows(ctx.db);
    expect(all[0]!.prev_hash).to.equal(GENESIS_HASH);
    expect(linksHold(all, GENESIS_HASH)).to.deep.equal({ ok: true });
    // Each row names the one before it: spot-check across kinds.
    for (let i = 1; i < rows.length; i++) expect(rows[i]!.prev_hash, `${rows[i]!.event_type} after ${rows[i - 1]!.event_type}`).to.equal(rows[i - 1]!.hash);
    for (const row of rows) expect(row.hash).to.match(/^[0-9a-f]{64}$/);
    // Recipe and version events carry the recipe, for the trail's recipe filter.
    expect(rows.filter((r) => r.event_type.startsWith('recipe.')).map((r) => r.recipe_id)).to.deep.equal([recipe.recipeId, recipe.recipeId]);

    expect(await verify()).to.deep.equal({ ok: true, checked: all.length, firstBroken: null });
  });

  it('keeps the chain whole when two app processes append at the same moment', async () => {
    // A second app with its own connection pool: to MariaDB it is another server process.
    const otherDb = createDb(testDatabaseUrl());
    const other = await buildTestApp(otherDb);
    try {
      const people = await Promise.all(Array.from({ length: 20 }, (_, i) => createPerson(ctx.db, { roles: ['operator'], displayName: `Parallel ${i}` })));
      const sessions = await Promise.all(people.map((p, i) => signedInAgent(i % 2 === 0 ? ctx.app : other.app, p)));
      const mark = await lastEventId(ctx.db);
      const answers = await Promise.all([
        ...sessions.map((s) => s.agent.patch('/api/session/preferences').set(CSRF_HEADER, s.csrf).send({ units: 'metric+imperial' })),
        // Appends with no caller transaction, in parallel with the others.
        ...people
          .slice(0, 5)
          .map((p) =>
            appendTrailEvent(
              otherDb,
              { userId: p.id, name: p.displayName, clientAddress: '' },
              { type: 'user.password_changed', entityType: 'user', entityId: p.id },
            ),
          ),
      ]);
      for (const res of answers) if (res) expect((res as { status: number }).status).to.equal(200);

      const added = await chainRows(ctx.db, mark);
      expect(added.filter((r) => r.event_type === 'user.preferences_changed')).to.have.length(20);
      expect(added).to.have.length(25);
      // Ids follow each other without a gap, each row linked to the one committed before it.
      expect(added.map((r) => r.id)).to.deep.equal(Array.from({ length: 25 }, (_, i) => mark + 1 + i));
      const before = (await ctx.db('trail_events').where({ id: mark }).first('hash')) as { hash: string };
      expect(linksHold(added, before.hash)).to.deep.equal({ ok: true });
      const result = await verify();
      expect(result.ok).to.equal(true);
      expect(result.checked).to.equal(await lastEventId(ctx.db));
    } finally {
      await otherDb.destroy();
    }
  });

  describe('append-only in the database', () => {
    it('refuses UPDATE of a trail row and leaves it as it was', async () => {
      const row = (await chainRows(ctx.db)).at(-1)!;
      const err = await ctx
        .db('trail_events')
        .where({ id: row.id })
        .update({ actor_name: 'Someone else' })
        .then(
          () => null,
          (e: { sqlState?: string; message: string }) => e,
        );
      expect(err, 'the UPDATE went through').to.not.equal(null);
      expect(err!.sqlState).to.equal('45000');
      expect(err!.message).to.match(/append-only/);
      expect(((await ctx.db('trail_events').where({ id: row.id }).first()) as { actor_name: string }).actor_name).to.equal(row['actor_name']);
    });

    it('refuses DELETE of a trail row, even of every row', async () => {
      const count = (await chainRows(ctx.db)).length;
      for (const attempt of [() => ctx.db('trail_events').where({ id: 1 }).del(), () => ctx.db('trail_events').del()]) {
        const err = await attempt().then(
          () => null,
          (e: { sqlState?: string }) => e,
        );
        expect(err?.sqlState).to.equal('45000');
      }
      expect((await chainRows(ctx.db)).length).to.equal(count);
    });
  });

  describe('tampering around the triggers', () => {
    it('names an edited row (content no longer matches its hash) on the route and in the CLI, and clears once it is put back', async () => {
      const rows = await chainRows(ctx.db);
      const target = rows.find((r) => r.event_type === 'user.preferences_changed')!;
      const original = jsonText(target['after_json']);
      await withoutTrigger(ctx.db, 'trail_events_refuse_update', () =>
        ctx
          .db('trail_events')
          .where({ id: target.id })
          .update({ after_json: JSON.stringify({ units: 'metric' }) }),
      );

      expect(await verify()).to.deep.equal({
        ok: false,
        checked: rows.indexOf(target),
        firstBroken: { id: target.id, reason: 'stored hash does not match its content' },
      });
      const cli = await runCli();
      expect(cli.code, cli.output).to.equal(1);
      expect(cli.output).to.include(`Trail BROKEN at event #${target.id}: stored hash does not match its content`);

      await withoutTrigger(ctx.db, 'trail_events_refuse_update', () => ctx.db('trail_events').where({ id: target.id }).update({ after_json: original }));
      expect((await verify()).ok).to.equal(true);
      const again = await runCli();
      expect(again.code, again.output).to.equal(0);
      expect(again.output).to.include(`Trail verified: ${rows.length} events, chain intact.`);
    });

    it('names the row after an edited one whose hash was recomputed too (the link breaks)', async () => {
      const rows = await chainRows(ctx.db);
      const [victim, next] = [rows[3]!, rows[4]!];
      const { chainedFields } = await import('../../../server/services/trail/stored-row');
      const { trailHash } = await import('../../../server/services/trail/hash');
      const forged = { ...victim, actor_name: 'Forged Name' };
      const forgedHash = trailHash(chainedFields(forged as never));
      await withoutTrigger(ctx.db, 'trail_events_refuse_update', () =>
        ctx.db('trail_events').where({ id: victim.id }).update({ actor_name: 'Forged Name', hash: forgedHash }),
      );
      try {
        const result = await verify();
        expect(result.firstBroken).to.deep.equal({ id: next.id, reason: `prev_hash does not match row ${victim.id}'s hash` });
      } finally {
        await withoutTrigger(ctx.db, 'trail_events_refuse_update', () =>
          ctx.db('trail_events').where({ id: victim.id }).update({ actor_name: victim['actor_name'], hash: victim.hash }),
        );
      }
      expect((await verify()).ok).to.equal(true);
    });

    it('finds a deleted last row through the chain head, on the route and in the CLI', async () => {
      const last = (await chainRows(ctx.db)).at(-1)!;
      await withoutTrigger(ctx.db, 'trail_events_refuse_delete', () => ctx.db('trail_events').where({ id: last.id }).del());
      try {
        const reason = `rows after ${last.id - 1} are missing (head mismatch)`;
        expect(await verify()).to.deep.include({ ok: false, firstBroken: { id: last.id, reason } });
        const cli = await runCli();
        expect(cli.code, cli.output).to.equal(1);
        expect(cli.output).to.include(`Trail BROKEN at event #${last.id}: ${reason}`);
      } finally {
        await ctx.db('trail_events').insert(insertable(last));
      }
      expect((await verify()).ok).to.equal(true);
    });

    it('finds a row deleted from the middle (the next row links to a hash no longer there)', async () => {
      const rows = await chainRows(ctx.db);
      const [gone, next] = [rows[5]!, rows[6]!];
      await withoutTrigger(ctx.db, 'trail_events_refuse_delete', () => ctx.db('trail_events').where({ id: gone.id }).del());
      try {
        expect((await verify()).firstBroken).to.deep.equal({ id: next.id, reason: `prev_hash does not match row ${rows[4]!.id}'s hash` });
      } finally {
        await ctx.db('trail_events').insert(insertable(gone));
      }
      expect((await verify()).ok).to.equal(true);
    });

    it('finds a row slipped in behind the chain head', async () => {
      const last = (await chainRows(ctx.db)).at(-1)!;
      const slipped = { ...insertable(last), id: last.id + 1, prev_hash: last.hash, actor_name: 'Not appended' };
      await ctx.db('trail_events').insert(slipped);
      try {
        expect((await verify()).firstBroken?.id).to.equal(last.id + 1);
      } finally {
        await withoutTrigger(ctx.db, 'trail_events_refuse_delete', () =>
          ctx
            .db('trail_events')
            .where({ id: last.id + 1 })
            .del(),
        );
      }
      expect((await verify()).ok).to.equal(true);
    });

    it('walks the trail in batches and still names the first broken row', async () => {
      const { verifyChain } = await import('../../../server/services/trail/verify');
      const rows = await chainRows(ctx.db);
      expect(await verifyChain(ctx.db, 3)).to.deep.equal({ ok: true, checked: rows.length, firstBroken: null });
      const target = rows[7]!;
      await withoutTrigger(ctx.db, 'trail_events_refuse_update', () => ctx.db('trail_events').where({ id: target.id }).update({ client_address: '10.9.9.9' }));
      try {
        expect((await verifyChain(ctx.db, 3)).firstBroken).to.deep.equal({ id: target.id, reason: 'stored hash does not match its content' });
      } finally {
        await withoutTrigger(ctx.db, 'trail_events_refuse_update', () =>
          ctx.db('trail_events').where({ id: target.id }).update({ client_address: target['client_address'] }),
        );
      }
    });
  });

  describe('access', () => {
    it('lets auditors and admins verify; others get 403', async () => {
      const adminSession = await signedInAgent(ctx.app, admin);
      expect((await adminSession.agent.get('/api/trail/verify')).status).to.equal(200);
      for (const role of ['author', 'approver', 'operator'] as const) {
        const s = await signedInAgent(ctx.app, await createPerson(ctx.db, { roles: [role] }));
        const res = await s.agent.get('/api/trail/verify');
        expect(res.status, role).to.equal(403);
        expect(res.body.code).to.equal('FORBIDDEN');
      }
      const anon = await anonymousAgent(ctx.app);
      expect((await anon.agent.get('/api/trail/verify')).status).to.equal(401);
    });
  });
});
