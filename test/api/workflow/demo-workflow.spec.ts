/**
 * The demo's review history (seeds/05_demo_workflow.ts): the library shows every state,
 * signed by the demo approver through the same services as the API, with consistent dates.
 */
import { expect } from 'chai';
import type { RecipeVersionDto } from '../../../shared/recipe-types';
import { seedDemoIfEmpty } from '../../../server/tools/db-setup';
import { applyDueSupersessions } from '../../../server/services/recipes/supersession';
import { DEMO_ACCOUNTS } from '../../../seeds/data/demo-accounts';
import { apiTestContext } from '../support/hooks';
import { signedInAgent, type Agent } from '../support/test-app';

describe('Demo review history', () => {
  const ctx = apiTestContext();
  const account = (role: string) => DEMO_ACCOUNTS.find((a) => a.roles.includes(role as never))!;
  let auditor: Agent;

  before(async function () {
    this.timeout(60000);
    expect(await seedDemoIfEmpty(ctx.db)).to.equal(true);
    auditor = (await signedInAgent(ctx.app, account('auditor'))).agent;
  });

  const versionsOf = async (title: string) => {
    const recipe = await ctx.db('recipes').where({ title }).first('id', 'current_version_id');
    const versions = (await auditor.get(`/api/recipes/${recipe.id}/versions`).expect(200)).body as RecipeVersionDto[];
    return { recipe, versions };
  };

  it('holds every state: draft, in review, returned, approved (current and pending), superseded, withdrawn', async () => {
    const statuses = (await ctx.db('recipe_versions').distinct('status').pluck('status')) as string[];
    expect(statuses).to.have.members(['draft', 'in-review', 'returned', 'approved', 'superseded', 'withdrawn']);
    const library = (await auditor.get('/api/recipes').query({ pageSize: 100 }).expect(200)).body.items as { status: string }[];
    expect(new Set(library.map((r) => r.status))).to.have.keys(['draft', 'in-review', 'returned', 'approved', 'withdrawn']);
    expect(library.filter((r) => r.status === 'in-review').length).to.be.at.least(3);
  });

  it('signs with the demo approver and binds each signature to the content hash', async () => {
    const approver = account('approver');
    const signatures = await ctx
      .db('signatures as s')
      .join('recipe_versions as v', 'v.id', 's.version_id')
      .select('s.signer_name', 's.content_hash', 'v.content_hash as version_hash', 's.meaning');
    expect(signatures.length).to.be.at.least(8);
    for (const s of signatures) {
      expect(s.signer_name).to.equal(approver.displayName);
      expect(s.content_hash).to.equal(s.version_hash);
    }
    expect(signatures.filter((s) => s.meaning === 'withdrawn')).to.have.length(1);
  });

  it('has a version 2 in use with version 1 superseded, and a version 2 waiting for its effective day', async () => {
    const steel = await versionsOf('42CrMo4 quenched and tempered bar, large diameters');
    expect(steel.versions.map((v) => [v.version, v.status])).to.deep.equal([
      [2, 'approved'],
      [1, 'superseded'],
    ]);
    expect(steel.versions[0]!.content.changeReason).to.match(/Feed lowered/);
    const ceramic = await versionsOf('Alumina ceramic plate');
    expect(ceramic.versions.map((v) => [v.version, v.status])).to.deep.equal([
      [2, 'approved'],
      [1, 'approved'],
    ]);
    const today = new Date().toISOString().slice(0, 10);
    expect(ceramic.versions[0]!.workflow!.effectiveFrom! > today).to.equal(true);
    const v1Id = await ctx.db('recipe_versions').where({ recipe_id: ceramic.recipe.id, version: 1 }).first('id');
    expect(ceramic.recipe.current_version_id).to.equal(v1Id.id);
    // The job today leaves it pending.
    expect((await applyDueSupersessions(ctx.db)).madeCurrent).to.equal(0);
  });

  it('has a returned version with its comment and a withdrawn one with its reason', async () => {
    const tube = await versionsOf('X5CrNi18-10 tube, transverse');
    expect(tube.versions[0]!.status).to.equal('returned');
    const comments = (await auditor.get(`/api/recipes/${tube.recipe.id}/versions/1/comments`).expect(200)).body;
    expect(comments[0].body).to.match(/soft inserts/);
    const casting = await versionsOf('Ductile iron casting, section through the wall');
    expect(casting.versions[0]!.status).to.equal('withdrawn');
    expect(casting.versions[0]!.workflow!.withdrawnReason).to.match(/forging/);
    expect(casting.recipe.current_version_id).to.equal(null);
  });

  it('keeps each version’s dates in order and lists reviews coming due for the demo approver', async () => {
    const rows = await ctx.db('recipe_versions').whereNotNull('submitted_at').select('created_at', 'submitted_at', 'effective_from');
    for (const r of rows) expect(new Date(r.created_at).getTime()).to.be.at.most(new Date(r.submitted_at).getTime());
    const due = (await auditor.get('/api/reviews/due').expect(200)).body as { title: string; reviewDueOn: string }[];
    expect(due.map((d) => d.title)).to.deep.equal(['X153CrMoV12 hardened block, bench saw', 'Populated circuit board, solder joint section']);
    const approver = await signedInAgent(ctx.app, account('approver'));
    const today = (await approver.agent.get('/api/today').expect(200)).body;
    expect(today.waitingForMyReview.length).to.be.at.least(3);
    expect(today.reviewsDue).to.have.length(2);
    const author = await signedInAgent(ctx.app, account('author'));
    const mine = (await author.agent.get('/api/today').expect(200)).body;
    expect(mine.myDrafts.map((d: { title: string }) => d.title)).to.include('X5CrNi18-10 tube, transverse');
  });
});
