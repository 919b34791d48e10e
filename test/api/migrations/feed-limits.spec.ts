/**
 * The feed-limits migrations against the real database: a lab's own per-group ceilings are
 * carried into the new form, a second run keeps what is there, and down brings the
 * per-group ceilings back. The migration modules are run directly (the folder order and the
 * migration table stay as they are); the schema and the settings row are put back after.
 */
import { expect } from 'chai';
import type { Knex } from 'knex';
import * as addLimits from '../../../migrations/20261205183759_add_feed_limits_to_lab_settings';
import * as fillLimits from '../../../migrations/20261205183803_insert_feed_limits';
import * as dropCeilings from '../../../migrations/20261205183807_drop_feed_ceilings_from_lab_settings';
import { restoreLabSettings } from '../../../server/data/empty-tables';
import { getLabLimits } from '../../../server/services/stock/lab-limits';
import { fromJsonColumn } from '../../../server/data/json-column';
import { testDb } from '../support/test-database';

describe('Migrations: feed limits from the per-group ceilings', () => {
  let db: Knex;
  const settings = async () => (await db('lab_settings').where({ id: 1 }).first()) as Record<string, unknown>;

  before(async () => {
    db = await testDb();
    // Back to the schema before the drop: the old column exists again, empty.
    await dropCeilings.down(db);
  });

  after(async () => {
    if (!(await db.schema.hasColumn('lab_settings', 'feed_limits_json'))) await addLimits.up(db);
    await fillLimits.up(db);
    if (await db.schema.hasColumn('lab_settings', 'feed_ceilings_json')) await dropCeilings.up(db);
    await restoreLabSettings(db);
  });

  it("carries a lab's own ceilings over (plain steel lowered to 0.3 mm/s: bands 0.3, 0.2, 0.125 mm/s, computed by hand from the starting ratios)", async () => {
    await db('lab_settings')
      .where({ id: 1 })
      .update({ feed_ceilings_json: JSON.stringify({ 'plain-low-alloy-steel': 0.3, copper: 0.5 }), feed_limits_json: null, long_contact_mm: null });
    await fillLimits.up(db);
    const limits = await getLabLimits(db);
    const of = (group: string, machineClass: string) => limits.feedCeilings.filter((c) => c.group === group && c.machineClass === machineClass).map((c) => c.maxFeedMmS);
    expect(of('plain-low-alloy-steel', 'floor-abrasive')).to.deep.equal([0.3, 0.2, 0.125]);
    expect(of('copper', 'bench-abrasive')).to.deep.equal([0.5]);
    expect(of('titanium', 'bench-abrasive')).to.deep.equal([0.3]); // not set by the lab: the starting value
    expect(limits.traverseRemovalCeilings['plain-low-alloy-steel']).to.equal(12); // 0.3 mm/s × 40 mm
    expect(limits.longContactMm).to.equal(fillLimits.STARTER_LONG_CONTACT_MM);
  });

  it('a second run keeps what is there', async () => {
    const changed = { plunge: [{ group: 'copper', hardness: null, machineClass: 'precision', maxFeedMmS: 0.07 }], traverseRemoval: {} };
    await db('lab_settings').where({ id: 1 }).update({ feed_limits_json: JSON.stringify(changed), long_contact_mm: 75 });
    await fillLimits.up(db);
    const row = await settings();
    expect(fromJsonColumn(row['feed_limits_json'])).to.deep.equal(changed);
    expect(row['long_contact_mm']).to.equal(75);
  });

  it('down writes one ceiling per group back (the floor saw, softest band) and empties the new settings', async () => {
    await db('lab_settings').where({ id: 1 }).update({ feed_limits_json: JSON.stringify(fillLimits.feedLimitsFrom({ copper: 0.5 })) });
    await fillLimits.down(db);
    const row = await settings();
    const old = fromJsonColumn<Record<string, number>>(row['feed_ceilings_json']);
    expect(old['copper']).to.equal(0.5);
    expect(old['plain-low-alloy-steel']).to.equal(0.6);
    expect(Object.keys(old)).to.have.length(12);
    expect(row['feed_limits_json']).to.equal(null);
    expect(row['long_contact_mm']).to.equal(null);
  });
});
