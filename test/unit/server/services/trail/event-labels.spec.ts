/** Every event type the trail records reads as words, and belongs to a family an auditor can filter by. */
import { expect } from 'chai';
import { TRAIL_EVENTS } from '../../../../../server/services/trail/event-types';
import { inTrailFamily } from '../../../../../shared/trail-families';
import { TRAIL_EVENT_LABELS, TRAIL_FAMILIES, trailEventLabel } from '../../../../../shared/vocabulary';

describe('trail event labels and families', () => {
  it('gives every recorded event type its own words', () => {
    const labels = Object.values(TRAIL_EVENTS).map((type) => TRAIL_EVENT_LABELS[type]);
    expect(labels.every((l) => typeof l === 'string' && l.length > 0)).to.equal(true);
    expect(new Set(labels).size).to.equal(labels.length);
    expect(trailEventLabel('recipe.version_acknowledged')).to.equal('Version acknowledged');
    // A type from a newer server shows its code rather than nothing.
    expect(trailEventLabel('x.unknown')).to.equal('x.unknown');
  });

  it('puts every recorded event type in at least one family', () => {
    for (const type of Object.values(TRAIL_EVENTS)) {
      expect(
        TRAIL_FAMILIES.some((f) => inTrailFamily(type, f)),
        type,
      ).to.equal(true);
    }
    expect(inTrailFamily('recipe.version_approved', 'signatures')).to.equal(true);
    expect(inTrailFamily('recipe.version_approved', 'recipes')).to.equal(true);
    expect(inTrailFamily('recipe.draft_saved', 'signatures')).to.equal(false);
    expect(inTrailFamily('session.signed_in', 'sign-ins')).to.equal(true);
    expect(inTrailFamily('selection_row.updated', 'stock')).to.equal(true);
  });
});
