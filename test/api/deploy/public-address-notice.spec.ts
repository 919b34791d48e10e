/**
 * Listening beyond loopback without APP_BASE_URL: the admin's Today carries the start-up
 * warning (mail links and printed QR codes would point at an address nobody can open);
 * other roles do not see it, and nobody does once APP_BASE_URL is set.
 */
import { expect } from 'chai';
import type { TodayDto } from '../../../shared/recipe-types';
import { apiTestContext } from '../support/hooks';
import { sessionFor } from '../workflow/workflow-support';

describe('Start-up warning on the admin’s Today', () => {
  describe('listening on every address, APP_BASE_URL unset', () => {
    const ctx = apiTestContext({ host: '0.0.0.0' });

    it('is among the admin’s notices, and not among an author’s', async () => {
      const admin = await sessionFor(ctx.app, ctx.db, ['admin'], 'Ada Admin');
      const author = await sessionFor(ctx.app, ctx.db, ['author'], 'Ines Author');
      const forAdmin = (await admin.agent.get('/api/today').expect(200)).body as TodayDto;
      expect(forAdmin.notices).to.have.length(1);
      expect(forAdmin.notices[0]).to.include('APP_BASE_URL is not set').and.include('listens on 0.0.0.0');
      const forAuthor = (await author.agent.get('/api/today').expect(200)).body as TodayDto;
      expect(forAuthor.notices).to.deep.equal([]);
    });
  });

  describe('with APP_BASE_URL set', () => {
    const ctx = apiTestContext({ host: '0.0.0.0', appBaseUrl: 'https://kerfbook.lab.example' });

    it('is not shown', async () => {
      const admin = await sessionFor(ctx.app, ctx.db, ['admin'], 'Ada Admin');
      expect(((await admin.agent.get('/api/today').expect(200)).body as TodayDto).notices).to.deep.equal([]);
    });
  });
});
