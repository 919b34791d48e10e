/**
 * The large data set (test/perf/large-data/README.md) at a tiny scale: the counts it promises, a trail chain the
 * app's own verification accepts, content that parses and hashes as the app's, and people
 * who sign in with the printed password and find the recipes through the library API.
 */
import { expect } from 'chai';
import { RECIPE_STATUSES } from '../../../shared/vocabulary';
import { recipeContent } from '../../../shared/schemas/recipe';
import type { ChainVerification } from '../../../shared/recipe-types';
import { canonicalJson } from '../../../shared/canonical-json';
import { verifyChain } from '../../../server/services/trail/verify';
import { contentSha256 } from '../../../server/services/recipes/version-integrity';
import { DatabaseNotEmptyError, seedLarge, type LargeDataSummary } from '../../perf/large-data/seed-large';
import { apiTestContext } from '../support/hooks';
import { signedInAgent } from '../support/test-app';
import { recipesWithStaleLibraryColumns, recipesWithStaleSearchWords } from '../support/library-columns';
import { countRows } from '../support/test-database';

interface VersionRow {
  id: number;
  recipe_id: number;
  version: number;
  status: string;
  title: string;
  content_json: string;
  content_hash: string | null;
  check_code: string | null;
  worst_check: string | null;
  material_group: string;
  machine_id: number;
}

