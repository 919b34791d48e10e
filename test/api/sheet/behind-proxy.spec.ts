/** Behind a TLS proxy (TRUST_PROXY set), the sheet's QR code points at the address people use. */
import { expect } from 'chai';
import { apiTestContext } from '../support/hooks';
import { createStockSet } from '../support/stock';
import { approved, sessionFor } from '../workflow/workflow-support';
import { getSheet, readSheet } from './sheet-support';

describe('Bench sheet behind a proxy', () => {
  const ctx = apiTestContext({ trustProxy: 'loopback' });

  it('takes the origin from X-Forwarded-Proto and X-Forwarded-Host', async function () {
    this.timeout(30000);
    const author = await sessionFor(ctx.app, ctx.db, ['author']);
    const approver = await sessionFor(ctx.app, ctx.db, ['approver']);
    const v = await approved(author, approver, await createStockSet(ctx.db));
    const code = (await ctx.db('recipe_versions').where({ recipe_id: v.recipeId, version: 1 }).first('check_code')).check_code as string;
    const res = await getSheet(author.agent, v.recipeId, 1).set('X-Forwarded-Proto', 'https').set('X-Forwarded-Host', 'kerfbook.lab.example').expect(200);
    const sheet = await readSheet(res.body as Buffer);
    expect(sheet.qrTexts).to.deep.equal([`https://kerfbook.lab.example/check/${code}`]);
    expect(sheet.text.replace(/\s+/g, ' ')).to.include(`https://kerfbook.lab.example/check/${code}`);
  });

  it('refuses a forged host that is not a host name', async () => {
    const author = await sessionFor(ctx.app, ctx.db, ['author']);
    const approver = await sessionFor(ctx.app, ctx.db, ['approver']);
    const v = await approved(
      author,
      approver,
      await createStockSet(ctx.db, { material: { name: 'Second C45' }, wheel: { name: 'Second wheel' }, machine: { name: 'Second saw' } }),
    );
    const res = await getSheet(author.agent, v.recipeId, 1).set('X-Forwarded-Host', 'evil.example/phish?x=').expect(400);
    expect(JSON.parse((res.body as Buffer).toString()).errors[0].path).to.equal('host');
  });
});
