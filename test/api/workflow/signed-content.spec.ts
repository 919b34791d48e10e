/**
 * Someone with database access rewrites a signed version's content (here the feed, 0.40 →
 * 0.90 mm/s) and even its stored hash. Every place the version is used recomputes the
 * content's SHA-256 and holds it against every signature: the recipe page shows the version
 * failing its integrity check, the comparison says so, the bench sheet refuses to print,
 * an approval refuses to sign changed content, admins and auditors get one mail per finding
 * and the trail one event, and `npm run trail:verify` names the version.
 */
import { spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import { expect } from 'chai';
import type { Knex } from 'knex';
import type { RecipeComparison, RecipeVersionDto } from '../../../shared/recipe-types';
import { apiTestContext } from '../support/hooks';
import { createPerson } from '../support/people';
import { createStockSet, type StockSet } from '../support/stock';
import { testDatabaseUrl } from '../support/test-database';
import { getSheet } from '../sheet/sheet-support';
import { act, approved, inReview, sessionFor, type Session } from './workflow-support';

const sha256 = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex');

/**
 * As an owner of the database would: any trigger on the table that stands in the way is
 * dropped for the change and put back after it (the app's own account cannot do this).
 */
async function asDatabaseOwner<T>(db: Knex, table: string, change: () => Promise<T>): Promise<T> {
  const [triggers] = (await db.raw('SHOW TRIGGERS WHERE `Table` = ?', [table])) as [{ Trigger: string }[]];
  const statements: string[] = [];
  for (const t of triggers) {
    const [rows] = (await db.raw(`SHOW CREATE TRIGGER \`${t.Trigger}\``)) as [Record<string, string>[]];
    statements.push(rows[0]!['SQL Original Statement']!);
    await db.raw(`DROP TRIGGER \`${t.Trigger}\``);
  }
  try {
    return await change();
  } finally {
    for (const statement of statements) await db.raw(statement);
  }
}

/** Rewrites the stored feed of a version; with `rehash`, the stored content hash too. */
async function tamper(db: Knex, v: RecipeVersionDto, rehash: boolean): Promise<void> {
  const row = await db('recipe_versions').where({ recipe_id: v.recipeId, version: v.version }).first('id', 'content_json');
  const text = typeof row.content_json === 'string' ? row.content_json : JSON.stringify(row.content_json);
  const changed = text.replace(/"feedMmS":[0-9.]+/, '"feedMmS":0.9');
  expect(changed).to.not.equal(text);
  await asDatabaseOwner(db, 'recipe_versions', () =>
    db('recipe_versions')
      .where({ id: row.id })
      .update({ content_json: changed, ...(rehash ? { content_hash: sha256(changed) } : {}) }),
  );
}

function runVerify(): Promise<{ code: number; output: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn('npx', ['tsx', 'server/cli/trail-verify.ts'], { env: { ...process.env, DATABASE_URL: testDatabaseUrl(), FORCE_COLOR: '0' } });
    let output = '';
    child.stdout.on('data', (c: Buffer) => (output += c.toString()));
    child.stderr.on('data', (c: Buffer) => (output += c.toString()));
    child.on('error', reject);
    child.on('close', (code) => resolve({ code: code ?? -1, output }));
  });
}

