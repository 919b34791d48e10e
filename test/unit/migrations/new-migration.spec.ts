/**
 * `npm run db:new-migration -- <name>`: a checked name, a stamp that is now (UTC) or one
 * second after the newest migration, an up/down skeleton that imports only knex types.
 * Everything is written into a temporary folder, never into migrations/.
 */
import { expect } from 'chai';
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { folderProblems, importSpecifiers } from '../../../server/tools/migrations/migration-checks';
import { createMigration, nextStamp } from '../../../server/tools/migrations/migration-folder';

const ROOT = path.resolve(import.meta.dirname, '../../..');
const TSX = path.join(ROOT, 'node_modules/.bin/tsx');

describe('npm run db:new-migration', () => {
  let dir: string;
  const NOW = new Date('2026-12-05T16:12:07.850Z');

  beforeEach(() => {
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfbook-new-migration-'));
  });
  afterEach(() => fs.rmSync(dir, { recursive: true, force: true }));

  it('stamps a new migration with the current second in UTC', () => {
    fs.writeFileSync(path.join(dir, '20261201220511_create_things.ts'), '');
    const file = createMigration('add_wheel_lot_numbers', dir, NOW);
    expect(file).to.equal(path.join(dir, '20261205161207_add_wheel_lot_numbers.ts'));
    expect(fs.existsSync(file)).to.equal(true);
  });

  it('stamps one second after the newest migration when that is later than now, or the same second', () => {
    fs.writeFileSync(path.join(dir, '20261205161207_add_thing_colour.ts'), '');
    expect(nextStamp(dir, NOW)).to.equal('20261205161208');
    fs.writeFileSync(path.join(dir, '20261231235959_stamped_ahead.ts'), '');
    expect(nextStamp(dir, NOW)).to.equal('20270101000000');
  });

  it('gives two migrations made in the same second consecutive stamps', () => {
    const a = createMigration('add_thing_colour', dir, NOW);
    const b = createMigration('add_thing_size', dir, NOW);
    expect([path.basename(a), path.basename(b)]).to.deep.equal(['20261205161207_add_thing_colour.ts', '20261205161208_add_thing_size.ts']);
  });

  it('refuses a name that is not lower snake_case words, and writes nothing', () => {
    for (const name of ['', 'AddThing', 'add-thing', 'add thing', 'add__thing', '_add_thing', 'add_thing_', '1_add_thing', 'add_thing.ts', 'älter']) {
      expect(() => createMigration(name, dir, NOW), name).to.throw(/not a migration name/);
    }
    expect(fs.readdirSync(dir)).to.deep.equal([]);
  });

  it('writes an up/down skeleton that imports only knex types, keeps the folder rules, and throws until written', async () => {
    const file = createMigration('add_wheel_lot_numbers', dir, NOW);
    const text = fs.readFileSync(file, 'utf8');
    expect(importSpecifiers(text)).to.deep.equal(['knex']);
    expect(text).to.match(/^import type \{ Knex \} from 'knex';/);
    expect(folderProblems(dir, new Date()).map((p) => p.rule)).to.deep.equal(['unsealed']);
    const skeleton = (await import(pathToFileURL(file).href)) as { up: () => Promise<void>; down: () => Promise<void> };
    for (const step of [skeleton.up, skeleton.down]) {
      let thrown: unknown = null;
      await step().catch((err: unknown) => (thrown = err));
      expect(String(thrown)).to.contain('20261205161207_add_wheel_lot_numbers.ts').and.contain('not written yet');
    }
  });

  it('as a command: writes into --dir, prints the path; a bad name exits 1 with the rule; db:seal-migrations lands it', function () {
    this.timeout(30000);
    const script = path.join(ROOT, 'server/tools/migrations/new-migration.ts');
    const made = spawnSync(TSX, [script, 'add_wheel_lot_numbers', '--dir', dir], { cwd: ROOT, encoding: 'utf8' });
    expect(made.status, made.stderr).to.equal(0);
    const printed = made.stdout.trim();
    expect(path.dirname(printed)).to.equal(dir);
    expect(path.basename(printed)).to.match(/^\d{14}_add_wheel_lot_numbers\.ts$/);
    expect(fs.readdirSync(dir)).to.deep.equal([path.basename(printed)]);
    const stampedAt = Date.parse(path.basename(printed).replace(/^(\d{4})(\d{2})(\d{2})(\d{2})(\d{2})(\d{2}).*/, '$1-$2-$3T$4:$5:$6Z'));
    expect(Math.abs(Date.now() - stampedAt)).to.be.below(60_000);

    const refused = spawnSync(TSX, [script, 'Add-Wheel-Lots', '--dir', dir], { cwd: ROOT, encoding: 'utf8' });
    expect(refused.status).to.equal(1);
    expect(refused.stderr).to.contain('not a migration name');
    expect(fs.readdirSync(dir)).to.have.length(1);

    const sealed = spawnSync(TSX, [path.join(ROOT, 'server/tools/migrations/seal-migrations.ts'), '--dir', dir], { cwd: ROOT, encoding: 'utf8' });
    expect(sealed.status, sealed.stderr).to.equal(0);
    expect(Object.keys(JSON.parse(fs.readFileSync(path.join(dir, 'checksums.json'), 'utf8')) as object)).to.deep.equal([path.basename(printed)]);
  });
});
