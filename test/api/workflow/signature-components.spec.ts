/**
 * Signature components in a continuous session (21 CFR 11.200(a)(1)(i)–(ii)): the first
 * signing takes the username and the password, later signings in the same session the
 * password only; a new session asks for both again. Against the real MariaDB.
 */
import { expect } from 'chai';
import { apiTestContext } from '../support/hooks';
import { signedInAgent } from '../support/test-app';
import { createStockSet, type StockSet } from '../support/stock';
import { countRows } from '../support/test-database';
import { act, approved, inReview, ok, sessionFor, type Session } from './workflow-support';

describe('Signature components in a session', () => {
  const ctx = apiTestContext();
  let author: Session;
  let stock: StockSet;

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author'], 'Ines Author');
    stock = await createStockSet(ctx.db);
  });

  const fieldErrors = (res: { body: { errors?: { path: string; message: string }[] } }) =>
    Object.fromEntries((res.body.errors ?? []).map((e) => [e.path, e.message]));
  const needsUsername = async (who: Session) => ((await who.agent.get('/api/session')).body as { signatureNeedsUsername: boolean }).signatureNeedsUsername;

  it('the first signing in a session without the username is refused on "username" and changes nothing', async () => {
    const approver = await sessionFor(ctx.app, ctx.db, ['approver']);
    const v = await inReview(author, stock);
    expect(await needsUsername(approver)).to.equal(true);
    const signatures = await countRows(ctx.db, 'signatures');
    const res = await act.approve(approver, v, { username: undefined });
    expect(res.status).to.equal(400);
    expect(fieldErrors(res)).to.deep.equal({ username: 'Your first signature in this session takes both parts: type your username as well as your password.' });
    expect(await countRows(ctx.db, 'signatures')).to.equal(signatures);
    expect((await act.get(approver, v)).body.status).to.equal('in-review');
  });

  it("a username that is not the signed-in person's is refused, even with the right password", async () => {
    const approver = await sessionFor(ctx.app, ctx.db, ['approver']);
    const other = await sessionFor(ctx.app, ctx.db, ['approver']);
    const v = await inReview(author, stock);
    const res = await act.approve(approver, v, { username: other.person.username });
    expect(res.status).to.equal(400);
    expect(fieldErrors(res)).to.deep.equal({ username: 'This is not the username you are signed in with. Only you can sign as yourself.' });
    // Neither does a refused attempt count as the session's full signing.
    expect(await needsUsername(approver)).to.equal(true);
    expect(fieldErrors(await act.approve(approver, v, { username: undefined }))).to.have.property('username');
  });

  it('a wrong username and a wrong password are both reported at once', async () => {
    const approver = await sessionFor(ctx.app, ctx.db, ['approver']);
    const v = await inReview(author, stock);
    const res = await act.approve(approver, v, { username: 'someone-else', password: 'not my password' });
    expect(res.status).to.equal(400);
    expect(Object.keys(fieldErrors(res)).sort()).to.deep.equal(['password', 'username']);
  });

  it('after a full signing, the next signing in the same session takes the password only; the username is still checked when typed', async () => {
    const approver = await sessionFor(ctx.app, ctx.db, ['approver']);
    const first = await approved(author, approver, stock);
    expect(first.status).to.equal('approved');
    expect(await needsUsername(approver)).to.equal(false);

    const second = await inReview(author, stock);
    const signed = ok(await act.approve(approver, second, { username: undefined }));
    expect(signed.status).to.equal('approved');
    // Withdrawal is a signing too.
    ok(await act.withdraw(approver, signed, { username: undefined }));

    const third = await inReview(author, stock);
    const res = await act.approve(approver, third, { username: author.person.username });
    expect(fieldErrors(res)).to.deep.equal({ username: 'This is not the username you are signed in with. Only you can sign as yourself.' });
    // A wrong password is still refused without the username.
    expect(fieldErrors(await act.approve(approver, third, { username: undefined, password: 'not my password' }))).to.have.keys('password');
  });

  it('a new session (signing in again) asks for both components again', async () => {
    const approver = await sessionFor(ctx.app, ctx.db, ['approver']);
    await approved(author, approver, stock);
    expect(await needsUsername(approver)).to.equal(false);
    const again: Session = { person: approver.person, ...(await signedInAgent(ctx.app, approver.person)) };
    expect(await needsUsername(again)).to.equal(true);
    const v = await inReview(author, stock);
    expect(fieldErrors(await act.approve(again, v, { username: undefined }))).to.have.keys('username');
    // The first session is still a continuous session of its own.
    ok(await act.approve(approver, v, { username: undefined }));
  });

  it('the username is matched without regard to case and surrounding spaces, as signing in does', async () => {
    const approver = await sessionFor(ctx.app, ctx.db, ['approver']);
    const v = await inReview(author, stock);
    ok(await act.approve(approver, v, { username: `  ${approver.person.username.toUpperCase()} ` }));
  });

  it('the sign-in answer says the first signature needs the username', async () => {
    const approver = await sessionFor(ctx.app, ctx.db, ['approver']);
    const res = await approver.agent
      .post('/api/session')
      .set('x-csrf-token', approver.csrf)
      .send({ username: approver.person.username, password: approver.person.password });
    expect(res.body.signatureNeedsUsername).to.equal(true);
  });
});
