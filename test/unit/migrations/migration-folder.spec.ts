/**
 * The migrations folder keeps its rules (migrations/README.md): names stamped in order and
 * never in the future, no import from live code, landed migrations unchanged, every
 * migration landed. Then each rule on a folder made to break it, so that each can fail.
 */
import { expect } from 'chai';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { MIGRATIONS_DIR } from '../../../server/data/db';
import {
  type Problem,
  checksumProblems,
  folderProblems,
  futureProblems,
  importProblems,
  importSpecifiers,
  nameProblems,
  orderProblems,
} from '../../../server/tools/migrations/migration-checks';
import { CHECKSUMS_FILE, fileChecksum, readChecksums, writeChecksums } from '../../../server/tools/migrations/migration-folder';
import { sealMigrations } from '../../../server/tools/migrations/migration-seal';

const messages = (problems: Problem[]) => problems.map((p) => p.message);

describe('The migrations folder', () => {
  it('names every migration <14-digit stamp>_<snake_name>.ts, and holds nothing Knex would skip', () => {
    expect(messages(nameProblems(MIGRATIONS_DIR))).to.deep.equal([]);
  });

  it('has stamps that increase in the order the checksum list records them, unsealed ones last', () => {
    expect(messages(orderProblems(MIGRATIONS_DIR))).to.deep.equal([]);
  });

  it('has no stamp in the future', () => {
    expect(messages(futureProblems(MIGRATIONS_DIR, new Date()))).to.deep.equal([]);
  });

  it('has no migration importing from server/, src/, test/ or seeds/', () => {
    expect(messages(importProblems(MIGRATIONS_DIR))).to.deep.equal([]);
  });

  it('has every migration landed, byte for byte as it landed', () => {
    expect(messages(checksumProblems(MIGRATIONS_DIR))).to.deep.equal([]);
  });

  it('records the landed migrations in the order Knex runs them', () => {
    const listed = readChecksums(MIGRATIONS_DIR).map(([name]) => name);
    expect(listed).to.deep.equal([...listed].sort());
    expect(listed.length).to.be.at.least(25);
  });
});

