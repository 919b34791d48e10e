/**
 * `npm run backup` / `npm run restore` (server/cli/README.md) on the real MariaDB: a backup of
 * the demo lab plus a photo on an approved version, then changes an app and an admin could
 * make (a new recipe, trail events, a renamed person, cut records and signatures emptied
 * behind the triggers' back), then the restore: every table exactly as it was, the chain
 * verifying, the triggers back and still refusing. And the refusals, each changing nothing.
 * The restore runs as the owner account (DATABASE_URL here); the app's own account
 * (TEST_APP_DATABASE_URL, from `npm test`) must keep working after it.
 */
import { expect } from 'chai';
import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import type { Knex } from 'knex';
import { MIGRATIONS_DIR } from '../../../server/data/db';
import { TRAIL_EVENTS } from '../../../server/services/trail/event-types';
import { appendTrailEvent } from '../../../server/services/trail/append';
import { verifyChain } from '../../../server/services/trail/verify';
import { seedDemoIfEmpty } from '../../../server/tools/db-setup';
import { DUMP_FILE, MANIFEST_FILE, type Manifest } from '../../../server/cli/backup/manifest';
import { makeBackup } from '../../../server/cli/backup/make-backup';
import { parseDatabaseUrl } from '../../../server/cli/backup/mariadb-clients';
import { RestoreRefusedError, restoreBackup, type RestoreOptions } from '../../../server/cli/backup/restore-backup';
import { createStockSet } from '../support/stock';
import { buildTestApp } from '../support/test-app';
import { closeTestDb, resetTables, testAppDatabaseUrl, testDatabaseUrl, testDb } from '../support/test-database';
import { act, approved, createDraft, ok, sessionFor } from '../workflow/workflow-support';

/**
 * The test account may only use its own database; the restore's two scratch databases are
 * made as root over the throw-away MariaDB's socket (`npm test` names its folder).
 */
function scratchMaker(): RestoreOptions['prepareScratch'] {
  const dir = process.env['KERFBOOK_TEST_MARIADB_DIR'];
  if (!dir) return undefined;
  const { user } = parseDatabaseUrl(testDatabaseUrl());
  return (name) => {
    const sql = `CREATE DATABASE IF NOT EXISTS \`${name}\`; GRANT ALL PRIVILEGES ON \`${name}\`.* TO '${user}'@'127.0.0.1'`;
    execFileSync('mariadb', ['--no-defaults', `--socket=${path.join(dir, 'mysqld.sock')}`, '-uroot', '-e', sql]);
  };
}

/** Every row of every table, in a stable order: two equal fingerprints mean equal contents. */
async function fingerprint(db: Knex): Promise<Record<string, string[]>> {
  const tables = ((await db.raw('SHOW FULL TABLES WHERE Table_type = ?', ['BASE TABLE'])) as [Record<string, string>[]])[0].map((r) => Object.values(r)[0]!);
  const out: Record<string, string[]> = {};
  for (const t of tables.sort()) {
    const rows = (await db(t).select('*')) as Record<string, unknown>[];
    out[t] = rows
      .map((r) =>
        JSON.stringify(r, (_k, v: unknown) =>
          v && typeof v === 'object' && (v as { type?: string }).type === 'Buffer'
            ? createHash('sha256')
                .update(Buffer.from((v as { data: number[] }).data))
                .digest('hex')
            : v,
        ),
      )
      .sort();
  }
  return out;
}

const triggerNames = async (db: Knex): Promise<string[]> =>
  ((await db.raw('SELECT TRIGGER_NAME AS n FROM information_schema.TRIGGERS WHERE TRIGGER_SCHEMA = DATABASE() ORDER BY 1')) as [{ n: string }[]])[0].map(
    (r) => r.n,
  );

/** Packs a changed copy of a backup: `change` may edit the manifest object and the dump file. */
function tamper(file: string, into: string, change: (manifest: Manifest, dumpPath: string) => void): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfbook-tamper-'));
  execFileSync('tar', ['-xzf', file, '-C', dir]);
  const manifest = JSON.parse(fs.readFileSync(path.join(dir, MANIFEST_FILE), 'utf8')) as Manifest;
  change(manifest, path.join(dir, DUMP_FILE));
  fs.writeFileSync(path.join(dir, MANIFEST_FILE), JSON.stringify(manifest));
  execFileSync('tar', ['-czf', into, '-C', dir, MANIFEST_FILE, DUMP_FILE]);
  fs.rmSync(dir, { recursive: true, force: true });
  return into;
}

