/**
 * Submitted content is frozen by MariaDB itself (ISO/IEC 17025:2017 §7.11): direct
 * SQL, bypassing the API, cannot change or delete a submitted version, a signature, a
 * review comment or the photos of a frozen version — while the workflow's own columns
 * (revision, dates, and the status along the workflow's steps) stay writable.
 */
import { expect } from 'chai';
import sharp from 'sharp';
import type { RecipeVersionDto } from '../../../shared/recipe-types';
import { addAttachment } from '../../../server/services/recipes/attachments';
import { apiTestContext } from '../support/hooks';
import { createStockSet, type StockSet } from '../support/stock';
import { act, approved, createDraft, inReview, ok, post, sessionFor, type Session } from './workflow-support';

/** Runs the statement and returns MariaDB's refusal (fails the test if it was accepted). */
async function refused(statement: Promise<unknown>): Promise<{ sqlState: string; message: string }> {
  try {
    await statement;
  } catch (err) {
    const e = err as { sqlState?: string; sqlMessage?: string; message: string };
    return { sqlState: e.sqlState ?? '', message: e.sqlMessage ?? e.message };
  }
  throw new Error('MariaDB accepted a statement it must refuse.');
}

describe('Frozen content in the database', () => {
  const ctx = apiTestContext();
  let author: Session;
  let approver: Session;
  let stock: StockSet;
  let png: Buffer;

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author']);
    approver = await sessionFor(ctx.app, ctx.db, ['approver']);
    stock = await createStockSet(ctx.db);
    png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#808080' } })
      .png()
      .toBuffer();
  });

  const rowOf = (v: Pick<RecipeVersionDto, 'recipeId' | 'version'>) => ctx.db('recipe_versions').where({ recipe_id: v.recipeId, version: v.version });

  it('refuses a direct UPDATE of content_json, of the hash or of the title, and a change of case, on a submitted version', async () => {
    const v = await inReview(author, stock, { title: 'Frozen by the database' });
    const before = await rowOf(v).first();
    const changed = before.content_json.replace('"feedMmS":0.4', '"feedMmS":0.9');
    expect(changed).to.not.equal(before.content_json);
    for (const change of [
      { content_json: changed },
      { content_json: before.content_json.replace('Clamp.', 'clamp.') },
      { content_hash: null },
      { content_hash: 'f'.repeat(64) },
      { title: 'Renamed behind the API' },
      { version: 99 },
    ]) {
      const error = await refused(rowOf(v).update(change));
      expect(error.sqlState, JSON.stringify(change)).to.equal('45000');
      expect(error.message).to.match(/frozen/);
    }
    const raw = await refused(ctx.db.raw('UPDATE recipe_versions SET content_json = ? WHERE id = ?', [changed, before.id]));
    expect(raw.sqlState).to.equal('45000');
    const after = await rowOf(v).first();
    expect(after.content_json).to.equal(before.content_json);
    expect(after.content_hash).to.equal(before.content_hash);
    expect(after.title).to.equal(before.title);
  });

  it('refuses a direct DELETE of a submitted version, but still lets status and revision change', async () => {
    const v = await inReview(author, stock, { title: 'Cannot be deleted' });
    const error = await refused(rowOf(v).del());
    expect(error.sqlState).to.equal('45000');
    expect(error.message).to.match(/cannot be deleted/);
    expect(await rowOf(v).first()).to.not.equal(undefined);
    await rowOf(v).update({ status: 'returned', revision: 41 });
    expect(await rowOf(v).first('status', 'revision')).to.deep.equal({ status: 'returned', revision: 41 });
  });

  it('still lets a draft (no hash) be changed and deleted', async () => {
    const draft = await createDraft(author, stock, { title: 'Draft stays free' });
    await rowOf(draft).update({ title: 'Draft renamed' });
    expect((await rowOf(draft).first('title')).title).to.equal('Draft renamed');
    await ctx.db('recipe_version_editors').whereIn('version_id', rowOf(draft).select('id')).del();
    await ctx.db('recipes').where({ id: draft.recipeId }).update({ latest_version_id: null });
    await rowOf(draft).del();
    expect(await rowOf(draft).first()).to.equal(undefined);
  });

  it('lets the workflow unfreeze a returned version only by making it a draft without a hash in the same statement', async () => {
    const v = await inReview(author, stock, { title: 'Returned then edited' });
    const returned = ok(await act.return(approver, v));
    const before = await rowOf(v).first();
    const edited = before.content_json.replace('"feedMmS":0.4', '"feedMmS":0.3');
    // Keeping the status, or keeping the hash, is refused.
    expect((await refused(rowOf(v).update({ content_json: edited, content_hash: null }))).sqlState).to.equal('45000');
    expect((await refused(rowOf(v).update({ content_json: edited, status: 'draft' }))).sqlState).to.equal('45000');
    // The author's save is that one statement.
    const saved = ok(await act.save(author, returned, { cutting: { ...returned.content.cutting, feedMmS: 0.3 } }));
    expect(saved).to.include({ status: 'draft', contentHash: null });
    // An approved version is never unfrozen that way.
    const a = await approved(author, approver, stock, { title: 'Approved stays frozen' });
    expect((await refused(rowOf(a).update({ status: 'draft', content_hash: null }))).sqlState).to.equal('45000');
  });

  it('refuses any UPDATE or DELETE of a signature and of a review comment', async () => {
    const a = await approved(author, approver, stock, { title: 'Signed' });
    const sig = await ctx.db('signatures').orderBy('id', 'desc').first();
    expect((await refused(ctx.db('signatures').where({ id: sig.id }).update({ signer_name: 'Someone else' }))).message).to.match(/signatures are permanent/);
    expect((await refused(ctx.db('signatures').where({ id: sig.id }).del())).message).to.match(/signatures are permanent/);
    expect(await ctx.db('signatures').where({ id: sig.id }).first()).to.deep.equal(sig);

    const comment = await post(approver, `/api/recipes/${a.recipeId}/versions/1/comments`, { body: 'Looks right.' });
    expect(comment.status).to.equal(201);
    expect((await refused(ctx.db('review_comments').where({ id: comment.body.id }).update({ body: 'Looks wrong.' }))).sqlState).to.equal('45000');
    expect((await refused(ctx.db('review_comments').where({ id: comment.body.id }).del())).sqlState).to.equal('45000');
  });

  it('refuses adding, changing or removing photos of a frozen version, and allows it on a draft', async () => {
    const draft = await createDraft(author, stock, { title: 'Photos freeze' });
    const actor = { userId: author.person.id, name: author.person.displayName, clientAddress: '' };
    const photo = await addAttachment(
      ctx.db,
      actor,
      draft.recipeId,
      1,
      { role: 'setup', caption: 'before' },
      { bytes: png, fileName: 'a.png', declaredType: 'image/png' },
    );
    await ctx.db('attachments').where({ id: photo.id }).update({ caption: 'draft caption' });
    const current = ok(await act.get(author, draft));
    await act.submit(author, current).expect(200);
    expect((await refused(ctx.db('attachments').where({ id: photo.id }).update({ caption: 'changed' }))).message).to.match(/photos cannot be changed/);
    expect((await refused(ctx.db('attachments').where({ id: photo.id }).del())).message).to.match(/photos cannot be removed/);
    const meta = await ctx
      .db('attachments')
      .where({ id: photo.id })
      .first(
        'version_id',
        'role',
        'file_name',
        'mime_type',
        'size_bytes',
        'sha256',
        'width',
        'height',
        'data',
        'thumbnail',
        'thumbnail_mime_type',
        'thumbnail_sha256',
        'created_by',
        'created_at',
      );
    expect((await refused(ctx.db('attachments').insert({ ...meta, caption: 'slipped in' }))).message).to.match(/cannot be added/);
    expect(await ctx.db('attachments').where({ version_id: meta.version_id }).count({ n: '*' }).first()).to.deep.equal({ n: 1 });
  });
});
