/**
 * "Read and understood": an operator of the version's machine acknowledges an
 * approved version (in use or coming) before printing its bench sheet; everyone else
 * prints as before. Acknowledging is idempotent and audited; the list shows who has not
 * yet; Today lists the versions in use an operator still has to acknowledge.
 */
import { expect } from 'chai';
import type { AcknowledgementsDto, ChangesSinceAcknowledgedDto, RecipeVersionDto, TodayDto } from '../../../shared/recipe-types';
import { apiTestContext } from '../support/hooks';
import { createPerson } from '../support/people';
import { createStockSet, type StockSet } from '../support/stock';
import { asJson, countRows } from '../support/test-database';
import { getSheet } from '../sheet/sheet-support';
import { act, approved, createDraft, ok, post, sessionFor, type Session } from '../workflow/workflow-support';

const DAY_MS = 86400000;
const day = (offset: number) => new Date(Date.now() + offset * DAY_MS).toISOString().slice(0, 10);

describe('Acknowledgements', () => {
  const ctx = apiTestContext();
  let author: Session;
  let approver: Session;
  let auditor: Session;
  let operator: Session;
  let colleague: Session;
  let operatorAuthor: Session;
  let elsewhere: Session;
  let stock: StockSet;
  let current: RecipeVersionDto;

  const path = (v: Pick<RecipeVersionDto, 'recipeId' | 'version'>) => `/api/recipes/${v.recipeId}/versions/${v.version}`;
  const acknowledge = (who: Session, v: Pick<RecipeVersionDto, 'recipeId' | 'version'>) => post(who, `${path(v)}/acknowledge`);
  const mine = async (who: Session, v: RecipeVersionDto) => ((await who.agent.get(path(v)).expect(200)).body as RecipeVersionDto).myAcknowledgement;
  const today = async (who: Session) => (await who.agent.get('/api/today').expect(200)).body as TodayDto;
  const written = async () => ({ acks: await countRows(ctx.db, 'acknowledgements'), trail: await countRows(ctx.db, 'trail_events') });
  const aCut = (specimenId: string) => ({ specimenId, partRef: '', quantity: 1, outcome: 'good', notes: '' });
  const assign = (userId: number, machineId: number) => ctx.db('user_machines').insert({ user_id: userId, machine_id: machineId, assigned_at: new Date() });

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author'], 'Ines Author');
    approver = await sessionFor(ctx.app, ctx.db, ['approver'], 'Tomas Approver');
    auditor = await sessionFor(ctx.app, ctx.db, ['auditor']);
    operator = await sessionFor(ctx.app, ctx.db, ['operator'], 'Kofi Operator');
    colleague = await sessionFor(ctx.app, ctx.db, ['operator'], 'Bea Colleague');
    operatorAuthor = await sessionFor(ctx.app, ctx.db, ['operator', 'author'], 'Ada Both');
    elsewhere = await sessionFor(ctx.app, ctx.db, ['operator'], 'Olu Elsewhere');
    stock = await createStockSet(ctx.db);
    const other = await createStockSet(ctx.db, { machine: { name: 'Floor saw' } });
    const gone = await createPerson(ctx.db, { roles: ['operator'], active: false });
    for (const p of [operator.person, colleague.person, operatorAuthor.person, gone]) await assign(p.id, stock.machine.id);
    await assign(elsewhere.person.id, other.machine.id);
    current = await approved(author, approver, stock, { title: 'C45 bar to acknowledge' });
  });

  it('tells an operator of the machine that the version waits for their acknowledgement; nobody else', async () => {
    expect(await mine(operator, current)).to.deep.equal({ required: true, acknowledgedAt: null });
    expect(await mine(elsewhere, current)).to.equal(null);
    expect(await mine(author, current)).to.equal(null);
    expect(await mine(auditor, current)).to.equal(null);
  });

  it('lists it on the operator’s Today until they acknowledge it', async () => {
    const list = (await today(operator)).toAcknowledge;
    expect(list.map((r) => [r.id, r.version, r.status])).to.deep.equal([[current.recipeId, 1, 'approved']]);
    expect(list[0]).to.include({ number: current.number, title: 'C45 bar to acknowledge', machineName: 'Bench saw' });
    expect((await today(elsewhere)).toAcknowledge).to.deep.equal([]);
    expect((await today(author)).toAcknowledge).to.deep.equal([]);
  });

  it('keeps the sheet from an operator of the machine until they acknowledge; others print as before', async () => {
    const res = await operator.agent.get(`${path(current)}/sheet.pdf`);
    expect(res.status).to.equal(409);
    expect(res.body).to.deep.equal({
      code: 'ACKNOWLEDGE_FIRST',
      errors: [{ path: '', message: 'Acknowledge this version (read and understood) before printing its sheet.' }],
    });
    for (const who of [elsewhere, author, approver]) {
      const sheet = await getSheet(who.agent, current.recipeId, 1);
      expect(sheet.status, who.person.username).to.equal(200);
      expect(sheet.headers['content-type']).to.equal('application/pdf');
    }
  });

  it('refuses a cut from an operator of the machine until they acknowledge (409 ACKNOWLEDGE_FIRST), writing nothing; others log as before', async () => {
    const before = await written();
    const cuts = await countRows(ctx.db, 'cut_records');
    const res = await post(operator, `${path(current)}/cuts`, aCut('S-ACK-1'));
    expect(res.status).to.equal(409);
    expect(res.body).to.deep.equal({
      code: 'ACKNOWLEDGE_FIRST',
      errors: [{ path: '', message: `Acknowledge version 1 of ${current.number} (read and understood) before you log a cut with it.` }],
    });
    expect(await written()).to.deep.equal(before);
    expect(await countRows(ctx.db, 'cut_records')).to.equal(cuts);
    // An operator of another machine is not asked to acknowledge it, so the cut is taken.
    expect((await post(elsewhere, `${path(current)}/cuts`, aCut('S-ACK-2'))).status).to.equal(201);
  });

  it('refuses an operator of another machine with 409, writing nothing', async () => {
    const before = await written();
    const res = await acknowledge(elsewhere, current);
    expect(res.status).to.equal(409);
    expect(res.body.code).to.equal('CONFLICT');
    expect(res.body.errors[0].message).to.match(/Bench saw, which is not one of your machines/);
    expect(await written()).to.deep.equal(before);
  });

  it('is for operators only', async () => {
    expect((await acknowledge(author, current)).status).to.equal(403);
    expect((await acknowledge(auditor, current)).status).to.equal(403);
  });

  it('records the acknowledgement with the name and the trail, answers it, and opens the sheet', async () => {
    const before = await written();
    const t0 = Date.now();
    const res = await acknowledge(operator, current);
    expect(res.status, JSON.stringify(res.body)).to.equal(200);
    expect(res.body.required).to.equal(false);
    expect(Date.parse(res.body.acknowledgedAt)).to.be.within(t0 - 1000, Date.now() + 1000);
    expect(await written()).to.deep.equal({ acks: before.acks + 1, trail: before.trail + 1 });

    const row = await ctx.db('acknowledgements').where({ user_id: operator.person.id }).first();
    expect(row).to.include({ user_name: 'Kofi Operator' });
    const event = await ctx.db('trail_events').orderBy('id', 'desc').first();
    expect(event).to.include({
      event_type: 'recipe.version_acknowledged',
      actor_user_id: operator.person.id,
      recipe_id: current.recipeId,
      entity_type: 'recipe_version',
    });
    expect(asJson(event.after_json)).to.include({ version: 1, number: current.number, machineId: stock.machine.id });

    expect(await mine(operator, current)).to.deep.equal({ required: false, acknowledgedAt: res.body.acknowledgedAt });
    expect((await today(operator)).toAcknowledge).to.deep.equal([]);
    const sheet = await getSheet(operator.agent, current.recipeId, 1);
    expect(sheet.status).to.equal(200);
  });

  it('takes the operator’s cut once they have acknowledged the version', async () => {
    const res = await post(operator, `${path(current)}/cuts`, aCut('S-ACK-3'));
    expect(res.status, JSON.stringify(res.body)).to.equal(201);
    expect(res.body).to.include({ specimenId: 'S-ACK-3', operatorId: operator.person.id, version: 1 });
  });

  it('answers a second acknowledgement with the first, recording nothing more (also when sent twice at once)', async () => {
    const first = await acknowledge(operator, current);
    const before = await written();
    const again = await acknowledge(operator, current);
    expect(again.status).to.equal(200);
    expect(again.body).to.deep.equal(first.body);
    expect(await written()).to.deep.equal(before);

    const [a, b] = await Promise.all([acknowledge(colleague, current), acknowledge(colleague, current)]);
    expect([a.status, b.status]).to.deep.equal([200, 200]);
    expect(a.body).to.deep.equal(b.body);
    expect(await written()).to.deep.equal({ acks: before.acks + 1, trail: before.trail + 1 });
  });

  it('lists who acknowledged and which active operators of the machine have not yet', async () => {
    const res = await auditor.agent.get(`${path(current)}/acknowledgements`).expect(200);
    const dto = res.body as AcknowledgementsDto;
    expect(dto).to.include({ recipeId: current.recipeId, version: 1 });
    expect(dto.machine).to.deep.equal({ id: stock.machine.id, name: 'Bench saw' });
    expect(dto.acknowledged.map((a) => [a.userId, a.displayName])).to.deep.equal([
      [operator.person.id, 'Kofi Operator'],
      [colleague.person.id, 'Bea Colleague'],
    ]);
    for (const a of dto.acknowledged) expect(a.acknowledgedAt).to.match(/Z$/);
    // Not the deactivated operator, not the operator of another machine.
    expect(dto.pending).to.deep.equal([{ userId: operatorAuthor.person.id, displayName: 'Ada Both' }]);
    for (const who of [author, approver]) await who.agent.get(`${path(current)}/acknowledgements`).expect(200);
    expect((await operator.agent.get(`${path(current)}/acknowledgements`)).status).to.equal(403);
    expect((await auditor.agent.get(`/api/recipes/${current.recipeId}/versions/99/acknowledgements`)).status).to.equal(404);
  });

  it('refuses a version that is not approved with 409 (a draft; a superseded version), and a draft is unknown to an operator-only person', async () => {
    const draft = await createDraft(author, stock, { title: 'Still a draft' });
    const before = await written();
    const res = await acknowledge(operatorAuthor, draft);
    expect(res.status).to.equal(409);
    expect(res.body.errors[0].message).to.match(/only an approved version/);
    expect((await acknowledge(operator, draft)).status).to.equal(404);
    expect(await mine(operatorAuthor, draft)).to.equal(null);
    expect(await written()).to.deep.equal(before);

    // Version 2 in use: version 1 is superseded and no longer acknowledged.
    const v2 = ok(await act.newVersion(author, current.recipeId, 1, 'Feed lowered.'), 201);
    const v2current = ok(await act.approve(approver, ok(await act.submit(author, v2))));
    expect(v2current.status).to.equal('approved');
    const superseded = await acknowledge(operatorAuthor, current);
    expect(superseded.status).to.equal(409);
    expect(superseded.body.errors[0].message).to.match(/superseded/);
    // The new version waits for everyone again.
    expect(await mine(operator, v2current)).to.deep.equal({ required: true, acknowledgedAt: null });
    expect((await today(operator)).toAcknowledge.map((r) => r.version)).to.deep.equal([2]);
  });

  it('takes an acknowledgement of a version approved for a later day, before it comes into use', async () => {
    const v1 = await approved(author, approver, stock, { title: 'Coming soon' });
    const v2 = ok(await act.newVersion(author, v1.recipeId, 1, 'New wheel.'), 201);
    const coming = ok(await act.approve(approver, ok(await act.submit(author, v2)), { effectiveDate: day(7) }));
    expect(await mine(colleague, coming)).to.deep.equal({ required: true, acknowledgedAt: null });
    // Not yet in use: not on Today (version 1 is).
    expect((await today(colleague)).toAcknowledge.map((r) => [r.id, r.version])).to.deep.include([v1.recipeId, 1]);
    expect((await today(colleague)).toAcknowledge.map((r) => [r.id, r.version])).not.to.deep.include([v1.recipeId, 2]);
    expect((await operator.agent.get(`${path(coming)}/sheet.pdf`)).status).to.equal(409);
    expect((await acknowledge(colleague, coming)).status).to.equal(200);
    expect((await getSheet(colleague.agent, coming.recipeId, 2)).status).to.equal(200);
  });

  it('shows an operator what changed since the version of the recipe they last acknowledged, or says they never acknowledged one', async () => {
    const v1 = await approved(author, approver, stock, { title: 'Changes since acknowledged' });
    expect((await acknowledge(colleague, v1)).status).to.equal(200);
    const draft = ok(await act.newVersion(author, v1.recipeId, 1, 'Feed lowered after burn marks.'), 201);
    const saved = ok(await act.save(author, draft, { instructionsMd: 'Clamp both ends; feed gently at the exit.' }));
    const v2 = ok(await act.approve(approver, ok(await act.submit(author, saved))));
    const changes = (who: Session) => who.agent.get(`${path(v2)}/changes-since-acknowledged`);

    const res = await changes(colleague);
    expect(res.status, JSON.stringify(res.body)).to.equal(200);
    const dto = res.body as ChangesSinceAcknowledgedDto;
    expect(dto.since!.version).to.equal(1);
    expect(Date.parse(dto.since!.acknowledgedAt)).to.be.a('number').and.not.NaN;
    expect(dto.comparison!.from).to.include({ version: 1 });
    expect(dto.comparison!.to).to.include({ version: 2 });
    expect(dto.comparison!.texts.map((t) => t.path)).to.include('instructionsMd');

    // Never acknowledged a version of this recipe: nothing to compare with.
    expect((await changes(operatorAuthor)).body).to.deep.equal({ since: null, comparison: null });
    expect((await changes(author)).status).to.equal(403);
    expect((await colleague.agent.get(`/api/recipes/${v2.recipeId}/versions/99/changes-since-acknowledged`)).status).to.equal(404);
  });
});
