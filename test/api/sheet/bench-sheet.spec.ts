/**
 * The bench sheet (DEVELOPERS.md "Operator routes"): GET
 * /api/recipes/:id/versions/:n/sheet.pdf read back with pdf-parse — text, page size and
 * the QR code (jsqr) — against the real MariaDB.
 */
import { expect } from 'chai';
import sharp from 'sharp';
import { NO_SAFETY_CLAIM, PRECEDENCE_LINE, STANDARD_CAUTIONS } from '../../../shared/cautions';
import type { RecipeVersionDto } from '../../../shared/recipe-types';
import { addAttachment } from '../../../server/services/recipes/attachments';
import { apiTestContext } from '../support/hooks';
import { createStockSet, type StockSet } from '../support/stock';
import { asJson, countRows } from '../support/test-database';
import { act, approved, createDraft, inReview, ok, sessionFor, type Session } from '../workflow/workflow-support';
import { getSheet, readSheet } from './sheet-support';

/** One line of text; NFKC because pdf.js hands back the micro sign µ as the Greek letter μ. */
const flat = (text: string) => text.replace(/\s+/g, ' ').normalize('NFKC');

describe('Bench sheet', () => {
  const ctx = apiTestContext();
  let author: Session;
  let approver: Session;
  let operator: Session;
  let stock: StockSet;
  let v1: RecipeVersionDto;
  let code: string;

  before(async function () {
    this.timeout(60000);
    author = await sessionFor(ctx.app, ctx.db, ['author'], 'Ines Author');
    approver = await sessionFor(ctx.app, ctx.db, ['approver'], 'Zoë Ødegård');
    operator = await sessionFor(ctx.app, ctx.db, ['operator'], 'Ana Operator');
    stock = await createStockSet(ctx.db);
    const draft = await createDraft(author, stock, {
      title: 'C45 bar, sheet test',
      cutting: { entryFeedMmS: 0.1, entryLengthMm: 5 },
      clamping: { placement: 'Ø 40 bar: jaws 10 ± 2 mm from the cut, both sides.', orientationRule: 'Mark faces the operator.' },
      instructionsMd: [
        '1. Inspect the wheel; **check the marked speed**.',
        '2. Clamp as above, see [the clamping guide](https://lab.example/clamping).',
        '3. Cut at 20 °C coolant; finish `Ra 0.8 µm` expected.',
        '',
        '<script>alert("x")</script>',
      ].join('\n'),
    });
    // The setup photo, added while the version is still a draft.
    const png = await sharp({ create: { width: 320, height: 200, channels: 3, background: '#7a8a9a' } })
      .png()
      .toBuffer();
    await addAttachment(
      ctx.db,
      { userId: author.person.id, name: author.person.displayName, clientAddress: '' },
      draft.recipeId,
      1,
      { role: 'setup', caption: 'Vise and backstop' },
      {
        bytes: png,
        fileName: 'setup.png',
        declaredType: 'image/png',
      },
    );
    const fresh = ok(await act.get(author, draft));
    v1 = ok(await act.approve(approver, ok(await act.submit(author, fresh))));
    code = (await ctx.db('recipe_versions').where({ recipe_id: v1.recipeId, version: 1 }).first('check_code')).check_code;
  });

  it('answers a PDF, inline, named after the recipe and version, never cached', async () => {
    const res = await getSheet(operator.agent, v1.recipeId, 1);
    expect(res.status).to.equal(200);
    expect(res.headers['content-type']).to.equal('application/pdf');
    expect(res.headers['content-disposition']).to.equal(`inline; filename="${v1.number}-v1.pdf"`);
    expect(res.headers['cache-control']).to.equal('no-store');
    expect((res.body as Buffer).subarray(0, 5).toString()).to.equal('%PDF-');
  });

  it('prints the header, scope, every parameter with its unit, clamping, instructions, cautions and signatures', async function () {
    this.timeout(30000);
    const res = await getSheet(operator.agent, v1.recipeId, 1).expect(200);
    const sheet = await readSheet(res.body as Buffer);
    const text = flat(sheet.text);
    expect(sheet.pages).to.be.within(1, 2);
    for (const expected of [
      v1.number,
      'Version 1',
      'C45 bar, sheet test',
      'Approved — current',
      v1.workflow!.effectiveFrom!,
      // Scope.
      'C45 carbon steel (EN 1.0503)',
      'Plain and low-alloy steels',
      '170–230 HV',
      'Round bar, Ø 20.0 mm to 60.0 mm',
      'Transverse',
      // Parameters with units.
      'Bench saw',
      'A60P5B',
      'Ø 250 mm × 1.50 mm, bore 32.0 mm',
      // Marked in m/s, shown as marked; 60 000·63/(π·250) = 4812.8 rpm, floored.
      '63 m/s (marked) · 4812 rpm at 250 mm',
      '3000 rpm',
      '39.3 m/s', // π × 250 mm × 3000 rpm
      '23.7 m/s below the marked maximum (38 %)',
      '0.40 mm/s',
      '0.10 mm/s for the first 5.00 mm',
      'Straight plunge',
      'Single cut',
      // Clamping and coolant.
      'Vise with backstop',
      'Ø 40 bar: jaws 10 ± 2 mm from the cut, both sides.',
      'Mark faces the operator.',
      'Water-soluble coolant',
      '4 % v/v',
      '8 L/min',
      // Instructions: numbered, bold as text, link with its address, µ and °.
      '1. Inspect the wheel; check the marked speed.',
      '2. Clamp as above, see the clamping guide (https://lab.example/clamping).',
      '3. Cut at 20 °C coolant; finish Ra 0.8 µm expected.',
      // HTML is printed as typed, never interpreted.
      '<script>alert("x")</script>',
      'No burn marks.',
      // Cautions.
      'STANDARD CAUTIONS',
      PRECEDENCE_LINE,
      NO_SAFETY_CLAIM,
      // Signature: printed name, meaning, UTC time, short hash.
      'Zoë Ødegård',
      'Approved',
      v1.contentHash!.slice(0, 16),
      'Setup photo — Vise and backstop',
      'Uncontrolled once printed',
    ]) {
      expect(text, expected).to.include(expected.normalize('NFKC'));
    }
    for (const caution of STANDARD_CAUTIONS) expect(text, caution.id).to.include(caution.title);
    const signedAt = v1.workflow!.signatures[0]!.signedAt;
    expect(text).to.include(`${signedAt.slice(0, 10)} ${signedAt.slice(11, 16)} UTC`);
    expect(text).to.include(`${code.slice(0, 4)}-${code.slice(4)}`);
    expect(text).to.match(/Printed \d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC by Ana Operator — check the code before use/);
    expect(text).to.include(`Page 1 of ${sheet.pages}`);
    expect(text).to.include(`Page ${sheet.pages} of ${sheet.pages}`);
  });

  it('carries a QR code of <origin>/check/<code>, the origin taken from the request', async function () {
    this.timeout(30000);
    const res = await getSheet(operator.agent, v1.recipeId, 1).set('Host', 'saw-room.lab.example:8443').expect(200);
    const sheet = await readSheet(res.body as Buffer);
    expect(sheet.qrTexts).to.deep.equal([`http://saw-room.lab.example:8443/check/${code}`]);
    expect(code).to.match(/^[0-9A-HJKMNP-TV-Z]{8}$/);
  });

  it('records every print: a sheet_prints row and a sheet.printed event', async () => {
    const before = await countRows(ctx.db, 'sheet_prints');
    await getSheet(operator.agent, v1.recipeId, 1).expect(200);
    expect(await countRows(ctx.db, 'sheet_prints')).to.equal(before + 1);
    const versionId = (await ctx.db('recipe_versions').where({ recipe_id: v1.recipeId, version: 1 }).first('id')).id;
    const print = await ctx.db('sheet_prints').orderBy('id', 'desc').first();
    expect(print).to.include({ version_id: versionId, user_id: operator.person.id });
    expect(print.client_address).to.be.a('string').and.not.equal('');
    expect(Date.now() - new Date(print.printed_at).getTime()).to.be.below(60000);
    const event = await ctx.db('trail_events').orderBy('id', 'desc').first();
    expect(event).to.include({ event_type: 'sheet.printed', entity_type: 'recipe_version' });
    expect(Number(event.entity_id)).to.equal(versionId);
    expect(Number(event.actor_user_id)).to.equal(operator.person.id);
    expect(asJson(event.after_json)).to.include({ printId: print.id, number: v1.number, version: 1, checkCode: code });
  });

  it('refuses drafts, versions in review and superseded versions with 409, and prints nothing', async () => {
    const draft = await createDraft(author, stock, { title: 'Still a draft' });
    const review = await inReview(author, stock, { title: 'Under review' });
    const before = await countRows(ctx.db, 'sheet_prints');
    for (const v of [draft, review]) {
      const res = await getSheet(author.agent, v.recipeId, v.version).expect(409);
      expect(res.headers['content-type']).to.match(/json/);
      const body = JSON.parse((res.body as Buffer).toString());
      expect(body.code).to.equal('CONFLICT');
      expect(body.errors[0].message).to.match(/only approved versions/);
    }
    // Version 2 approved: version 1 is superseded and no longer prints.
    const first = await approved(author, approver, stock, { title: 'Superseded soon' });
    const next = ok(await act.newVersion(author, first.recipeId, 1), 201);
    ok(await act.approve(approver, ok(await act.submit(author, next))));
    const res = await getSheet(operator.agent, first.recipeId, 1).expect(409);
    expect(JSON.parse((res.body as Buffer).toString()).errors[0].message).to.equal(
      `Version 1 of ${first.number} is superseded: only approved versions (current or approved for a later day) print as bench sheets. Print version 2, the current one.`,
    );
    expect(await countRows(ctx.db, 'sheet_prints')).to.equal(before);
  });

  it('prints a version approved for a later day, marked as not yet current', async function () {
    this.timeout(30000);
    const later = new Date(Date.now() + 10 * 86400000).toISOString().slice(0, 10);
    const pending = ok(await act.approve(approver, await inReview(author, stock, { title: 'Effective later' }), { effectiveDate: later }));
    const sheet = await readSheet((await getSheet(operator.agent, pending.recipeId, 1).expect(200)).body as Buffer);
    expect(flat(sheet.text)).to.include('Approved — not yet current').and.include(later);
  });

  it('answers an operator 404 for a draft, as for a version that does not exist', async () => {
    const draft = await createDraft(author, stock, { title: 'Hidden from operators' });
    await getSheet(operator.agent, draft.recipeId, 1).expect(404);
  });

  it('answers 404 for an unknown recipe or version', async () => {
    await getSheet(operator.agent, v1.recipeId, 9).expect(404);
    await getSheet(operator.agent, 999999, 1).expect(404);
  });

  describe('lab settings', () => {
    afterEach(async () => {
      await ctx.db('lab_settings').where({ id: 1 }).update({ sheet_paper: 'A4', default_units: 'metric', date_format: 'iso' });
    });

    it("writes every date in the lab's date format once the lab changes it", async function () {
      this.timeout(60000);
      const dmyDot = (iso: string) => `${iso.slice(8, 10)}.${iso.slice(5, 7)}.${iso.slice(0, 4)}`;
      const wf = v1.workflow!;
      const signedAt = wf.signatures[0]!.signedAt;
      const before = flat((await readSheet((await getSheet(operator.agent, v1.recipeId, 1).expect(200)).body as Buffer)).text);
      expect(before).to.include(`${signedAt.slice(0, 10)} ${signedAt.slice(11, 16)} UTC`);

      await ctx.db('lab_settings').where({ id: 1 }).update({ date_format: 'dmy-dot' });
      const text = flat((await readSheet((await getSheet(operator.agent, v1.recipeId, 1).expect(200)).body as Buffer)).text);
      // The approval signature, the effective and review dates, the print time.
      expect(text).to.include(`${dmyDot(signedAt)} ${signedAt.slice(11, 16)} UTC`);
      expect(text).to.include(dmyDot(wf.effectiveFrom!));
      expect(text).to.include(dmyDot(wf.reviewDueOn!));
      expect(text).to.match(/Printed \d{2}\.\d{2}\.\d{4} \d{2}:\d{2} UTC by Ana Operator/);
      expect(text, 'no ISO date left on the sheet').not.to.match(/\d{4}-\d{2}-\d{2}/);

      // A version approved for a later day: the warning names the day in the lab's format too.
      const later = new Date(Date.now() + 10 * 86400000).toISOString().slice(0, 10);
      const pending = ok(await act.approve(approver, await inReview(author, stock, { title: 'Effective later, lab dates' }), { effectiveDate: later }));
      const pendingText = flat((await readSheet((await getSheet(operator.agent, pending.recipeId, 1).expect(200)).body as Buffer)).text);
      expect(pendingText).to.include(`do not use it before ${dmyDot(later)}`);
      expect(pendingText).not.to.include(later);
    });

    it('prints on A4 by default and on Letter when the lab says so', async function () {
      this.timeout(30000);
      const a4 = await readSheet((await getSheet(operator.agent, v1.recipeId, 1).expect(200)).body as Buffer);
      expect(a4.sizes[0]).to.deep.equal({ width: 595, height: 842 });
      await ctx.db('lab_settings').where({ id: 1 }).update({ sheet_paper: 'Letter' });
      const letter = await readSheet((await getSheet(operator.agent, v1.recipeId, 1).expect(200)).body as Buffer);
      expect(letter.sizes.length).to.be.within(1, 2);
      for (const size of letter.sizes) expect(size).to.deep.equal({ width: 612, height: 792 });
    });

    it('puts imperial values beside metric ones when the lab wants both', async function () {
      this.timeout(30000);
      await ctx.db('lab_settings').where({ id: 1 }).update({ default_units: 'metric+imperial' });
      const text = flat((await readSheet((await getSheet(operator.agent, v1.recipeId, 1).expect(200)).body as Buffer)).text);
      expect(text).to.include('0.40 mm/s (0.94 in/min)');
      expect(text).to.include('39.3 m/s (7730 ft/min)');
      expect(text).to.include('Ø 250 mm (9.843 in)');
    });
  });
});