describe('Large data set (seed:large)', function () {
  this.timeout(60000);
  const ctx = apiTestContext();
  let summary: LargeDataSummary;

  before(async () => {
    summary = await seedLarge(ctx.db, { scale: 0.002 });
  });

  it('gives every recipe library columns equal to its latest version (the triggers see batch inserts too)', async () => {
    expect(await recipesWithStaleLibraryColumns(ctx.db)).to.deep.equal([]);
    expect(await recipesWithStaleSearchWords(ctx.db)).to.deep.equal([]);
    const empty = await ctx.db('recipes').whereNull('lib_title').count({ n: '*' }).first();
    expect(Number(empty!.n)).to.equal(0);
  });

  it('holds the promised counts at scale 0.002', async () => {
    expect(summary.counts).to.include({ recipes: 20, trailEvents: 2000, cutRecords: 200, users: 8 });
    expect(await countRows(ctx.db, 'recipes')).to.equal(20);
    expect(await countRows(ctx.db, 'users')).to.equal(8);
    expect(await countRows(ctx.db, 'trail_events')).to.equal(2000);
    expect(await countRows(ctx.db, 'cut_records')).to.equal(200);
    const versions = await countRows(ctx.db, 'recipe_versions');
    expect(versions).to.equal(summary.counts.recipeVersions).and.to.be.within(60, 100);
    expect(await countRows(ctx.db, 'signatures')).to.equal(summary.counts.signatures);
    expect(await countRows(ctx.db, 'sheet_prints')).to.equal(summary.counts.sheetPrints);
    expect(await countRows(ctx.db, 'materials')).to.be.above(0);
    const counter = (await ctx.db('recipe_number_counter').first('last_number')) as { last_number: number };
    expect(counter.last_number).to.equal(20);
    expect(summary.usernames).to.include({
      author: 'large.author.001',
      approver: 'large.approver.001',
      operator: 'large.operator.001',
      auditor: 'large.auditor.001',
      admin: 'large.admin.001',
    });
  });

  it('writes one trail chain that the app verifies, in time order', async () => {
    const result = await verifyChain(ctx.db);
    expect(result).to.deep.equal({ ok: true, checked: 2000, firstBroken: null });
    const auditor = await signedInAgent(ctx.app, { username: summary.usernames.auditor, password: summary.password });
    const res = await auditor.agent.get('/api/trail/verify').expect(200);
    // The auditor's own sign-in is appended to the chain and verified with it.
    expect((res.body as ChainVerification).ok).to.equal(true);
    const times = (await ctx.db('trail_events').where('id', '<=', 2000).orderBy('id').pluck('occurred_at')) as Date[];
    expect(times.every((t, i) => i === 0 || t.getTime() >= times[i - 1]!.getTime())).to.equal(true);
  });

  it('stores content that parses with the recipe schema and hashes as the app does', async () => {
    const rows = (await ctx.db('recipe_versions').select('*')) as VersionRow[];
    for (const row of rows) {
      const parsed = recipeContent.parse(JSON.parse(row.content_json));
      expect(canonicalJson(parsed), `version ${row.id}`).to.equal(row.content_json);
      if (row.status === 'draft') expect(row.content_hash).to.equal(null);
      else expect(row.content_hash, `version ${row.id}`).to.equal(contentSha256(row.content_json));
      if (row.status !== 'draft') expect(row.worst_check).to.not.equal('blocker');
      expect(row.check_code !== null).to.equal(['approved', 'superseded', 'withdrawn'].includes(row.status));
      if (row.version > 1) expect(parsed.changeReason).to.not.equal('');
    }
    const signatures = (await ctx
      .db('signatures as s')
      .join('recipe_versions as v', 'v.id', 's.version_id')
      .select('s.content_hash', 'v.content_hash as version_hash')) as {
      content_hash: string;
      version_hash: string;
    }[];
    expect(signatures.every((s) => s.content_hash === s.version_hash)).to.equal(true);
    // Older versions are superseded; the newest of most recipes is approved and current.
    const statuses = new Set(rows.map((r) => r.status));
    expect([...statuses].every((s) => (RECIPE_STATUSES as readonly string[]).includes(s))).to.equal(true);
    expect(statuses).to.include('superseded').and.to.include('approved');
    const recipes = (await ctx
      .db('recipes as r')
      .join('recipe_versions as v', 'v.id', 'r.latest_version_id')
      .select('r.id', 'v.version', 'r.current_version_id')) as {
      id: number;
      version: number;
      current_version_id: number | null;
    }[];
    for (const r of recipes) expect(r.version).to.equal(Math.max(...rows.filter((v) => v.recipe_id === r.id).map((v) => v.version)));
    expect(recipes.filter((r) => r.current_version_id !== null).length).to.be.above(10);
  });

  it('lists the recipes through the library API for a generated person with the printed password', async () => {
    const author = await signedInAgent(ctx.app, { username: summary.usernames.author, password: 'large-data-2026' });
    const all = await author.agent.get('/api/recipes').query({ pageSize: 100 }).expect(200);
    expect(all.body.total).to.equal(20);
    const group = (all.body.items as { group: string }[])[0]!.group;
    const filtered = await author.agent.get('/api/recipes').query({ group, status: 'approved', pageSize: 100 }).expect(200);
    const expected = await ctx
      .db('recipes as r')
      .join('recipe_versions as v', 'v.id', 'r.latest_version_id')
      .where({ 'v.material_group': group, 'v.status': 'approved' })
      .count<{ n: number }[]>({ n: '*' });
    expect(filtered.body.total).to.equal(Number(expected[0]!.n));
    const operator = await signedInAgent(ctx.app, { username: summary.usernames.operator, password: summary.password });
    const released = await operator.agent.get('/api/recipes').query({ pageSize: 100 }).expect(200);
    expect(released.body.total).to.equal(
      await ctx
        .db('recipes')
        .whereNotNull('current_version_id')
        .count<{ n: number }[]>({ n: '*' })
        .then((r) => Number(r[0]!.n)),
    );
  });

  it('refuses a database that already holds data unless asked to replace it', async () => {
    let error: unknown = null;
    await seedLarge(ctx.db, { scale: 0.002 }).catch((err: unknown) => (error = err));
    expect(error).to.be.instanceOf(DatabaseNotEmptyError);
    expect(await countRows(ctx.db, 'recipes')).to.equal(20);
  });
});