describe('Backup and restore (npm run backup / restore)', function () {
  this.timeout(60000);
  /** Backups of this test go to a temporary folder, not the project's backups/. */
  let work: string;
  let options: RestoreOptions;
  let db: Knex;
  let app: Express;
  let backup: { file: string; manifest: Manifest };
  /** At the backup, and after the changes that followed it (what a refused restore must leave). */
  let original: Record<string, string[]>;
  let changed: Record<string, string[]>;

  /** Restore needs the database to itself: the test's own pool lets go of it first. */
  async function restoreAlone(file: string) {
    await closeTestDb();
    try {
      return await restoreBackup(testDatabaseUrl(), file, options);
    } finally {
      db = await testDb();
    }
  }

  async function expectRefused(file: string, message: RegExp) {
    const err = await restoreAlone(file).then(
      () => null,
      (e: unknown) => e,
    );
    expect(err).to.be.instanceOf(RestoreRefusedError);
    expect((err as Error).message).to.match(message);
    expect(await fingerprint(db), 'nothing changed').to.deep.equal(changed);
  }

  before(async function () {
    work = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfbook-backup-test-'));
    const prepareScratch = scratchMaker();
    const appDatabaseUrl = process.env['TEST_APP_DATABASE_URL'];
    options = { backupDir: work, ...(prepareScratch ? { prepareScratch } : {}), ...(appDatabaseUrl ? { appDatabaseUrl } : {}) };
    db = await testDb();
    await resetTables(db);
    await seedDemoIfEmpty(db);
    const built = await buildTestApp(db);
    app = built.app;

    // A photo on a version that is then approved: frozen, so its row is guarded by the triggers.
    const stock = await createStockSet(db);
    const author = await sessionFor(app, db, ['author']);
    const approver = await sessionFor(app, db, ['approver']);
    const sharp = (await import('sharp')).default;
    const png = await sharp({ create: { width: 16, height: 12, channels: 3, background: '#806040' } })
      .png()
      .toBuffer();
    const draft = await createDraft(author, stock, { title: 'Backed-up bar stock' });
    await author.agent
      .post(`/api/recipes/${draft.recipeId}/versions/1/attachments`)
      .set('x-csrf-token', author.csrf)
      .field('role', 'setup')
      .attach('file', png, 'setup.png')
      .expect(201);
    const current = ok(await act.get(author, draft));
    ok(await act.approve(approver, ok(await act.submit(author, current))));

    backup = await makeBackup(testDatabaseUrl(), { dir: work });
    original = await fingerprint(db);

    // Changes after the backup: through the app, and straight in the database as an admin could.
    await approved(author, approver, stock, { title: 'Made after the backup' });
    await db('users').update({ display_name: 'Renamed after the backup' });
    // Cut records and signatures refuse DELETE (triggers); TRUNCATE fires none.
    await db.transaction(async (trx) => {
      await trx.raw('SET FOREIGN_KEY_CHECKS = 0');
      await trx.raw('TRUNCATE cut_records');
      await trx.raw('TRUNCATE signatures');
    });
    changed = await fingerprint(db);
    expect(changed).to.not.deep.equal(original);
  });

  after(() => {
    if (work) fs.rmSync(work, { recursive: true, force: true });
  });

  it('writes a manifest that describes the snapshot: schema, counts, chain head, photos', async () => {
    const m = backup.manifest;
    expect(path.dirname(backup.file)).to.equal(work);
    expect(path.basename(backup.file)).to.match(/^.+-\d{4}-\d\d-\d\dT\d\d-\d\d-\d\dZ\.tar\.gz$/);
    const fromDb = (await db('knex_migrations').orderBy('id', 'desc').first('name')) as { name: string };
    expect(m.schema.latestMigration).to.equal(fromDb.name);
    expect(m.rowCounts['recipes']).to.equal(original['recipes']!.length);
    expect(m.rowCounts['signatures']).to.equal(original['signatures']!.length).and.to.be.above(0);
    expect(m.trail?.events).to.equal(original['trail_events']!.length);
    expect(m.attachments).to.include({ storedIn: 'database', count: 1 });
    expect(m.triggers).to.include.members([
      'trail_events_refuse_update',
      'recipe_versions_frozen_update',
      'signatures_no_delete',
      'attachments_frozen_insert',
      'recipes_library_insert',
      'recipe_versions_workflow_update',
      'cut_records_refuse_delete',
      'signatures_signed_step',
    ]);
  });

  it('refuses a missing file, changing nothing', async () => {
    await expectRefused(path.join(work, 'no-such-backup.tar.gz'), /There is no file/);
  });

  it('refuses a file that is not a backup, and a damaged one, changing nothing', async () => {
    const junk = path.join(work, 'junk.tar.gz');
    fs.writeFileSync(junk, 'not a backup at all');
    await expectRefused(junk, /is not a Kerfbook backup/);
    const cut = path.join(work, 'cut-short.tar.gz');
    fs.writeFileSync(cut, fs.readFileSync(backup.file).subarray(0, 200));
    await expectRefused(cut, /is not a Kerfbook backup/);
    const edited = tamper(backup.file, path.join(work, 'edited.tar.gz'), (_m, dump) => fs.appendFileSync(dump, 'DROP TABLE users;\n'));
    await expectRefused(edited, /dump\.sql is damaged/);
  });

  it('refuses a backup from a newer schema, changing nothing', async () => {
    const newer = tamper(backup.file, path.join(work, 'newer.tar.gz'), (m) => {
      m.schema.latestMigration = '29991231000000_from_a_later_kerfbook.ts';
    });
    await expectRefused(newer, /newer Kerfbook/);
  });

  it('refuses a dump that loads but does not match its manifest, changing nothing and leaving no scratch database', async () => {
    const wrong = tamper(backup.file, path.join(work, 'wrong-counts.tar.gz'), (m) => {
      m.rowCounts['recipes'] = m.rowCounts['recipes']! + 1;
    });
    await expectRefused(wrong, /does not match its manifest: recipes/);
    const name = parseDatabaseUrl(testDatabaseUrl()).database;
    const left = await db.raw('SELECT SCHEMA_NAME FROM information_schema.SCHEMATA WHERE SCHEMA_NAME IN (?, ?)', [`${name}_restore`, `${name}_previous`]);
    expect((left as [unknown[]])[0]).to.deep.equal([]);
  });

  it('refuses while another connection uses the database (a running app, on its own account), changing nothing', async () => {
    const other = (await import('../../../server/data/db')).createDb(testAppDatabaseUrl());
    try {
      await other.raw('SELECT 1');
      // Only the app's connection is left: the test's own pool lets go first.
      const err = await restoreAlone(backup.file).then(
        () => null,
        (e: unknown) => e,
      );
      expect(err).to.be.instanceOf(RestoreRefusedError);
      expect((err as Error).message).to.match(/other connection\(s\) use .* Stop the Kerfbook server/);
    } finally {
      await other.destroy();
    }
    expect(await fingerprint(db)).to.deep.equal(changed);
  });

  it('restores every recipe, signature, photo and trail hash as it was, with the chain verifying and the triggers back', async () => {
    const result = await restoreAlone(backup.file);
    expect(result.verification.ok).to.equal(true);
    expect(result.previousContents).to.match(/-before-restore\.tar\.gz$/);
    expect(fs.existsSync(result.previousContents!)).to.equal(true);

    const after = await fingerprint(db);
    for (const t of ['recipes', 'recipe_versions', 'signatures', 'trail_events', 'trail_chain_head', 'attachments', 'cut_records', 'users']) {
      expect(after[t], t).to.deep.equal(original[t]);
    }
    expect(after).to.deep.equal(original);
    expect(await verifyChain(db)).to.deep.equal({ ok: true, checked: backup.manifest.trail!.events, firstBroken: null });

    // The triggers came back with the rows, and they still guard them.
    expect(await triggerNames(db)).to.deep.equal(backup.manifest.triggers);
    const frozen = (await db('recipe_versions').whereNotNull('content_hash').first('id')) as { id: number };
    let refused = await db('recipe_versions')
      .where({ id: frozen.id })
      .update({ title: 'Changed after restore' })
      .then(
        () => null,
        (e: Error) => e,
      );
    expect(refused?.message).to.match(/content is frozen/);
    refused = await db('trail_events')
      .where('id', 1)
      .del()
      .then(
        () => null,
        (e: Error) => e,
      );
    expect(refused?.message).to.match(/append-only/);
    refused = await db('signatures')
      .del()
      .then(
        () => null,
        (e: Error) => e,
      );
    expect(refused?.message).to.match(/signatures are permanent/);
  });

  it("leaves the app's own account working on the restored tables: rows yes, triggers still refusing, schema no", async function () {
    if (!options.appDatabaseUrl) {
      console.warn('    TEST_APP_DATABASE_URL is not set (npm test sets it): skipped.');
      this.skip();
    }
    const appDb = (await import('../../../server/data/db')).createDb(options.appDatabaseUrl!);
    try {
      expect(await appDb('recipes').count({ n: '*' }).first()).to.deep.equal({ n: original['recipes']!.length });
      const [id] = await appDb('sign_in_failures').insert({ username: 'after-restore', client_address: '192.0.2.16', failed_at: new Date() });
      expect(await appDb('sign_in_failures').where({ id }).del()).to.equal(1);
      const kept = await appDb('signatures')
        .del()
        .then(
          () => null,
          (e: Error) => e,
        );
      expect(kept?.message).to.match(/signatures are permanent/);
      const dropped = await appDb.raw('DROP TRIGGER signatures_no_delete').then(
        () => null,
        (e: { code?: string }) => e,
      );
      expect(dropped?.code).to.be.oneOf(['ER_TABLEACCESS_DENIED_ERROR', 'ER_SPECIFIC_ACCESS_DENIED_ERROR', 'ER_DBACCESS_DENIED_ERROR']);
    } finally {
      await appDb.destroy();
    }
  });

  it('keeps the replaced contents as a backup that restores in turn', async () => {
    const previous = fs.readdirSync(work).find((f) => f.endsWith('-before-restore.tar.gz'))!;
    await restoreAlone(path.join(work, previous));
    const titles = (await db('recipe_versions').pluck('title')) as string[];
    expect(titles).to.include('Made after the backup');
    expect(await db('signatures').count({ n: '*' }).first()).to.deep.equal({ n: 0 });
    expect((await verifyChain(db)).ok).to.equal(true);
  });

  it("takes one snapshot while the trail keeps growing: the dump holds exactly the events up to the manifest's chain head", async () => {
    let writing = true;
    const writer = (async () => {
      const actor = { userId: null, name: 'Backup test', clientAddress: '127.0.0.1' };
      while (writing) await appendTrailEvent(db, actor, { type: TRAIL_EVENTS.preferencesChanged, entityType: 'user', entityId: null });
    })();
    try {
      await new Promise((r) => setTimeout(r, 100));
      const during = await makeBackup(testDatabaseUrl(), { dir: work });
      await new Promise((r) => setTimeout(r, 100));
      writing = false;
      await writer;

      const dir = fs.mkdtempSync(path.join(work, 'unpacked-'));
      execFileSync('tar', ['-xzf', during.file, '-C', dir]);
      const dump = fs.readFileSync(path.join(dir, DUMP_FILE), 'latin1');
      const { headEventId, headHash, events } = during.manifest.trail!;
      const upToHead = (await db('trail_events').where('id', '<=', headEventId).orderBy('id').pluck('hash')) as string[];
      const later = (await db('trail_events').where('id', '>', headEventId).pluck('hash')) as string[];
      expect(later.length, 'events appended after the snapshot').to.be.above(0);
      expect(upToHead.length).to.equal(events);
      expect(upToHead[upToHead.length - 1]).to.equal(headHash);
      expect(
        upToHead.filter((h) => !dump.includes(h)),
        'events missing from the dump',
      ).to.deep.equal([]);
      expect(
        later.filter((h) => dump.includes(h)),
        'events the manifest does not count',
      ).to.deep.equal([]);
    } finally {
      writing = false;
      await writer;
    }
  });

  it('restores a backup made before the trail tables were renamed: migrated, the same chain verifying under the new names', async () => {
    const rename = fs.readdirSync(MIGRATIONS_DIR).find((f) => f.endsWith('_rename_audit_tables_to_trail.ts'))!;
    const hashes = (await db('trail_events').orderBy('id').pluck('hash')) as string[];
    await db.migrate.down({ name: rename });
    let old: Awaited<ReturnType<typeof makeBackup>>;
    let result: Awaited<ReturnType<typeof restoreAlone>>;
    try {
      old = await makeBackup(testDatabaseUrl(), { dir: work });
      result = await restoreAlone(old.file);
    } finally {
      // Whatever happened, the test database ends up under today's names again.
      await db.migrate.latest();
    }
    expect(old.manifest.rowCounts).to.include.keys('audit_events', 'audit_chain_head');
    expect(old.manifest.trail!.events).to.equal(hashes.length);
    expect(old.manifest.triggers).to.include('audit_events_refuse_update');

    expect(result.migrationsRun).to.deep.equal([rename]);
    expect(result.verification).to.deep.equal({ ok: true, checked: hashes.length, firstBroken: null });
    expect(await db('trail_events').orderBy('id').pluck('hash')).to.deep.equal(hashes);
    const names = await triggerNames(db);
    expect(names).to.include.members(['trail_events_refuse_update', 'trail_events_refuse_delete']);
    expect(names.filter((n) => n.startsWith('audit_'))).to.deep.equal([]);
    const refused = await db('trail_events')
      .where('id', 1)
      .update({ actor_name: 'Edited' })
      .then(
        () => null,
        (e: Error) => e,
      );
    expect(refused?.message).to.match(/append-only/);
  });
});
