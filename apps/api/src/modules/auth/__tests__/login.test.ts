import { randomUUID } from 'node:crypto';
import jwt from 'jsonwebtoken';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { User } from '../../users/user.entity';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

describe('sign-in', () => {
  it('when the password is right, then 200 with the user and an httpOnly SameSite=Lax session cookie', async () => {
    const { users, password } = await makePeople(t, ['member']);
    const r = await t.http().post('/api/auth/login').send({ email: users.member!.email.toUpperCase(), password });
    expect(r.status).toBe(200);
    expect(r.body.user).toMatchObject({ email: users.member!.email, role: 'member', invitationPending: false });
    expect(r.body.user.passwordHash).toBeUndefined();
    const cookie = String(r.headers['set-cookie']);
    expect(cookie).toMatch(/femtoslot_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).toMatch(/Max-Age=\d+/);
  });

  it('when the password is wrong or the e-mail unknown, then 401 with one generic message', async () => {
    const { users } = await makePeople(t, ['member']);
    const wrong = await t.http().post('/api/auth/login').send({ email: users.member!.email, password: 'not the password' });
    const unknown = await t.http().post('/api/auth/login').send({ email: 'nobody-here@example.test', password: 'whatever' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error.code).toBe('invalid_credentials');
    expect(unknown.body.error).toEqual(wrong.body.error);
    expect(wrong.headers['set-cookie']).toBeUndefined();
  });

  it('when the body is malformed, then 400 validation_failed with the zod issues per field', async () => {
    const r = await t.http().post('/api/auth/login').send({ email: 'not-an-email', password: 42 });
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('validation_failed');
    const paths = r.body.error.details.map((d: { path: string[] }) => d.path.join('.'));
    expect(paths).toEqual(expect.arrayContaining(['email', 'password']));
  });

  it('when the body is not JSON, then 400 invalid_json', async () => {
    const r = await t.http().post('/api/auth/login').set('Content-Type', 'application/json').send('{"email":');
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('invalid_json');
  });

  it('when signed in, then me returns the user; after logout, me is 401', async () => {
    const { users } = await makePeople(t, ['staff']);
    const agent = await t.signIn(users.staff!.email);
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.role).toBe('staff');
    const out = await agent.post('/api/auth/logout');
    expect(out.status).toBe(204);
    expect(String(out.headers['set-cookie'])).toMatch(/femtoslot_session=;/);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
  });

  it('when a user is deactivated, then their existing session stops working and they cannot sign in', async () => {
    const { users, password } = await makePeople(t, ['member']);
    const agent = await t.signIn(users.member!.email);
    await t.api.ctx.db.getRepository(User).update({ id: users.member!.id }, { active: false });
    expect((await agent.get('/api/auth/me')).status).toBe(401);
    const r = await t.http().post('/api/auth/login').send({ email: users.member!.email, password });
    expect(r.status).toBe(401);
  });

  it('when the session token is tampered with, expired, or unsigned (alg none), then 401', async () => {
    const { users } = await makePeople(t, ['member']);
    const secret = t.api.ctx.env.JWT_SECRET;
    const expired = jwt.sign({}, secret, { subject: users.member!.id, expiresIn: -10, issuer: 'femtoslot' });
    const forged = jwt.sign({}, 'a different secret of enough length!!', { subject: users.member!.id, issuer: 'femtoslot' });
    const none = jwt.sign({}, '', { subject: users.member!.id, issuer: 'femtoslot', algorithm: 'none' });
    const good = jwt.sign({}, secret, { subject: users.member!.id, expiresIn: 60, issuer: 'femtoslot', jwtid: randomUUID() });
    // A session that cannot be named cannot be signed out: a token without an id (jti) is not honoured.
    const unnamed = jwt.sign({}, secret, { subject: users.member!.id, expiresIn: 60, issuer: 'femtoslot' });
    expect((await t.http().get('/api/auth/me').set('Cookie', `femtoslot_session=${unnamed}`)).status).toBe(401);
    for (const token of [expired, forged, none, `${good.slice(0, -3)}abc`]) {
      const r = await t.http().get('/api/auth/me').set('Cookie', `femtoslot_session=${token}`);
      expect(r.status).toBe(401);
    }
    expect((await t.http().get('/api/auth/me').set('Cookie', `femtoslot_session=${good}`)).status).toBe(200);
  });
});