describe('The migration folder rules, on a folder that breaks them', () => {
  const NOW = new Date('2026-12-05T12:00:00Z');
  let root: string;
  let dir: string;
  const write = (file: string, text = "import type { Knex } from 'knex';\nexport async function up(knex: Knex) {}\n") =>
    fs.writeFileSync(path.join(dir, file), text);
  const seal = (...files: string[]) =>
    writeChecksums(dir, [...readChecksums(dir), ...files.map((f): [string, string] => [f, fileChecksum(path.join(dir, f))])]);

  beforeEach(() => {
    root = fs.mkdtempSync(path.join(os.tmpdir(), 'kerfbook-migrations-'));
    dir = path.join(root, 'migrations');
    fs.mkdirSync(dir);
  });
  afterEach(() => fs.rmSync(root, { recursive: true, force: true }));

  it('accepts a folder that keeps them', () => {
    write('20261201220511_create_things.ts');
    write('20261201220512_add_thing_colour.ts');
    seal('20261201220511_create_things.ts', '20261201220512_add_thing_colour.ts');
    fs.writeFileSync(path.join(dir, 'README.md'), '# Migrations\n');
    expect(messages(folderProblems(dir, NOW))).to.deep.equal([]);
  });

  it('finds names that are not <14-digit stamp>_<snake_name>.ts, impossible stamps and files Knex skips', () => {
    for (const f of ['AddThing.ts', '20261201_add_thing.ts', '20261201220511_AddThing.ts', '20261201220511_add-thing.ts', '20261201220511_add__thing.ts', '20261301000000_bad_month.ts', '20261131120000_bad_day.ts']) write(f);
    write('20261201220511_written_in_javascript.js', '');
    const found = nameProblems(dir).map((p) => p.file).sort();
    expect(found).to.deep.equal(
      ['20261131120000_bad_day.ts', '20261201220511_AddThing.ts', '20261201220511_add-thing.ts', '20261201220511_add__thing.ts', '20261201220511_written_in_javascript.js', '20261201_add_thing.ts', '20261301000000_bad_month.ts', 'AddThing.ts'].sort(),
    );
  });

  it('finds landed stamps that do not increase in the list’s order', () => {
    write('20261201220511_create_things.ts');
    write('20261201220512_add_thing_colour.ts');
    seal('20261201220512_add_thing_colour.ts', '20261201220511_create_things.ts');
    expect(orderProblems(dir).map((p) => p.file)).to.deep.equal(['20261201220511_create_things.ts']);
  });

  it('finds an unsealed migration stamped before a landed one', () => {
    write('20261201220511_create_things.ts');
    write('20261202000000_add_thing_colour.ts');
    seal('20261202000000_add_thing_colour.ts');
    const [problem, ...rest] = orderProblems(dir);
    expect(rest).to.deep.equal([]);
    expect(problem!.file).to.equal('20261201220511_create_things.ts');
    expect(problem!.message).to.contain('npm run db:new-migration');
  });

  it('finds a stamp in the future, and only that one', () => {
    write('20261205115959_add_thing_colour.ts');
    write('20261205120000_add_thing_size.ts');
    write('20261205120001_add_thing_weight.ts');
    expect(futureProblems(dir, NOW).map((p) => p.file)).to.deep.equal(['20261205120001_add_thing_weight.ts']);
  });

  it('reads every import and require specifier, type-only ones too', () => {
    const source = [
      "import type { Knex } from 'knex';",
      "import { createHash } from 'node:crypto';",
      "import { a } from '../server/services/a';",
      "import type { B } from \"../src/app/b\";",
      "export { c } from '../test/c';",
      "export * from '../seeds/d';",
      "const e = require('../server/e');",
      "const f = await import('../shared/f');",
    ].join('\n');
    expect(importSpecifiers(source)).to.deep.equal(['knex', 'node:crypto', '../server/services/a', '../src/app/b', '../test/c', '../seeds/d', '../server/e', '../shared/f']);
  });

  it('finds imports from live code, and leaves knex, node built-ins and shared/ alone', () => {
    write('20261201220511_allowed.ts', "import type { Knex } from 'knex';\nimport { randomInt } from 'node:crypto';\nimport { X } from '../shared/x';\n");
    write('20261201220512_imports_server.ts', "import { trailHash } from '../server/services/trail-hash';\n");
    write('20261201220513_requires_src.ts', "const x = require('../src/app/x');\n");
    write('20261201220514_imports_test.ts', "const x = await import('./../test/x');\n");
    write('20261201220515_reexports_seeds.ts', "export * from '../seeds/demo';\n");
    write('20261201220516_type_from_server.ts', "import type { Config } from '../server/config';\n");
    expect(importProblems(dir).map((p) => p.file)).to.deep.equal([
      '20261201220512_imports_server.ts',
      '20261201220513_requires_src.ts',
      '20261201220514_imports_test.ts',
      '20261201220515_reexports_seeds.ts',
      '20261201220516_type_from_server.ts',
    ]);
  });

  it('finds a landed migration changed by one byte, one gone, and one not landed yet', () => {
    write('20261201220511_create_things.ts');
    write('20261201220512_add_thing_colour.ts');
    write('20261201220513_add_thing_size.ts');
    seal('20261201220511_create_things.ts', '20261201220512_add_thing_colour.ts');
    fs.appendFileSync(path.join(dir, '20261201220511_create_things.ts'), ' ');
    fs.rmSync(path.join(dir, '20261201220512_add_thing_colour.ts'));
    const found = checksumProblems(dir);
    expect(found.map((p) => [p.rule, p.file])).to.deep.equal([
      ['changed', '20261201220511_create_things.ts'],
      ['gone', '20261201220512_add_thing_colour.ts'],
      ['unsealed', '20261201220513_add_thing_size.ts'],
    ]);
    expect(found[2]!.message).to.contain('npm run db:seal-migrations');
  });

  it('seals the migrations not landed yet, in the order they run, after the landed ones', () => {
    write('20261201220511_create_things.ts');
    seal('20261201220511_create_things.ts');
    write('20261201220513_add_thing_size.ts');
    write('20261201220512_add_thing_colour.ts');
    expect(sealMigrations(dir, NOW)).to.deep.equal(['20261201220512_add_thing_colour.ts', '20261201220513_add_thing_size.ts']);
    expect(readChecksums(dir)).to.deep.equal(
      ['20261201220511_create_things.ts', '20261201220512_add_thing_colour.ts', '20261201220513_add_thing_size.ts'].map((f) => [f, fileChecksum(path.join(dir, f))]),
    );
    expect(folderProblems(dir, NOW)).to.deep.equal([]);
    expect(sealMigrations(dir, NOW)).to.deep.equal([]);
  });

  it('seals nothing while a landed migration has changed', () => {
    write('20261201220511_create_things.ts');
    seal('20261201220511_create_things.ts');
    fs.appendFileSync(path.join(dir, '20261201220511_create_things.ts'), '// later\n');
    write('20261201220512_add_thing_colour.ts');
    const list = fs.readFileSync(path.join(dir, CHECKSUMS_FILE), 'utf8');
    expect(() => sealMigrations(dir, NOW)).to.throw(/20261201220511_create_things\.ts changed after it landed/);
    expect(fs.readFileSync(path.join(dir, CHECKSUMS_FILE), 'utf8')).to.equal(list);
  });
});
