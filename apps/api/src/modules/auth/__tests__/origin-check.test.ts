import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi({ APP_URL: 'http://femtoslot.example.test' }); });
afterAll(async () => { await t?.close(); });

describe('cross-site request forgery guard', () => {
  it('when a state-changing request comes from another origin, then 403 cross_site_request', async () => {
    const { users } = await makePeople(t, ['admin']);
    const agent = await t.signIn(users.admin!.email);
    const r = await agent.post('/api/auth/logout').set('Origin', 'https://evil.example');
    expect(r.status).toBe(403);
    expect(r.body.error.code).toBe('cross_site_request');
    const byReferer = await agent.patch(`/api/users/${users.admin!.id}`).set('Referer', 'https://evil.example/page').send({ active: true });
    expect(byReferer.status).toBe(403);
  });

  it("when it comes from the app's own origin, then it goes through", async () => {
    const { users, password } = await makePeople(t, ['member']);
    const r = await t.http().post('/api/auth/login').set('Origin', 'http://femtoslot.example.test').send({ email: users.member!.email, password });
    expect(r.status).toBe(200);
  });

  it('when a read comes from another origin, then it is not refused by the guard', async () => {
    const r = await t.http().get('/api/health').set('Origin', 'https://evil.example');
    expect(r.status).toBe(200);
  });
});
