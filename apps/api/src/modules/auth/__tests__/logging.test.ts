import { Writable } from 'node:stream';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';

const lines: Record<string, unknown>[] = [];
const sink = new Writable({ write(chunk, _enc, done) { for (const l of String(chunk).split('\n')) if (l.trim()) lines.push(JSON.parse(l)); done(); } });

let t: TestApi;
beforeAll(async () => { t = await startTestApi({ LOG_LEVEL: 'info' }, { logDestination: sink }); });
afterAll(async () => { await t?.close(); });

describe('structured logs', () => {
  it('when people sign in, fail to, and use a reset link, then every request line has a request id and no secret', async () => {
    const { users, password } = await makePeople(t, ['member']);
    await t.http().post('/api/auth/login').send({ email: users.member!.email, password });
    await t.http().post('/api/auth/login').send({ email: users.member!.email, password: 'wrong-secret-value' });
    const signedIn = await t.signIn(users.member!.email);
    await signedIn.get('/api/auth/me');
    await t.http().get('/api/auth/invitations/some-made-up-token-value-123456');
    await new Promise((r) => setTimeout(r, 100));
    const requestLines = lines.filter((l) => l.req || l.reqId);
    expect(requestLines.length).toBeGreaterThanOrEqual(5);
    for (const l of requestLines) expect(l.reqId ?? (l.req as { id?: string }).id).toMatch(/^[\w-]{8,}$/);
    const all = JSON.stringify(lines);
    expect(all).not.toContain(password);
    expect(all).not.toContain('wrong-secret-value');
    expect(all).not.toContain('some-made-up-token-value-123456');
    expect(all).not.toMatch(/femtoslot_session=[A-Za-z0-9]/);
  });
});
