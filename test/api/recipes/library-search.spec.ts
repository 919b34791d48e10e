/**
 * The library's text search: every word must start a word of the recipe's number, title,
 * material name or designation. Authors search latest versions, operators current ones;
 * the words are kept by triggers (migration 20261202030504), checked here after real writes.
 */
import { expect } from 'chai';
import { CSRF_HEADER } from '../../../shared/api-types';
import type { RecipeVersionDto } from '../../../shared/recipe-types';
import { booleanQuery, searchWords, wordsCondition, wordStartPattern, type IndexedWords } from '../../../server/data/search-words';
import { apiTestContext } from '../support/hooks';
import { recipesWithStaleSearchWords } from '../support/library-columns';
import { createStockSet, type StockSet } from '../support/stock';
import { act, approved, createDraft, ok, sessionFor, type Session } from '../workflow/workflow-support';

describe('Library text search', () => {
  const ctx = apiTestContext();
  let author: Session;
  let approver: Session;
  let operator: Session;
  let brass: StockSet;
  let steel: StockSet;
  let tube: RecipeVersionDto;
  let rod: RecipeVersionDto;

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author']);
    approver = await sessionFor(ctx.app, ctx.db, ['approver']);
    operator = await sessionFor(ctx.app, ctx.db, ['operator']);
    brass = await createStockSet(ctx.db, { material: { name: 'Brass rod', designation: 'CW614N', group: 'copper', hardness: { value: 130, scale: 'HV' } } });
    steel = await createStockSet(ctx.db, {
      material: { name: 'Tool steel', designation: '1.2379', group: 'hardened-tool-steel', hardness: { value: 700, scale: 'HV' } },
    });
    tube = await approved(author, approver, brass, { title: 'Thin-wall tube in oil', scope: { group: 'copper', hardness: null } });
    rod = await createDraft(author, steel, { title: 'X153CrMoV12 die block', scope: { group: 'hardened-tool-steel', hardness: null } });
  });

  const titles = async (who: Session, q: string) => {
    const res = await who.agent.get('/api/recipes').query({ q }).expect(200);
    expect(res.body.total).to.equal(res.body.items.length);
    return (res.body.items as { title: string }[]).map((r) => r.title).sort();
  };

  it('finds a recipe by the start of any word, in any order and case', async () => {
    expect(await titles(author, 'x153')).to.deep.equal(['X153CrMoV12 die block']);
    expect(await titles(author, 'BLOCK die')).to.deep.equal(['X153CrMoV12 die block']);
    expect(await titles(author, 'cw614')).to.deep.equal(['Thin-wall tube in oil']);
    expect(await titles(author, 'brass thin')).to.deep.equal(['Thin-wall tube in oil']);
  });

  it('needs every word: one missing word finds nothing', async () => {
    expect(await titles(author, 'brass block')).to.deep.equal([]);
    // Inside a word is not the start of one.
    expect(await titles(author, 'crmov')).to.deep.equal([]);
  });

  it('finds short and common words, punctuation and numbers with dots', async () => {
    expect(await titles(author, 'in oil')).to.deep.equal(['Thin-wall tube in oil']);
    expect(await titles(author, '1.2379')).to.deep.equal(['X153CrMoV12 die block']);
    expect(await titles(author, rod.number)).to.deep.equal(['X153CrMoV12 die block']);
    expect(await titles(author, `"${tube.number}"`)).to.deep.equal(['Thin-wall tube in oil']);
  });

  it('treats search operators and LIKE wildcards as plain text', async () => {
    for (const q of ['+brass -rod', 'brass*', '%', '_', '"', '(brass)', '@1', '~brass', '>brass <rod']) {
      const res = await author.agent.get('/api/recipes').query({ q }).expect(200);
      expect(res.body.total, q).to.be.a('number');
    }
    expect(await titles(author, '%')).to.deep.equal(['Thin-wall tube in oil', 'X153CrMoV12 die block']);
    expect(await titles(author, '(brass)')).to.deep.equal(['Thin-wall tube in oil']);
  });

  it('follows a draft that renames the recipe, and a renamed material', async () => {
    const renamed = await author.agent
      .put(`/api/recipes/${rod.recipeId}/versions/${rod.version}`)
      .set(CSRF_HEADER, author.csrf)
      .send({ revision: rod.revision, title: 'Cold-work punch', content: rod.content })
      .expect(200);
    rod = renamed.body as RecipeVersionDto;
    expect(await titles(author, 'punch')).to.deep.equal(['Cold-work punch']);
    expect(await titles(author, 'die block')).to.deep.equal([]);

    await ctx.db('materials').where({ id: brass.material.id }).update({ name: 'Leaded brass bar' });
    expect(await titles(author, 'leaded')).to.deep.equal(['Thin-wall tube in oil']);
    expect(await titles(operator, 'leaded')).to.deep.equal(['Thin-wall tube in oil']);
    expect(await titles(author, 'rod')).to.deep.equal([]);
    expect(await recipesWithStaleSearchWords(ctx.db)).to.deep.equal([]);
  });

  it('lets operators search the current version, not a newer draft', async () => {
    const next = ok(await act.newVersion(author, tube.recipeId, 1), 201);
    await author.agent
      .put(`/api/recipes/${next.recipeId}/versions/${next.version}`)
      .set(CSRF_HEADER, author.csrf)
      .send({ revision: next.revision, title: 'Thick-wall sleeve', content: next.content })
      .expect(200);
    expect(await titles(author, 'sleeve')).to.deep.equal(['Thick-wall sleeve']);
    expect(await titles(operator, 'sleeve')).to.deep.equal([]);
    expect(await titles(operator, 'thin wall')).to.deep.equal(['Thin-wall tube in oil']);
    // The draft is not the operator's: its words stay out of their list.
    expect(await titles(operator, 'punch')).to.deep.equal([]);
    expect(await recipesWithStaleSearchWords(ctx.db)).to.deep.equal([]);
  });

  it('finds the same by LIKE where the index holds no such short or long words, or is not used', async () => {
    const search = async (words: string[], sizes: IndexedWords) => {
      const query = ctx.db('recipes as r').select('r.lib_title as title').orderBy('r.lib_title');
      wordsCondition('r.lib_search', words, sizes)(query);
      return ((await query) as { title: string }[]).map((r) => r.title);
    };
    const none: string[] = [];
    for (const sizes of [
      { min: 1, max: 84, stopwords: none },
      { min: 50, max: 84, stopwords: none },
      { min: 1, max: 2, stopwords: none },
      { min: Infinity, max: 0, stopwords: none },
      // Stopwords the index left out, and a word that starts one ("pun" of "punch").
      { min: 1, max: 84, stopwords: ['thick', 'wall', 'punch'] },
    ]) {
      expect(await search(['thick', 'wall'], sizes), JSON.stringify(sizes)).to.deep.equal(['Thick-wall sleeve']);
      expect(await search(['cold', 'pun'], sizes), JSON.stringify(sizes)).to.deep.equal(['Cold-work punch']);
      expect(await search(['old'], sizes), JSON.stringify(sizes)).to.deep.equal([]);
    }
  });

  it('answers the same within a group and machine, where it reads their index instead', async () => {
    const ids = async (query: object) =>
      ((await author.agent.get('/api/recipes').query(query).expect(200)).body.items as { id: number }[]).map((r) => r.id).sort();
    for (const stock of [brass, steel]) {
      const within = { group: stock.material.group, machineId: stock.machine.id };
      const all = await ids(within);
      expect(all).to.have.length(1);
      for (const q of ['leaded', 'thin wall', 'in oil', '1.2379', 'cold pun', rod.number, 'wall x153', 'old', 'snake_case']) {
        const narrowed = await ids({ q, ...within });
        expect(narrowed, `${q} in ${stock.material.group}`).to.deep.equal((await ids({ q })).filter((id) => all.includes(id)));
      }
    }
  });

  it('cuts the query into the words the index holds', () => {
    expect(searchWords('  KB-0012, X153CrMoV12 kb ')).to.deep.equal(['kb', '0012', 'x153crmov12']);
    expect(searchWords('Ø40 Härte snake_case')).to.deep.equal(['ø40', 'härte', 'snake_case']);
    expect(searchWords('%_*"+-')).to.deep.equal(['_']);
    expect(searchWords('a b c d e f g h i j')).to.have.length(8);
    expect(booleanQuery(['kb', '0012'])).to.equal('+kb* +0012*');
    expect(wordStartPattern('kb')).to.equal('% kb%');
    expect(wordStartPattern('snake_case')).to.equal('% snake\\_case%');
  });

  it('finds common words, whether or not the server leaves stopwords out of its index', async () => {
    // A server with stopwords on rebuilds the index without "with", "the"… on every TRUNCATE
    // (each test file starts with one) or restore; ours has them off.
    const plate = await createStockSet(ctx.db, {
      material: { name: 'Spring steel', designation: '1.8159', group: 'plain-low-alloy-steel', hardness: { value: 450, scale: 'HV' } },
    });
    await createDraft(author, plate, { title: 'Plate with the burr side up', scope: { group: 'plain-low-alloy-steel', hardness: null } });
    expect(await titles(author, 'with the')).to.deep.equal(['Plate with the burr side up']);
    expect(await titles(author, 'th burr')).to.deep.equal(['Plate with the burr side up']);
    expect(await titles(author, 'plate wit')).to.deep.equal(['Plate with the burr side up']);
  });
});
