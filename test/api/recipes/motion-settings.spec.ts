/**
 * The cut motion's settings through the API: they round-trip, an impossible one is refused
 * with its message and changes nothing, a pulse that gains nothing is a blocker, the
 * comparison names each changed setting (content stored before they existed reads as "not
 * given"), and the bench sheet prints them (read back from the PDF's text).
 */
import { expect } from 'chai';
import type { RecipeComparison, RecipeVersionDto } from '../../../shared/recipe-types';
import { MOTION_SETTINGS } from '../../../shared/vocabulary';
import { getSheet, readSheet } from '../sheet/sheet-support';
import { apiTestContext } from '../support/hooks';
import { createStockSet, type StockSet } from '../support/stock';
import { act, createDraft, ok, sessionFor, type Session } from '../workflow/workflow-support';

const flat = (text: string) => text.replace(/\s+/g, ' ').normalize('NFKC');

describe('Cut motion settings', () => {
  const ctx = apiTestContext();
  let author: Session;
  let approver: Session;
  let stock: StockSet;

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author'], 'Ines Author');
    approver = await sessionFor(ctx.app, ctx.db, ['approver'], 'Petra Approver');
    stock = await createStockSet(ctx.db);
  });

  const path = (v: RecipeVersionDto) => `/api/recipes/${v.recipeId}/versions/${v.version}`;
  const save = (v: RecipeVersionDto, cutting: object) =>
    act.save(author, v, { cutting: { ...v.content.cutting, ...cutting } as RecipeVersionDto['content']['cutting'] });
  const sheetText = async (v: RecipeVersionDto) =>
    flat((await readSheet((await getSheet(author.agent, v.recipeId, v.version).expect(200)).body as Buffer)).text);

  /** Rewrites a draft's stored content as an older Kerfbook stored it: no motion-setting keys. */
  async function storeWithoutSettings(v: RecipeVersionDto): Promise<void> {
    const where = { recipe_id: v.recipeId, version: v.version };
    const stored = JSON.parse((await ctx.db('recipe_versions').where(where).first()).content_json);
    for (const key of MOTION_SETTINGS) delete stored.cutting[key];
    await ctx
      .db('recipe_versions')
      .where(where)
      .update({ content_json: JSON.stringify(stored) });
  }

  it('round-trips the settings, refuses an impossible one with its message and changes nothing, and blocks a pulse that gains nothing', async () => {
    const draft = await createDraft(author, stock, {
      title: 'Pulsed by distance',
      cutting: { cutMotion: 'pulsed-plunge', pulseAdvanceMm: 0.5, pulseRetractMm: 0.2 },
    });
    expect(draft.content.cutting).to.include({ cutMotion: 'pulsed-plunge', pulseAdvanceMm: 0.5, pulseRetractMm: 0.2, pulseFeedS: null, rockingAngleDeg: null });
    const loaded = ok(await author.agent.get(path(draft)));
    expect(loaded.content.cutting).to.deep.equal(draft.content.cutting);

    const refused = await save(loaded, { pulseAdvanceMm: -1 });
    expect(refused.status, JSON.stringify(refused.body)).to.equal(400);
    expect(JSON.stringify(refused.body)).to.contain('Advance per pulse must be more than 0 mm.');
    const after = ok(await author.agent.get(path(draft)));
    expect(after.revision).to.equal(loaded.revision);
    expect(after.content.cutting.pulseAdvanceMm).to.equal(0.5);

    // Advance 0.5 mm, retract 0.6 mm: the wheel backs off more than it advances.
    const noHeadway = ok(await save(after, { pulseRetractMm: 0.6 }));
    const blocker = noHeadway.checks.find((c) => c.id === 'pulse-retract-not-below-advance');
    expect(blocker).to.deep.include({ severity: 'blocker', path: 'cutting.pulseRetractMm' });
    expect(blocker!.message).to.contain('advances 0.5 mm and retracts 0.6 mm');
  });

  it('compares versions setting by setting, reads content stored without them as "not given", and prints them on the sheet', async function () {
    this.timeout(60000);
    // Version 1: a pulsed plunge stored as an older Kerfbook stored it, then submitted and approved.
    const v1draft = await createDraft(author, stock, { title: 'Stored before the motion settings', cutting: { cutMotion: 'pulsed-plunge' } });
    await storeWithoutSettings(v1draft);
    const stored = ok(await author.agent.get(path(v1draft)));
    expect(Object.keys(stored.content.cutting)).to.not.include('pulseAdvanceMm');
    const v1 = ok(await act.approve(approver, ok(await act.submit(author, stored))));
    expect(v1.status).to.equal('approved');
    // Approving does not rewrite what was stored (its hash is signed).
    const v1Row = await ctx.db('recipe_versions').where({ recipe_id: v1.recipeId, version: 1 }).first();
    expect(JSON.parse(v1Row.content_json).cutting).to.not.have.property('pulseAdvanceMm');

    const v1Sheet = await sheetText(v1);
    // The key-settings strip names the motion and, under it, its settings.
    expect(v1Sheet).to.include('Pulsed plunge Settings not given');

    // Version 2: the same cut with its pulses given.
    const v2draft = ok(await act.newVersion(author, v1.recipeId, 1, 'Pulses written down.'), 201);
    const v2saved = ok(await save(v2draft, { pulseAdvanceMm: 0.5, pulseRetractMm: 0.2 }));
    const comparison = (await author.agent.get(`/api/recipes/${v1.recipeId}/compare`).query({ from: 1, to: 2 }).expect(200)).body as RecipeComparison;
    expect(comparison.parameters).to.deep.equal([
      { path: 'cutting.pulseAdvanceMm', label: 'Advance per pulse', before: 'Not given', after: '0.50 mm' },
      { path: 'cutting.pulseRetractMm', label: 'Retract per pulse', before: 'Not given', after: '0.20 mm' },
    ]);

    const v2 = ok(await act.approve(approver, ok(await act.submit(author, v2saved))));
    const v2Sheet = await sheetText(v2);
    expect(v2Sheet).to.include('Pulsed plunge Advance per pulse 0.50 mm, retract per pulse 0.20 mm');
    expect(v2Sheet).to.not.include('Settings not given');
  });
});
