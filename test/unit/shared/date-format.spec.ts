import { expect } from 'chai';
import { formatDate, formatDateTime } from '../../../shared/date-format';

describe('dates in the lab format', () => {
  it('writes 5 December 2026 in each format (ISO 8601 year-month-day, day first, month first)', () => {
    expect(formatDate('2026-12-05', 'iso')).to.equal('2026-12-05');
    expect(formatDate('2026-12-05', 'dmy-dot')).to.equal('05.12.2026');
    expect(formatDate('2026-12-05', 'dmy-slash')).to.equal('05/12/2026');
    expect(formatDate('2026-12-05', 'mdy-slash')).to.equal('12/05/2026');
  });

  it('takes the UTC day of an instant, whatever its offset', () => {
    expect(formatDate('2026-12-31T23:30:00-02:00', 'dmy-dot')).to.equal('01.01.2027');
    expect(formatDate(new Date(Date.UTC(2026, 0, 9, 23, 59)), 'iso')).to.equal('2026-01-09');
  });

  it('adds the UTC time and says so', () => {
    expect(formatDateTime('2026-12-05T14:05:59.900Z', 'mdy-slash')).to.equal('12/05/2026 14:05 UTC');
  });

  it('gives nothing for nothing, or for a value that is not a date', () => {
    expect(formatDate(null, 'iso')).to.equal('');
    expect(formatDate('', 'iso')).to.equal('');
    expect(formatDate('not a date', 'iso')).to.equal('');
    expect(formatDateTime(undefined, 'iso')).to.equal('');
  });
});
