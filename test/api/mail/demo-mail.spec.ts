/**
 * The demo scenario's mail side, loaded as `npm start` loads it: the operator runs the two
 * bay saws, was asked to acknowledge each version that came into use on them, has
 * acknowledged all but the newest, and his Today shows that one.
 */
import { expect } from 'chai';
import { mkdtempSync } from 'node:fs';
import os from 'node:os';
import { join } from 'node:path';
import { NOTIFICATION_KINDS } from '../../../shared/notification-kinds';
import type { MailRow } from '../../../server/data/mail-outbox';
import { createMailTransport, deliverDueMails } from '../../../server/services/mail/worker';
import { inspectLink, requestPasswordReset } from '../../../server/services/auth/password-links';
import { sendReviewReminders } from '../../../server/services/mail/review-reminders';
import { getToday } from '../../../server/services/operator/today';
import { inviteUser } from '../../../server/services/people/users';
import { seedDemoIfEmpty } from '../../../server/tools/db-setup';
import { startMailCatcher } from '../../../server/tools/mail-catcher';
import { DEMO_ACCOUNTS } from '../../../seeds/data/demo-accounts';
import { apiTestContext } from '../support/hooks';
import { reportIntegrityFailure } from '../../../server/services/recipes/integrity-alert';
import { sealTrail } from '../../../server/services/trail/seals';

const BASE = 'https://kerfbook.harrowgate.example';
const MAIL = { baseUrl: BASE };

