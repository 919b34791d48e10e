/**
 * Returned rounds through the versions API: each time a version went back to its author,
 * who returned it, when and with what comment, for the recipe page's History tab.
 */
import { expect } from 'chai';
import type { RecipeVersionDto } from '../../../shared/recipe-types';
import { apiTestContext } from '../support/hooks';
import { createStockSet, type StockSet } from '../support/stock';
import { act, createDraft, ok, sessionFor, type Session } from './workflow-support';

describe('Returned rounds of a version', () => {
  const ctx = apiTestContext();
  let author: Session;
  let approver: Session;
  let approver2: Session;
  let operator: Session;
  let stock: StockSet;

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author'], 'Ines Author');
    approver = await sessionFor(ctx.app, ctx.db, ['approver'], 'Tomas Approver');
    approver2 = await sessionFor(ctx.app, ctx.db, ['approver'], 'Second Approver');
    operator = await sessionFor(ctx.app, ctx.db, ['operator']);
    stock = await createStockSet(ctx.db);
  });

  /** Submits the version, has `who` return it with the comment, and lets the author save it again. */
  async function roundTrip(v: RecipeVersionDto, who: Session, comment: string): Promise<RecipeVersionDto> {
    const returned = ok(await act.return(who, ok(await act.submit(author, v)), comment));
    return ok(await act.save(author, returned, { instructionsMd: `${returned.content.instructionsMd}\nChanged after: ${comment}` }));
  }

  it('lists each return with who, when and the comment, oldest first, on the version list and the single version', async () => {
    const draft = await createDraft(author, stock, { title: 'Returned twice' });
    expect(draft.workflow!.returns).to.deep.equal([]);

    const started = Date.now();
    const once = await roundTrip(draft, approver, 'Give the clamp positions in mm.');
    const twice = await roundTrip(once, approver2, 'Say which side the burr forms on.');
    const approvedV1 = ok(await act.approve(approver, ok(await act.submit(author, twice))));
    expect(approvedV1.status).to.equal('approved');

    const list = (await author.agent.get(`/api/recipes/${draft.recipeId}/versions`).expect(200)).body as RecipeVersionDto[];
    const rounds = list.find((v) => v.version === 1)!.workflow!.returns!;
    expect(rounds.map((r) => [r.returnedBy.name, r.returnedBy.id, r.comment])).to.deep.equal([
      ['Tomas Approver', approver.person.id, 'Give the clamp positions in mm.'],
      ['Second Approver', approver2.person.id, 'Say which side the burr forms on.'],
    ]);
    for (const r of rounds) {
      expect(Date.parse(r.returnedAt)).to.be.within(started - 1000, Date.now() + 1000);
      expect(r.returnedAt).to.match(/Z$/);
    }
    expect(Date.parse(rounds[0]!.returnedAt)).to.be.at.most(Date.parse(rounds[1]!.returnedAt));
    // The comment each round shows is the one kept as a review comment.
    const comments = (await author.agent.get(`/api/recipes/${draft.recipeId}/versions/1/comments`).expect(200)).body as { body: string }[];
    expect(comments.map((c) => c.body)).to.include.members(rounds.map((r) => r.comment));

    const single = ok(await author.agent.get(`/api/recipes/${draft.recipeId}/versions/1`));
    expect(single.workflow!.returns).to.deep.equal(rounds);
    // Anyone who may read the approved version reads its rounds too (as they may its comments).
    const seenByOperator = ok(await operator.agent.get(`/api/recipes/${draft.recipeId}/versions/1`));
    expect(seenByOperator.workflow!.returns).to.deep.equal(rounds);
  });

  it("keeps each version's rounds to itself", async () => {
    const returnedOnce = await roundTrip(await createDraft(author, stock, { title: 'Returned once' }), approver, 'Coolant flow is missing.');
    const other = await createDraft(author, stock, { title: 'Never returned' });
    const list = (await author.agent.get(`/api/recipes/${returnedOnce.recipeId}/versions`).expect(200)).body as RecipeVersionDto[];
    expect(list[0]!.workflow!.returns!.map((r) => r.comment)).to.deep.equal(['Coolant flow is missing.']);
    const untouched = (await author.agent.get(`/api/recipes/${other.recipeId}/versions`).expect(200)).body as RecipeVersionDto[];
    expect(untouched[0]!.workflow!.returns).to.deep.equal([]);
  });
});