describe('sign-out', () => {
  const sessionCookie = (res: { headers: Record<string, unknown> }) =>
    ([] as string[]).concat((res.headers['set-cookie'] as string[] | string | undefined) ?? []).map((c) => c.split(';')[0]!).find((c) => c.startsWith('femtoslot_session='))!;

  it('when the cookie value from before a logout is replayed, then it is refused with 401 on a read and on a write', async () => {
    const { users, password } = await makePeople(t, ['staff']);
    const login = await t.http().post('/api/auth/login').send({ email: users.staff!.email, password });
    const stolen = sessionCookie(login);
    expect((await t.http().get('/api/auth/me').set('Cookie', stolen)).status).toBe(200);

    const out = await t.http().post('/api/auth/logout').set('Cookie', stolen);
    expect(out.status).toBe(204);

    const read = await t.http().get('/api/auth/me').set('Cookie', stolen);
    expect(read.status).toBe(401);
    expect(read.body.error.code).toBe('unauthenticated');
    const write = await t.http().post('/api/maintenance').set('Cookie', stolen)
      .send({ instrumentId: randomUUID(), startsAt: '2031-01-01T09:00:00Z', endsAt: '2031-01-01T10:00:00Z', reason: 'replayed cookie' });
    expect(write.status).toBe(401);
  });

  it('when one of two sessions signs out, then only that session ends: the other device stays signed in', async () => {
    const { users } = await makePeople(t, ['member']);
    const laptop = await t.signIn(users.member!.email);
    const phone = await t.signIn(users.member!.email);
    expect((await laptop.post('/api/auth/logout')).status).toBe(204);
    expect((await laptop.get('/api/auth/me')).status).toBe(401);
    expect((await phone.get('/api/auth/me')).status).toBe(200);
  });

  it('when a signed-out session is recorded, then its row expires with the token and expired rows are cleared on later sign-outs', async () => {
    const { users, password } = await makePeople(t, ['member']);
    const login = await t.http().post('/api/auth/login').send({ email: users.member!.email, password });
    const cookie = sessionCookie(login);
    const claims = jwt.decode(cookie.slice('femtoslot_session='.length)) as { jti: string; exp: number };
    await t.http().post('/api/auth/logout').set('Cookie', cookie);
    const [row] = await t.api.ctx.db.query(`SELECT user_id, extract(epoch FROM expires_at)::bigint AS exp FROM revoked_sessions WHERE jti = $1`, [claims.jti]);
    expect(row).toEqual({ user_id: users.member!.id, exp: String(claims.exp) });

    const stale = randomUUID();
    await t.api.ctx.db.query(`INSERT INTO revoked_sessions (jti, user_id, expires_at) VALUES ($1, $2, now() - interval '1 minute')`, [stale, users.member!.id]);
    const again = await t.signIn(users.member!.email);
    await again.post('/api/auth/logout');
    expect(await t.api.ctx.db.query(`SELECT 1 FROM revoked_sessions WHERE jti = $1`, [stale])).toEqual([]);
  });
});

describe('sign-in rate limit', () => {
  let limited: TestApi;
  beforeAll(async () => { limited = await startTestApi({ LOGIN_RATE_LIMIT: '3' }); });
  afterAll(async () => { await limited?.close(); });

  it('when one address tries too often, then 429 rate_limited, even with the right password', async () => {
    const { users, password } = await makePeople(limited, ['member']);
    const statuses: number[] = [];
    for (let i = 0; i < 3; i++) statuses.push((await limited.http().post('/api/auth/login').send({ email: users.member!.email, password: 'wrong one' })).status);
    const blocked = await limited.http().post('/api/auth/login').send({ email: users.member!.email, password });
    expect(statuses).toEqual([401, 401, 401]);
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('rate_limited');
  });
});
