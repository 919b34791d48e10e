import { expect } from 'chai';
import { isDeadlock, retryOnDeadlock } from '../../../../server/data/retry-deadlock';

describe('retryOnDeadlock', () => {
  const deadlock = () => Object.assign(new Error('Deadlock found when trying to get lock'), { code: 'ER_LOCK_DEADLOCK', errno: 1213 });

  it('runs the work again after a deadlock and returns its answer', async () => {
    let calls = 0;
    const answer = await retryOnDeadlock(async () => {
      calls += 1;
      if (calls < 3) throw deadlock();
      return 'claimed';
    });
    expect(answer).to.equal('claimed');
    expect(calls).to.equal(3);
  });

  it('gives up after the last attempt with the deadlock error', async () => {
    let calls = 0;
    const failing = retryOnDeadlock(async () => {
      calls += 1;
      throw deadlock();
    }, 2);
    await failing.then(
      () => expect.fail('should have thrown'),
      (err: unknown) => expect(isDeadlock(err)).to.equal(true),
    );
    expect(calls).to.equal(2);
  });

  it('does not retry other errors', async () => {
    let calls = 0;
    const failing = retryOnDeadlock(async () => {
      calls += 1;
      throw Object.assign(new Error('Duplicate entry'), { code: 'ER_DUP_ENTRY' });
    });
    await failing.then(
      () => expect.fail('should have thrown'),
      (err: unknown) => expect((err as { code: string }).code).to.equal('ER_DUP_ENTRY'),
    );
    expect(calls).to.equal(1);
  });
});
