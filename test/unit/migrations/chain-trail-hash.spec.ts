/**
 * The chain migration carries its own copy of the "kb-trail-1" hash, so the chain it
 * builds stays what it was whatever becomes of the app's code. Pinned here to fixed
 * hashes, which the app's trail hash gives too as long as it writes "kb-trail-1".
 */
import { expect } from 'chai';
import { createHash } from 'node:crypto';
import { trailHash as frozenTrailHash } from '../../../migrations/20261201230150_chain_audit_events';
import { trailHash as appTrailHash } from '../../../server/services/trail/hash';

const GENESIS = '0'.repeat(64);

/** A first row: key order of before/after deliberately not sorted. */
const first = {
  id: 1,
  occurredAt: new Date('2026-12-01T08:15:02.120Z'),
  actorUserId: 3,
  actorName: 'Dana Ortiz',
  eventType: 'recipe.created',
  entityType: 'recipe',
  entityId: '7',
  recipeId: 7,
  before: null,
  after: { title: 'Round bar, transverse', number: 'KB-0007', scope: { shape: 'round_bar', diameterMm: [10, 40] } },
  clientAddress: '127.0.0.1',
  prevHash: GENESIS,
};
const FIRST_TEXT =
  '["kb-trail-1",1,"2026-12-01T08:15:02.120Z",3,"Dana Ortiz","recipe.created","recipe","7",7,null,' +
  '{"number":"KB-0007","scope":{"diameterMm":[10,40],"shape":"round_bar"},"title":"Round bar, transverse"},' +
  `"127.0.0.1","${GENESIS}"]`;
const FIRST_HASH = '6008a2aedcc2e97ae15ea5ba5275892e1a1a5ea9b375b4c912c88571e0671a99';

/** The next row: nulls where a system event has no actor or entity, text beyond ASCII. */
const second = {
  id: 2,
  occurredAt: new Date('2026-12-01T08:16:00.000Z'),
  actorUserId: null,
  actorName: 'system',
  eventType: 'version.superseded',
  entityType: 'recipe_version',
  entityId: null,
  recipeId: null,
  before: { status: 'approved' },
  after: { status: 'superseded', note: 'Ø 10–40 mm, “Härte” 52 HRC' },
  clientAddress: null,
  prevHash: FIRST_HASH,
};
const SECOND_HASH = '44efb26c49d5124ad516a7b74b9da71bf8ff1f2e67dd81d65f6878df192e6cff';

describe('The chain migration’s frozen trail hash (kb-trail-1)', () => {
  it('is the SHA-256 of the canonical JSON array, in lower-case hex', () => {
    expect(createHash('sha256').update(FIRST_TEXT, 'utf8').digest('hex')).to.equal(FIRST_HASH);
    expect(frozenTrailHash(first)).to.equal(FIRST_HASH);
  });

  it('chains a second row with nulls and non-ASCII text to its fixed hash', () => {
    expect(frozenTrailHash(second)).to.equal(SECOND_HASH);
  });

  it('refuses a row without a valid time', () => {
    expect(() => frozenTrailHash({ ...first, occurredAt: new Date(Number.NaN) })).to.throw(/no valid time/);
  });

  it('gives the hashes the app’s trail hash gives (the app still writes kb-trail-1)', () => {
    expect(appTrailHash(first)).to.equal(FIRST_HASH);
    expect(appTrailHash(second)).to.equal(SECOND_HASH);
  });
});
