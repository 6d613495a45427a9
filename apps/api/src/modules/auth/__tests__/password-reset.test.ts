import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { linkToken, waitForMail } from '../../../test-support/maildev';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';
import { OutboxMessage } from '../../../lib/mail/outbox-message.entity';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

describe('password reset by e-mail', () => {
  it('when a user asks for a reset, then the mailed link sets a new password once and the old one stops working', async () => {
    const { users, password } = await makePeople(t, ['collaborator']);
    const email = users.collaborator!.email;
    const asked = await t.http().post('/api/auth/forgot-password').send({ email });
    expect(asked.status).toBe(202);
    const mail = await waitForMail(email, { subjectIncludes: 'Reset' });
    expect(mail.text).toContain('/reset-password?token=');
    const token = linkToken(mail);

    const reset = await t.http().post('/api/auth/reset-password').send({ token, password: 'brand new passphrase' });
    expect(reset.status).toBe(200);
    expect((await t.http().post('/api/auth/login').send({ email, password })).status).toBe(401);
    expect((await t.http().post('/api/auth/login').send({ email, password: 'brand new passphrase' })).status).toBe(200);
    const reuse = await t.http().post('/api/auth/reset-password').send({ token, password: 'third passphrase!!' });
    expect(reuse.status).toBe(400);
    expect(reuse.body.error.code).toBe('invalid_token');

    const row = await t.api.ctx.db.getRepository(OutboxMessage).findOneByOrFail({ toAddress: email, template: 'password_reset' });
    expect(row.status).toBe('sent');
    expect(row.sentAt).not.toBeNull();
  });

  it('when the password is reset, then every session signed in before it ends and a fresh sign-in works', async () => {
    const { users, password } = await makePeople(t, ['member']);
    const email = users.member!.email;
    const before = await t.signIn(email, password);
    expect((await before.get('/api/auth/me')).status).toBe(200);
    await t.http().post('/api/auth/forgot-password').send({ email });
    const token = linkToken(await waitForMail(email, { subjectIncludes: 'Reset' }));
    const reset = await t.http().post('/api/auth/reset-password').send({ token, password: 'a fresh passphrase' });
    expect(reset.status).toBe(200);

    // The cookie from before the reset is still a validly signed, unexpired token: only the epoch ends it.
    expect((await before.get('/api/auth/me')).status).toBe(401);
    const after = await t.signIn(email, 'a fresh passphrase');
    expect((await after.get('/api/auth/me')).status).toBe(200);
    // The reset answer signs the user in too, with the new epoch.
    const cookie = String(reset.headers['set-cookie']).split(';')[0]!;
    expect((await t.http().get('/api/auth/me').set('cookie', cookie)).status).toBe(200);
  });

  it('when the e-mail has no account, then the answer is the same 202 and no mail is queued', async () => {
    const r = await t.http().post('/api/auth/forgot-password').send({ email: 'ghost-user@example.test' });
    expect(r.status).toBe(202);
    expect(await t.api.ctx.db.getRepository(OutboxMessage).countBy({ toAddress: 'ghost-user@example.test' })).toBe(0);
  });

  it('when the new password is too short, then 400 and the token is not spent', async () => {
    const { users } = await makePeople(t, ['member']);
    await t.http().post('/api/auth/forgot-password').send({ email: users.member!.email });
    const token = linkToken(await waitForMail(users.member!.email));
    expect((await t.http().post('/api/auth/reset-password').send({ token, password: 'short' })).status).toBe(400);
    expect((await t.http().post('/api/auth/reset-password').send({ token, password: 'long enough now' })).status).toBe(200);
  });
});
