import { expect } from 'chai';
import { isDatabaseUnavailable } from '../../../../server/web/error-handler';

function withCode(code: string, extra: Record<string, unknown> = {}): Error {
  return Object.assign(new Error('x'), { code, ...extra });
}

describe('isDatabaseUnavailable', () => {
  it('recognises connection failures and pool time-outs', () => {
    for (const code of ['ECONNREFUSED', 'PROTOCOL_CONNECTION_LOST', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'ER_SERVER_SHUTDOWN', 'ER_CON_COUNT_ERROR']) {
      expect(isDatabaseUnavailable(withCode(code)), code).to.equal(true);
    }
    const timeout = Object.assign(new Error('Knex: Timeout acquiring a connection.'), { name: 'KnexTimeoutError' });
    expect(isDatabaseUnavailable(timeout)).to.equal(true);
    expect(isDatabaseUnavailable(withCode('SOMETHING', { fatal: true }))).to.equal(true);
    expect(isDatabaseUnavailable(new Error('wrapped', { cause: withCode('ECONNREFUSED') }))).to.equal(true);
  });

  it('does not mistake query errors and ordinary faults for an outage', () => {
    for (const err of [
      withCode('ER_NO_SUCH_TABLE'),
      withCode('ER_DUP_ENTRY'),
      withCode('ER_PARSE_ERROR', { fatal: false }),
      new TypeError('x'),
      null,
      undefined,
      'ECONNREFUSED',
    ]) {
      expect(isDatabaseUnavailable(err), String(err)).to.equal(false);
    }
  });
});
