/**
 * Wrong passwords typed by a signed-in person — when signing (approve, withdraw) or when
 * changing their own password — are limited per person, whatever the address: after
 * MAX_PASSWORD_CHECK_FAILURES in the window every further try answers 429, even with the
 * right password. Each wrong password is a trail event; reaching the limit mails the admins
 * and ends the person's sessions. Against the real MariaDB.
 */
import { expect } from 'chai';
import { CSRF_HEADER } from '../../../shared/api-types';
import { inTrailFamily } from '../../../shared/trail-families';
import { trailEventLabel } from '../../../shared/vocabulary';
import { MAX_PASSWORD_CHECK_FAILURES, PASSWORD_CHECK_WINDOW_MS } from '../../../server/services/auth/password-check-limiter';
import { TRAIL_EVENTS } from '../../../server/services/trail/event-types';
import { apiTestContext } from '../support/hooks';
import { createPerson } from '../support/people';
import { createStockSet, type StockSet } from '../support/stock';
import { signedInAgent } from '../support/test-app';
import { countRows } from '../support/test-database';
import { act, approved, inReview, ok, sessionFor, type Session } from '../workflow/workflow-support';

describe('Wrong-password limit on signatures and password changes (per person)', function () {
  this.timeout(120000);
  const ctx = apiTestContext({ trustProxy: 'loopback' });
  let author: Session;
  let stock: StockSet;
  const adminAddresses: string[] = [];

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author'], 'Ines Author');
    stock = await createStockSet(ctx.db);
    for (const name of ['adam.admin', 'alma.admin']) {
      await createPerson(ctx.db, { username: name, roles: ['admin'] });
      adminAddresses.push(`${name}@lab.example`);
    }
    // A deactivated admin hears nothing.
    await createPerson(ctx.db, { username: 'old.admin', roles: ['admin'], active: false });
  });

  const trailOf = (userId: number, type: string) => ctx.db('trail_events').where({ actor_user_id: userId, event_type: type }).orderBy('id');
  const json = (value: unknown) => (typeof value === 'string' ? JSON.parse(value) : value) as Record<string, unknown>;
  const versionIdOf = async (v: { recipeId: number; version: number }) =>
    Number((await ctx.db('recipe_versions').where({ recipe_id: v.recipeId, version: v.version }).first('id')).id);
  const limitMails = () => ctx.db('mail_outbox').where({ kind: 'wrong-password-limit' }).orderBy('id');
  const signIn = async (who: Session): Promise<Session> => ({ person: who.person, ...(await signedInAgent(ctx.app, who.person)) });
  const changePassword = (who: Session, currentPassword: string, newPassword = 'a-brand-new-passphrase') =>
    who.agent.post('/api/session/password').set(CSRF_HEADER, who.csrf).send({ currentPassword, newPassword });
  const moveFailuresBack = (userId: number) =>
    ctx
      .db('password_check_failures')
      .where({ user_id: userId })
      .update({ failed_at: new Date(Date.now() - PASSWORD_CHECK_WINDOW_MS - 1000) });

  it('limits signature passwords: 30 wrong tries, then the right one is refused; trail rows, admin mail, session ended', async () => {
    expect(MAX_PASSWORD_CHECK_FAILURES).to.equal(5);
    expect(PASSWORD_CHECK_WINDOW_MS).to.equal(15 * 60 * 1000);
    let approver = await sessionFor(ctx.app, ctx.db, ['approver'], 'Greta Approver');
    const v = await inReview(author, stock, { title: 'Guessed signature' });
    const mailsBefore = (await limitMails()).length;

    for (let i = 1; i < MAX_PASSWORD_CHECK_FAILURES; i++) {
      const res = await act.approve(approver, v, { password: `guess number ${i}` });
      expect(res.status, `try ${i}: ${JSON.stringify(res.body)}`).to.equal(400);
      expect(res.body.errors[0].path).to.equal('password');
    }
    // The try that reaches the limit is refused as too many, and the session ends.
    const reaching = await act.approve(approver, v, { password: `guess number ${MAX_PASSWORD_CHECK_FAILURES}` });
    expect(reaching.status, JSON.stringify(reaching.body)).to.equal(429);
    expect(reaching.body.code).to.equal('TOO_MANY_ATTEMPTS');
    expect(reaching.body.errors[0].message).to.match(/5 wrong passwords in 15 minutes/);
    expect(reaching.body.errors[0].message).to.match(/signed out/);
    expect((await approver.agent.get('/api/session')).status).to.equal(401);

    // Signed in again, the rest of the 30 guesses are all refused without being checked …
    approver = await signIn(approver);
    for (let i = MAX_PASSWORD_CHECK_FAILURES + 1; i <= 30; i++) {
      const res = await act.approve(approver, v, { password: `guess number ${i}` });
      expect(res.status, `try ${i}`).to.equal(429);
    }
    // … and so is the right password.
    const right = await act.approve(approver, v);
    expect(right.status).to.equal(429);
    expect(right.body.code).to.equal('TOO_MANY_ATTEMPTS');
    expect(right.body.errors[0].message).to.match(
      /Too many wrong passwords\. Signing and changing your password are blocked; try again in \d+ minutes? \(after \d\d:\d\d UTC\)/,
    );
    expect(Number(right.headers['retry-after'])).to.be.within(1, 15 * 60);
    expect((await act.get(approver, v)).body.status).to.equal('in-review');
    expect(await ctx.db('signatures').where({ signer_id: approver.person.id }).count({ n: '*' }).first()).to.deep.equal({ n: 0 });
    // Still signed in after a refusal: only reaching the limit ends the sessions.
    expect((await approver.agent.get('/api/session')).status).to.equal(200);

    // One trail row per wrong password (the refused tries were never checked), one for the limit.
    const wrong = await trailOf(approver.person.id, TRAIL_EVENTS.signaturePasswordWrong);
    expect(wrong).to.have.length(MAX_PASSWORD_CHECK_FAILURES);
    const versionId = await versionIdOf(v);
    expect(wrong.every((e) => e.entity_type === 'recipe_version' && Number(e.entity_id) === versionId)).to.equal(true);
    expect(json(wrong[0].after_json)).to.deep.include({ meaning: 'approved' });
    expect(JSON.stringify(wrong)).not.to.match(/guess number/);
    const limited = await trailOf(approver.person.id, TRAIL_EVENTS.wrongPasswordLimitReached);
    expect(limited).to.have.length(1);
    expect(json(limited[0].after_json)).to.deep.include({ failures: 5, windowMinutes: 15, sessionsEnded: true });

    // The auditor reads them in words; they show under signatures and under people.
    for (const type of [TRAIL_EVENTS.signaturePasswordWrong, TRAIL_EVENTS.wrongPasswordLimitReached]) {
      expect(trailEventLabel(type)).not.to.equal(type);
      expect(inTrailFamily(type, 'signatures'), type).to.equal(true);
      expect(inTrailFamily(type, 'people'), type).to.equal(true);
      expect(inTrailFamily(type, 'sign-ins'), type).to.equal(false);
    }

    // Every active admin with an address gets one mail naming the person; no more for the refused tries.
    const mails = (await limitMails()).slice(mailsBefore);
    expect(mails.map((m) => m.to_address).sort()).to.deep.equal([...adminAddresses].sort());
    expect(mails[0].subject).to.equal(`Wrong passwords: Greta Approver (${approver.person.username}) is blocked from signing`);
    expect(mails[0].text_body).to.match(/5 wrong passwords in 15 minutes were typed while signing/);
    expect(mails[0].text_body).to.match(/signed out everywhere/);
  });

  it('counts per person, not per address: another address does not help, another person is not affected', async () => {
    const approver = await sessionFor(ctx.app, ctx.db, ['approver']);
    const other = await sessionFor(ctx.app, ctx.db, ['approver']);
    const v = await inReview(author, stock, { title: 'Per person' });
    for (let i = 1; i < MAX_PASSWORD_CHECK_FAILURES; i++) {
      const address = `203.0.113.${i}`;
      const res = await approver.agent
        .post(`/api/recipes/${v.recipeId}/versions/${v.version}/approve`)
        .set(CSRF_HEADER, approver.csrf)
        .set('X-Forwarded-For', address)
        .send({ revision: v.revision, username: approver.person.username, password: 'wrong one', meaning: 'approved', acknowledgedWarnings: [] });
      expect(res.status).to.equal(400);
    }
    expect((await act.approve(approver, v, { password: 'wrong again' })).status).to.equal(429);
    // The other approver signs as usual; the sign-in counter was not touched.
    expect(ok(await act.approve(other, v)).status).to.equal('approved');
    expect(await countRows(ctx.db, 'sign_in_failures')).to.equal(0);
  });

  it('a withdrawal signature counts too, and the count is shared with password changes', async () => {
    let approver = await sessionFor(ctx.app, ctx.db, ['approver']);
    const other = await sessionFor(ctx.app, ctx.db, ['approver']);
    const inUse = await approved(author, other, stock, { title: 'To withdraw' });
    for (let i = 1; i < MAX_PASSWORD_CHECK_FAILURES - 1; i++) expect((await changePassword(approver, `wrong current ${i}`)).status).to.equal(400);
    const withdrawal = await act.withdraw(approver, inUse, { password: 'not it' });
    expect(withdrawal.status).to.equal(400);
    const [row] = await trailOf(approver.person.id, TRAIL_EVENTS.signaturePasswordWrong);
    expect(json(row.after_json)).to.deep.include({ meaning: 'withdrawn' });
    const v = await inReview(author, stock, { title: 'Shared count' });
    expect((await act.approve(approver, v, { password: 'nope' })).status).to.equal(429);
    approver = await signIn(approver);
    expect((await act.approve(approver, v)).status).to.equal(429);
    expect((await act.withdraw(approver, inUse)).status).to.equal(429);
  });

  it('limits the password change the same way: the right current password is refused after the limit', async () => {
    let person = await sessionFor(ctx.app, ctx.db, ['auditor'], 'Mara Auditor');
    const hashBefore = (await ctx.db('users').where({ id: person.person.id }).first()).password_hash;
    const mailsBefore = (await limitMails()).length;
    for (let i = 1; i < MAX_PASSWORD_CHECK_FAILURES; i++) {
      const res = await changePassword(person, `wrong current ${i}`);
      expect(res.status, `try ${i}`).to.equal(400);
      expect(res.body.errors).to.deep.equal([{ path: 'currentPassword', message: 'The current password is not correct.' }]);
    }
    const reaching = await changePassword(person, 'wrong current 5');
    expect(reaching.status).to.equal(429);
    expect(reaching.body.errors[0].message).to.match(/5 wrong passwords in 15 minutes/);
    expect((await person.agent.get('/api/session')).status).to.equal(401);

    person = await signIn(person);
    for (let i = 6; i <= 30; i++) expect((await changePassword(person, `wrong current ${i}`)).status, `try ${i}`).to.equal(429);
    const right = await changePassword(person, person.person.password);
    expect(right.status).to.equal(429);
    expect(right.body.code).to.equal('TOO_MANY_ATTEMPTS');
    expect(Number(right.headers['retry-after'])).to.be.within(1, 15 * 60);
    expect((await ctx.db('users').where({ id: person.person.id }).first()).password_hash).to.equal(hashBefore);

    expect(await trailOf(person.person.id, TRAIL_EVENTS.currentPasswordWrong)).to.have.length(MAX_PASSWORD_CHECK_FAILURES);
    expect(trailEventLabel(TRAIL_EVENTS.currentPasswordWrong)).not.to.equal(TRAIL_EVENTS.currentPasswordWrong);
    expect(inTrailFamily(TRAIL_EVENTS.currentPasswordWrong, 'people')).to.equal(true);
    expect(await trailOf(person.person.id, TRAIL_EVENTS.wrongPasswordLimitReached)).to.have.length(1);
    const mails = (await limitMails()).slice(mailsBefore);
    expect(mails.map((m) => m.to_address).sort()).to.deep.equal([...adminAddresses].sort());
    expect(mails[0].text_body).to.match(/5 wrong passwords in 15 minutes were typed while changing their password/);
  });

  it('lifts the limit once the failures are older than 15 minutes: the signature and the password change pass', async () => {
    let approver = await sessionFor(ctx.app, ctx.db, ['approver']);
    const v = await inReview(author, stock, { title: 'Window lifts' });
    for (let i = 1; i < MAX_PASSWORD_CHECK_FAILURES; i++) expect((await act.approve(approver, v, { password: `bad ${i}` })).status).to.equal(400);
    expect((await act.approve(approver, v, { password: 'bad 5' })).status).to.equal(429);
    approver = await signIn(approver);
    expect((await act.approve(approver, v)).status).to.equal(429);

    await moveFailuresBack(approver.person.id);
    expect(ok(await act.approve(approver, v)).status).to.equal('approved');
    const changed = await changePassword(approver, approver.person.password);
    expect(changed.status, JSON.stringify(changed.body)).to.equal(200);
  });

  it('a right password clears the count: four wrong, one right, four wrong again are not yet the limit', async () => {
    const approver = await sessionFor(ctx.app, ctx.db, ['approver']);
    const first = await inReview(author, stock, { title: 'Typos one' });
    for (let i = 1; i < MAX_PASSWORD_CHECK_FAILURES; i++) expect((await act.approve(approver, first, { password: `typo ${i}` })).status).to.equal(400);
    ok(await act.approve(approver, first));
    const second = await inReview(author, stock, { title: 'Typos two' });
    for (let i = 1; i < MAX_PASSWORD_CHECK_FAILURES; i++) {
      expect((await act.approve(approver, second, { username: undefined, password: `typo ${i}` })).status).to.equal(400);
    }
    ok(await act.approve(approver, second, { username: undefined }));
  });
});