describe('Signed content checked wherever it is used', function () {
  this.timeout(60000);
  const ctx = apiTestContext();
  let author: Session;
  let approver: Session;
  let operator: Session;
  let auditor: Session;
  let stock: StockSet;

  before(async () => {
    author = await sessionFor(ctx.app, ctx.db, ['author'], 'Ines Author');
    approver = await sessionFor(ctx.app, ctx.db, ['approver'], 'Petra Approver');
    operator = await sessionFor(ctx.app, ctx.db, ['operator'], 'Ana Operator');
    auditor = await sessionFor(ctx.app, ctx.db, ['auditor'], 'Aud Itor');
    await createPerson(ctx.db, { username: 'ada.admin', displayName: 'Ada Admin', roles: ['admin'] });
    stock = await createStockSet(ctx.db);
  });

  const integrityMails = () => ctx.db('mail_outbox').where({ kind: 'integrity-failed' }).orderBy('id');
  const integrityEvents = () => ctx.db('trail_events').where({ event_type: 'recipe.version_integrity_failed' }).orderBy('id');

  it('an untouched approved version passes: integrity ok on the page and in the comparison, the sheet prints, verify exits 0', async () => {
    const v = await approved(author, approver, stock, { title: 'Untouched' });
    const page = (await operator.agent.get(`/api/recipes/${v.recipeId}/versions/1`).expect(200)).body as RecipeVersionDto;
    expect(page.integrity).to.deep.equal({ ok: true, problems: [] });
    const cmp = (await auditor.agent.get(`/api/recipes/${v.recipeId}/compare?from=1&to=1`).expect(200)).body as RecipeComparison;
    expect(cmp.to.integrity).to.deep.equal({ ok: true, problems: [] });
    expect((await getSheet(operator.agent, v.recipeId, 1)).status).to.equal(200);
    const verify = await runVerify();
    expect(verify.code, verify.output).to.equal(0);
    expect(verify.output).to.match(/Signed content intact: \d+ submitted versions/);
  });

  it('content rewritten with its stored hash recomputed still fails: the signature binds the old content', async () => {
    const v = await approved(author, approver, stock, { title: 'Walked back' });
    await tamper(ctx.db, v, true);
    const mailsBefore = (await integrityMails()).length;

    const page = (await operator.agent.get(`/api/recipes/${v.recipeId}/versions/1`).expect(200)).body as RecipeVersionDto;
    expect(page.content.cutting.feedMmS).to.equal(0.9);
    expect(page.integrity?.ok).to.equal(false);
    expect(page.integrity?.problems.join(' ')).to.match(
      /Petra Approver's signature \(approved, .* UTC\) binds content [0-9a-f]{16}…, not the content stored now/,
    );

    const cmp = (await auditor.agent.get(`/api/recipes/${v.recipeId}/compare?from=1&to=1`).expect(200)).body as RecipeComparison;
    expect(cmp.from.integrity?.ok).to.equal(false);

    const sheet = await getSheet(operator.agent, v.recipeId, 1);
    expect(sheet.status).to.equal(409);
    expect(JSON.parse((sheet.body as Buffer).toString()).code).to.equal('INTEGRITY_FAILED');
    expect(await ctx.db('sheet_prints').count({ n: '*' }).first()).to.deep.equal({ n: 1 });

    // One finding, reported once however often it is seen: a mail to each admin and auditor, one trail event.
    const mails = (await integrityMails()).slice(mailsBefore);
    expect(mails.map((m) => m.to_address).sort()).to.deep.equal(['ada.admin@lab.example', `${auditor.person.username}@lab.example`].sort());
    for (const m of mails) {
      expect(m.subject).to.equal(`Integrity check failed: ${v.number} v1 "Walked back"`);
      expect(m.text_body).to.include("Petra Approver's signature");
    }
    const events = await integrityEvents();
    expect(events).to.have.length(1);

    const verify = await runVerify();
    expect(verify.code, verify.output).to.equal(1);
    expect(verify.output).to.include(`${v.number} v1:`);
  });

  it('content changed in review under its old hash: the approver cannot sign it, and is told admins and auditors know', async () => {
    const v = await inReview(author, stock, { title: 'Changed in review' });
    await tamper(ctx.db, v, false);
    const mailsBefore = (await integrityMails()).length;
    const res = await act.approve(approver, v);
    expect(res.status).to.equal(409);
    expect(res.body.code).to.equal('INTEGRITY_FAILED');
    expect(res.body.errors[0].message).to.match(/cannot be signed\. Admins and auditors have been told\./);
    const row = await ctx.db('recipe_versions').where({ recipe_id: v.recipeId, version: 1 }).first('status');
    expect(row.status).to.equal('in-review');
    expect(
      await ctx
        .db('signatures')
        .join('recipe_versions', 'recipe_versions.id', 'signatures.version_id')
        .where({ recipe_id: v.recipeId })
        .count({ n: '*' })
        .first(),
    ).to.deep.equal({ n: 0 });
    expect((await integrityMails()).length).to.equal(mailsBefore + 2);
    const page = (await auditor.agent.get(`/api/recipes/${v.recipeId}/versions/1`).expect(200)).body as RecipeVersionDto;
    expect(page.integrity?.problems.join(' ')).to.match(/no longer matches the hash fixed when it was submitted/);
    // Seen again: the same finding is not reported twice.
    expect((await integrityMails()).length).to.equal(mailsBefore + 2);
  });
});
