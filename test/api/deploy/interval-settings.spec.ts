/** The job intervals each app process reads from its environment (README, settings). */
import { expect } from 'chai';
import { readConfig } from '../../../server/config';

const base = { DATABASE_URL: 'mysql://u:p@127.0.0.1:3306/db', SESSION_SECRET: 'x'.repeat(32) };

describe('Job interval settings', () => {
  it('reads SUPERSESSION_INTERVAL_MS, REVIEW_REMINDER_INTERVAL_MS and MAIL_INTERVAL_MS, and leaves them unset by default', () => {
    expect(readConfig({ ...base, SUPERSESSION_INTERVAL_MS: '250', REVIEW_REMINDER_INTERVAL_MS: '100', MAIL_INTERVAL_MS: '500' })).to.include({
      supersessionIntervalMs: 250,
      reviewReminderIntervalMs: 100,
      mailIntervalMs: 500,
    });
    const config = readConfig(base);
    expect(config).not.to.have.any.keys('supersessionIntervalMs', 'reviewReminderIntervalMs', 'mailIntervalMs');
  });

  it('refuses less than 100 ms or anything but a whole number, naming the variable', () => {
    for (const name of ['SUPERSESSION_INTERVAL_MS', 'REVIEW_REMINDER_INTERVAL_MS']) {
      for (const value of ['99', '0', '-500', '1.5', 'soon']) {
        expect(() => readConfig({ ...base, [name]: value }), `${name}=${value}`).to.throw(`${name} must be a whole number of milliseconds, at least 100.`);
      }
    }
  });
});
