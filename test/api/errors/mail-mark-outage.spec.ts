/**
 * A mail the SMTP server took must be marked sent even when MariaDB goes away at that very
 * moment: an unmarked row is sent a second time once its claim runs out (found by
 * `npm run test:soak`). Stops and starts the throw-away MariaDB of `npm test`
 * (KERFBOOK_TEST_MARIADB_DIR / _PORT); pending without it.
 */
import { expect } from 'chai';
import type { Knex } from 'knex';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { enqueueMail } from '../../../server/services/mail/outbox';
import { createMailTransport, deliverDueMails } from '../../../server/services/mail/worker';
import { localMariadb, start, stop, type LocalMariadb } from '../../../server/tools/local-mariadb';
import { testDb } from '../support/test-database';

describe('Mail marked sent across a database outage', function () {
  this.timeout(90_000);
  const dir = process.env['KERFBOOK_TEST_MARIADB_DIR'];
  const port = Number(process.env['KERFBOOK_TEST_MARIADB_PORT'] ?? 0);
  let mariadb: LocalMariadb | null = null;
  let db: Knex;
  let smtp: SMTPServer | null = null;

  before(async function () {
    if (!dir || !port) this.skip();
    mariadb = localMariadb(dir, port);
    db = await testDb();
    await db('mail_outbox').delete();
  });

  after(async () => {
    await new Promise<void>((resolve) => (smtp ? smtp.close(() => resolve()) : resolve()));
    // Whatever happened above, leave MariaDB running for the rest of the suite.
    if (mariadb) await start(mariadb);
  });

  it('keeps trying the mark until MariaDB is back, so the mail goes out once', async () => {
    const now = new Date();
    await db.transaction((trx) =>
      enqueueMail(trx, { to: 'operator@lab.example', subject: 'Sent while the database went away', text: 'Text.', kind: 'test.notice' }, now),
    );

    // An SMTP server that stops MariaDB before it answers "250 accepted", and starts it again 2 s later.
    let accepted = 0;
    smtp = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      logger: false,
      onData(stream, _session, callback) {
        stream.resume();
        stream.on('end', () => {
          accepted += 1;
          void stop(mariadb!).then(() => {
            setTimeout(() => void start(mariadb!), 2000);
            callback();
          });
        });
      },
    });
    await new Promise<void>((resolve) => smtp!.listen(0, '127.0.0.1', () => resolve()));
    const smtpPort = (smtp as unknown as { server: { address(): AddressInfo } }).server.address().port;
    const transport = createMailTransport(`smtp://127.0.0.1:${smtpPort}`, { ignoreTls: true });

    const result = await deliverDueMails(db, transport, now);
    transport.close();

    expect(result).to.deep.equal({ sent: 1, failed: 0 });
    expect(accepted).to.equal(1);
    const rows = await db('mail_outbox').select('sent_at', 'message_id', 'sending_claimed_until');
    expect(rows).to.have.length(1);
    expect(rows[0].sent_at, 'marked sent').not.to.equal(null);
    expect(rows[0].sending_claimed_until, 'claim released').to.equal(null);
  });
});
