import { expect } from 'chai';
import { addDays, addMonths, dayOf, isCalendarDay, utcDay } from '../../../shared/calendar-dates';

describe('calendar days (UTC)', () => {
  it('takes the UTC day of an instant, whatever the local zone', () => {
    expect(utcDay(new Date('2026-12-31T23:30:00-02:00'))).to.equal('2027-01-01');
    expect(dayOf(new Date('2026-03-05T00:00:00Z'))).to.equal('2026-03-05');
    expect(dayOf(null)).to.equal(null);
  });

  it('adds months, ending on the last day of a shorter month', () => {
    expect(addMonths('2026-12-16', 24)).to.equal('2028-12-16');
    expect(addMonths('2026-08-31', 6)).to.equal('2027-02-28');
    expect(addMonths('2027-08-31', 6)).to.equal('2028-02-29'); // 2028 is a leap year
    expect(addMonths('2028-02-29', 12)).to.equal('2029-02-28');
    expect(addMonths('2026-01-15', -1)).to.equal('2025-12-15');
  });

  it('adds days across months and years', () => {
    expect(addDays('2026-12-31', 1)).to.equal('2027-01-01');
    expect(addDays('2026-03-01', -1)).to.equal('2026-02-28');
  });

  it('accepts only real calendar days', () => {
    expect(isCalendarDay('2028-02-29')).to.equal(true);
    expect(isCalendarDay('2027-02-29')).to.equal(false);
    expect(isCalendarDay('2027-13-01')).to.equal(false);
    expect(isCalendarDay('27-01-01')).to.equal(false);
  });
});
