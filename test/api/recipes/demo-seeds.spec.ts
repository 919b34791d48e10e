/**
 * The demo scenario loaded into the test database exactly as `npm start` loads it: every
 * demo recipe must pass the shared checks without a blocker, and its numbers must sit in
 * the trade's usual windows (common practice).
 */
import { expect } from 'chai';
import { peripheralSpeedMs } from '../../../shared/peripheral-speed';
import { motionSettingChecks } from '../../../shared/motion-checks';
import { motionSettingsMissing, motionSettingsText } from '../../../shared/motion-settings';
import { runChecks } from '../../../shared/recipe-checks';
import { computeRecipe } from '../../../shared/recipe-computations';
import type { RecipeContent } from '../../../shared/schemas/recipe';
import { seedDemoIfEmpty } from '../../../server/tools/db-setup';
import { loadRecipeContext } from '../../../server/services/recipes/context-loader';
import { DEMO_RECIPES } from '../../../seeds/data/demo-recipes';
import { DEMO_EXTRA_VERSIONS } from '../../../seeds/data/demo-workflow';
import { DEMO_WHEELS } from '../../../seeds/data/demo-stock';
import { apiTestContext } from '../support/hooks';
import { recipesWithStaleLibraryColumns, recipesWithStaleSearchWords } from '../support/library-columns';
import { countRows } from '../support/test-database';

describe('Demo seeds', () => {
  const ctx = apiTestContext();

  before(async function () {
    this.timeout(60000);
    expect(await seedDemoIfEmpty(ctx.db)).to.equal(true);
  });

  it('loads the invented lab: three saws, about a dozen wheels, about fifteen materials, a selection table, twelve or more recipes', async () => {
    expect(await countRows(ctx.db, 'machines')).to.equal(3);
    expect(await countRows(ctx.db, 'wheels'))
      .to.equal(DEMO_WHEELS.length)
      .and.to.be.within(12, 14);
    expect(await countRows(ctx.db, 'materials')).to.be.within(14, 17);
    expect(await countRows(ctx.db, 'selection_rows')).to.be.greaterThan(10);
    expect(await countRows(ctx.db, 'recipes'))
      .to.equal(DEMO_RECIPES.length)
      .and.to.be.at.least(12);
    const numbers = (await ctx.db('recipes').orderBy('id').pluck('number')) as string[];
    expect(numbers[0]).to.equal('KB-0001');
    // Every selection row points at a wheel in use.
    const orphans = await ctx.db('selection_rows as s').join('wheels as w', 'w.id', 's.wheel_id').where('w.archived', true).count({ n: '*' }).first();
    expect(Number(orphans!.n)).to.equal(0);
  });

  it('keeps the library columns of every recipe equal to its latest version after the whole demo history (drafts, returns, approvals, new versions)', async () => {
    expect(await recipesWithStaleLibraryColumns(ctx.db)).to.deep.equal([]);
    expect(await recipesWithStaleSearchWords(ctx.db)).to.deep.equal([]);
    const filled = await ctx.db('recipes').whereNotNull('lib_title').count({ n: '*' }).first();
    expect(Number(filled!.n)).to.equal(await countRows(ctx.db, 'recipes'));
  });

  it('has no blocker in any demo recipe, stored or re-checked', async () => {
    const versions = await ctx
      .db('recipe_versions as v')
      .join('recipes as r', 'r.id', 'v.recipe_id')
      .select('r.number', 'v.title', 'v.content_json', 'v.worst_check');
    expect(versions).to.have.length(DEMO_RECIPES.length + DEMO_EXTRA_VERSIONS);
    for (const v of versions) {
      const content = JSON.parse(v.content_json) as RecipeContent;
      const checks = runChecks(content, await loadRecipeContext(ctx.db, content));
      const blockers = checks.filter((c) => c.severity === 'blocker');
      expect(blockers, `${v.number} ${v.title}: ${JSON.stringify(blockers)}`).to.deep.equal([]);
      expect(v.worst_check, v.number).to.not.equal('blocker');
    }
  });

  it('keeps the demo numbers realistic: speed under the marked maximum, feeds and coolant in the usual ranges', async () => {
    const versions = await ctx.db('recipe_versions').select('content_json');
    for (const { content_json } of versions) {
      const content = JSON.parse(content_json) as RecipeContent;
      const { wheel, machine } = await loadRecipeContext(ctx.db, content);
      const v = peripheralSpeedMs(wheel!.diameterMm, content.cutting.wheelRpm);
      expect(v, wheel!.name).to.be.at.most(wheel!.maxSpeedMs);
      if (machine!.machineClass === 'precision') {
        expect(content.cutting.wheelRpm).to.be.at.most(5000);
        expect(content.cutting.feedMmS).to.be.within(0.005, 0.2);
      } else {
        expect(v, `${wheel!.name} at ${content.cutting.wheelRpm} rpm`).to.be.within(35, 65);
        expect(content.cutting.feedMmS).to.be.within(0.05, 1.0);
      }
      if (content.coolant.type === 'water-soluble') expect(content.coolant.concentrationPct).to.be.within(2, 5);
    }
  });

  it("keeps every demo recipe's estimated peak cutting power within the lab's share of its saw's motor, with the power known", async () => {
    const versions = await ctx.db('recipe_versions').select('content_json', 'title');
    for (const { content_json, title } of versions) {
      const content = JSON.parse(content_json) as RecipeContent;
      const context = await loadRecipeContext(ctx.db, content);
      const power = computeRecipe(content, context).cutPower!;
      // Every demo saw records its motor and every group has a specific energy, so the check is made.
      expect(power.peakPowerW, title).to.be.a('number').and.to.be.above(0);
      expect(power.motorSharePct, `${title}: ${power.peakPowerW} W of ${power.motorPowerW} W`).to.be.at.most(context.limits.powerWarningPct);
      const ids = runChecks(content, context).map((c) => c.id);
      expect(ids, title).to.not.include.members(['cutting-power-high', 'motor-power-unknown']);
    }
  });

  it('gives every demo recipe whose cut motion takes settings its settings, with none of the motion checks raised', async () => {
    const versions = await ctx.db('recipe_versions').select('content_json', 'title');
    const motions = new Set<string>();
    for (const { content_json, title } of versions) {
      const content = JSON.parse(content_json) as RecipeContent;
      expect(motionSettingsMissing(content), `${title}: ${content.cutting.cutMotion}`).to.equal(false);
      if (content.cutting.cutMotion !== 'straight-plunge') motions.add(motionSettingsText(content));
      expect(motionSettingChecks(content), title).to.deep.equal([]);
    }
    // Pulses by distance and by time, and a rocking stroke (invented demo values).
    expect([...motions].sort()).to.deep.equal([
      'advance per pulse 0.40 mm, retract per pulse 0.10 mm',
      'advance per pulse 0.50 mm, retract per pulse 0.20 mm',
      'feeding time per pulse 3.0 s, pause between pulses 1.0 s',
      'rocking stroke 8.00 mm',
    ]);
  });

  it('changes nothing on a second run', async () => {
    const before = await countRows(ctx.db, 'recipes');
    expect(await seedDemoIfEmpty(ctx.db)).to.equal(false);
    await ctx.db.seed.run();
    expect(await countRows(ctx.db, 'recipes')).to.equal(before);
    expect(await countRows(ctx.db, 'materials')).to.be.within(14, 17);
  });
});