describe('Demo seeds: machines, acknowledgements and the mail they caused', () => {
  const ctx = apiTestContext();
  const operator = DEMO_ACCOUNTS.find((a) => a.roles.includes('operator'))!;
  let operatorId: number;

  before(async function () {
    this.timeout(60000);
    expect(await seedDemoIfEmpty(ctx.db)).to.equal(true);
    operatorId = ((await ctx.db('users').where({ username: operator.username }).first('id')) as { id: number }).id;
  });

  it('assigns the demo operator to the two bay saws', async () => {
    const names = (await ctx
      .db('user_machines as um')
      .join('machines as m', 'm.id', 'um.machine_id')
      .where('um.user_id', operatorId)
      .orderBy('m.name')
      .pluck('m.name')) as string[];
    expect(names).to.deep.equal([...operator.machines!].sort());
  });

  it('asked him to acknowledge each version that came into use on them, in the outbox', async () => {
    const mails = (await ctx.db('mail_outbox').where({ to_address: operator.email, kind: 'version-current' }).pluck('subject')) as string[];
    // C45, 6082 and brass approved; 42CrMo4 v1 and v2; the X153 block (the circuit board and alumina run on the precision saw).
    expect(mails.length).to.be.at.least(5);
    expect(mails.some((s) => s.includes('KB-0002'))).to.equal(true);
  });

  it('leaves only the newest version on his saws to acknowledge, on his Today', async () => {
    const today = await getToday(ctx.db, { id: operatorId, roles: operator.roles });
    expect(today.toAcknowledge.map((r) => r.title)).to.deep.equal(['42CrMo4 quenched and tempered bar, large diameters']);
    const events = await ctx.db('trail_events').where({ event_type: 'recipe.version_acknowledged', actor_user_id: operatorId }).count({ n: '*' }).first();
    expect(Number(events!.n)).to.be.at.least(4);
  });

  it('delivers every kind of mail through SMTP to the catcher, each with both parts and a link that leads somewhere real', async function () {
    this.timeout(60000);
    // The kinds the demo history does not cause itself: a review-due round, an invitation, a reset.
    const admin = DEMO_ACCOUNTS.find((a) => a.roles.includes('admin'))!;
    const adminRow = (await ctx.db('users').where({ username: admin.username }).first('id', 'display_name')) as { id: number; display_name: string };
    const actor = { userId: adminRow.id, name: adminRow.display_name, clientAddress: '127.0.0.1' };
    expect((await sendReviewReminders(ctx.db, new Date(), MAIL)).mails).to.be.greaterThan(0);
    await inviteUser(ctx.db, actor, MAIL, {
      username: 'new.starter',
      displayName: 'Ada Newstart',
      email: 'ada.newstart@harrowgate.example',
      roles: ['operator'],
      machineIds: [],
    });
    await requestPasswordReset(ctx.db, actor, MAIL, operator.email);
    // An integrity finding, reported as a read that saw one would (the demo's content is intact).
    const demo = (await ctx
      .db('recipe_versions as v')
      .join('recipes as r', 'r.id', 'v.recipe_id')
      .where('v.status', 'approved')
      .first('r.id', 'r.number', 'v.version', 'v.title')) as {
      id: number;
      number: string;
      version: number;
      title: string;
    };
    await reportIntegrityFailure(
      ctx.db,
      MAIL,
      { recipeId: demo.id, number: demo.number, version: demo.version, title: demo.title },
      { ok: false, problems: ['A finding made up for this delivery test.'] },
    );

    // A seal of the trail's chain head, mailed to the demo auditor.
    const sealDir = mkdtempSync(join(os.tmpdir(), 'kerfbook-demo-seals-'));
    expect(await sealTrail(ctx.db, { dir: sealDir, mail: MAIL }, 'interval')).to.not.equal(null);

    const queued = (await ctx.db<MailRow>('mail_outbox').whereNull('sent_at').orderBy('id')) as MailRow[];
    const kinds = new Set(queued.map((m) => m.kind));
    for (const kind of [...NOTIFICATION_KINDS, 'invitation', 'password-reset']) expect(kinds, kind).to.include(kind);

    const catcher = await startMailCatcher(0, { dir: null });
    const transport = createMailTransport(`smtp://127.0.0.1:${catcher.port}`, { ignoreTls: true });
    try {
      const result = await deliverDueMails(ctx.db, transport, new Date(Date.now() + 1000));
      expect(result).to.deep.equal({ sent: queued.length, failed: 0 });
      const caught = catcher.messages();
      expect(caught).to.have.length(queued.length);
      for (const row of queued) {
        const mail = caught.find((m) => m.subject === row.subject && m.to.includes(row.to_address));
        expect(mail, `${row.kind} to ${row.to_address}: ${row.subject}`).to.exist;
        expect(mail!.html, 'HTML part').to.be.a('string').and.not.equal('');
        // Mails of the demo history link to the default address (seeds run without settings).
        const link = /https?:\/\/[^/\s]+(\/\S*)/.exec(mail!.text)?.[1];
        expect(link, `link in ${row.kind}`).to.be.a('string');
        await expectLinkLeadsSomewhere(link!, row.kind);
      }
    } finally {
      transport.close();
      await catcher.stop();
    }
  });

  /** The app path of a mail's first link names a real recipe and version, or a live single-use link. */
  async function expectLinkLeadsSomewhere(path: string, kind: string): Promise<void> {
    const token = /^\/set-password\?token=([A-Za-z0-9_-]{43})$/.exec(path);
    if (token) {
      expect(['invitation', 'password-reset']).to.include(kind);
      expect((await inspectLink(ctx.db, token[1]!)).purpose).to.equal(kind);
      return;
    }
    if (kind === 'trail-sealed') {
      expect(path).to.equal('/trail');
      return;
    }
    const recipe = /^\/recipes\/(\d+)(?:\/(review|edit)|\/acknowledge\?v=(\d+)|\?v=(\d+)(?:&tab=cuts)?)$/.exec(path);
    expect(recipe, `${kind} links to ${path}`).to.not.equal(null);
    const [, id, screen, ackVersion, viewVersion] = recipe!;
    const version = ackVersion ?? viewVersion;
    const row = await ctx
      .db('recipe_versions')
      .where({ recipe_id: Number(id), ...(version ? { version: Number(version) } : {}) })
      .first('id', 'status');
    expect(row, path).to.exist;
    if (kind === 'version-current') expect(ackVersion, path).to.be.a('string');
    if (screen === 'review') expect(kind).to.equal('review-requested');
  }
});
