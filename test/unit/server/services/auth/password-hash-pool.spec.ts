/**
 * A burst of sign-ins must not hold every other answer back: scrypt and the gzip of
 * compressed answers share libuv's thread pool, so password hashes take only part of it
 * (found by the soak run, `npm run test:soak`: 200 sign-ins at a shift start held plain
 * library reads for up to 30 s).
 */
import { gzip } from 'node:zlib';
import { expect } from 'chai';
import { hashPassword, verifyPassword } from '../../../../../server/services/auth/passwords';

describe('password hashing under a burst', function () {
  this.timeout(60_000);

  it('leaves the thread pool to gzip while a dozen hashes wait, and every hash still verifies', async () => {
    const order: string[] = [];
    const hashes = Array.from({ length: 12 }, (_, i) =>
      hashPassword(`burst password ${i}`).then((h) => {
        order.push('hash');
        return h;
      }),
    );
    await new Promise<void>((resolve, reject) =>
      gzip(Buffer.alloc(50_000, 'k'), (err) => {
        if (err) return reject(err);
        order.push('gzip');
        resolve();
      }),
    );
    const done = await Promise.all(hashes);
    // Without the limit the gzip waits behind all twelve (4 pool threads); with it, behind two or three at most.
    expect(order.indexOf('gzip'), order.join(' ')).to.be.below(4);
    for (const [i, h] of done.entries()) expect(await verifyPassword(`burst password ${i}`, h)).to.equal(true);
  });
});
