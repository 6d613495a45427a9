import { AsyncLocalStorage } from 'node:async_hooks';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { AppContext } from '../../../lib/context';
import { authService } from '../auth.service';
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

  it('when the e-mail has no account, then the answer is the same 202 and the worker queues no mail', async () => {
    const r = await t.http().post('/api/auth/forgot-password').send({ email: 'ghost-user@example.test' });
    expect(r.status).toBe(202);
    await authService(t.api.ctx).sendPasswordReset({ email: 'ghost-user@example.test' });
    expect(await t.api.ctx.db.getRepository(OutboxMessage).countBy({ toAddress: 'ghost-user@example.test' })).toBe(0);
  });

  it('when a reset is asked for a known and for an unknown e-mail, then the request does the same work on both paths', async () => {
    const { users } = await makePeople(t, ['member']);
    const ctx = t.api.ctx;
    const known = await workDoneBy(ctx, () => authService(ctx).requestPasswordReset({ email: users.member!.email }));
    const unknown = await workDoneBy(ctx, () => authService(ctx).requestPasswordReset({ email: 'nobody-by-this-name@example.test' }));
    expect(known.length).toBeGreaterThan(0);
    expect(unknown).toEqual(known);
    // The known address still gets its link, off the request path.
    expect(linkToken(await waitForMail(users.member!.email, { subjectIncludes: 'Reset' }))).toMatch(/^[\w-]{40,}$/);
  });

  it('when the new password is too short, then 400 and the token is not spent', async () => {
    const { users } = await makePeople(t, ['member']);
    await t.http().post('/api/auth/forgot-password').send({ email: users.member!.email });
    const token = linkToken(await waitForMail(users.member!.email));
    expect((await t.http().post('/api/auth/reset-password').send({ token, password: 'short' })).status).toBe(400);
    expect((await t.http().post('/api/auth/reset-password').send({ token, password: 'long enough now' })).status).toBe(200);
  });
});

/**
 * What a call does against the database and the job queue, as a list of (operation, shape) entries; only calls made
 * from inside `fn`'s own async chain are listed, so the API's background workers running meanwhile do not count.
 */
async function workDoneBy(ctx: AppContext, fn: () => Promise<unknown>): Promise<string[]> {
  const scope = new AsyncLocalStorage<true>();
  const seen: string[] = [];
  const shape = (v: unknown): string => typeof v === 'function' ? `fn:${v.name}` : typeof v === 'string' ? v.replace(/\s+/g, ' ').slice(0, 80)
    : v && typeof v === 'object' ? `{${Object.keys(v).sort().join(',')}}` : typeof v;
  const targets: [object, string[]][] = [[ctx.db, ['query', 'transaction', 'getRepository', 'createQueryBuilder']], [ctx.outbox, ['enqueue', 'sendJob', 'sendJobs']]];
  const spies = targets.flatMap(([target, names]) => names.map((name) => {
    const original = (target as Record<string, (...a: unknown[]) => unknown>)[name]!;
    return vi.spyOn(target as Record<string, (...a: unknown[]) => unknown>, name).mockImplementation(function (this: unknown, ...args: unknown[]) {
      if (scope.getStore()) seen.push(`${name}(${args.slice(0, 2).map(shape).join(', ')})`);
      return (original as (...a: unknown[]) => unknown).apply(this, args);
    });
  }));
  try {
    await scope.run(true, fn);
  } finally {
    for (const s of spies) s.mockRestore();
  }
  return seen;
}
