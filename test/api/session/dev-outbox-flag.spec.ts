/** SessionDto.devOutbox: false on a production server, whose outbox route answers 404 (the app's own setting, not the environment of the test run). */
import { expect } from 'chai';
import { CSRF_HEADER } from '../../../shared/api-types';
import { apiTestContext } from '../support/hooks';
import { createPerson } from '../support/people';
import { anonymousAgent } from '../support/test-app';

describe('Session: development outbox flag on a production server', () => {
  const ctx = apiTestContext({ production: true, trustProxy: 'loopback' });

  // Secure cookies in production: the request says it came through an HTTPS proxy.
  it('answers devOutbox false', async () => {
    const person = await createPerson(ctx.db, { roles: ['author'] });
    const { agent, csrf } = await anonymousAgent(ctx.app);
    const res = await agent
      .post('/api/session')
      .set('X-Forwarded-Proto', 'https')
      .set(CSRF_HEADER, csrf)
      .send({ username: person.username, password: person.password });
    expect(res.status, JSON.stringify(res.body)).to.equal(200);
    expect(res.body.devOutbox).to.equal(false);
  });

  it('answers 404 on the outbox route, as if it did not exist', async () => {
    const admin = await createPerson(ctx.db, { roles: ['admin'] });
    const { agent, csrf } = await anonymousAgent(ctx.app);
    const signIn = await agent
      .post('/api/session')
      .set('X-Forwarded-Proto', 'https')
      .set(CSRF_HEADER, csrf)
      .send({ username: admin.username, password: admin.password })
      .expect(200);
    // The session cookie is Secure: a client only sends it back over HTTPS, which the proxy header stands for here.
    const cookies = ([] as string[]).concat(signIn.headers['set-cookie'] ?? []).map((c) => c.split(';')[0]);
    const res = await agent.get('/api/dev/outbox').set('X-Forwarded-Proto', 'https').set('Cookie', cookies.join('; ')).expect(404);
    expect(res.body.code).to.equal('NOT_FOUND');
  });
});
