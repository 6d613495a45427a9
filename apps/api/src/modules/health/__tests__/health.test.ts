import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApi, type TestApi } from '../../../test-support/test-api';
import { tcpRelay } from '../../../test-support/tcp-relay';

let t: TestApi;
const r = tcpRelay(Number(new URL(process.env.TEST_DATABASE_URL ?? 'postgres://x@127.0.0.1:5432/x').port));
beforeAll(async () => {
  const port = await r.open();
  const url = new URL(process.env.TEST_DATABASE_URL!);
  url.port = String(port);
  t = await startTestApi({ DATABASE_URL: url.toString() });
});
afterAll(async () => { await t?.close().catch(() => undefined); });

describe('health', () => {
  it('when the database answers, then 200 {status:"ok", db:"ok"}', async () => {
    const res = await t.http().get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', db: 'ok' });
  });

  it('when the database is unreachable, then 503 with db:"down", and it recovers without a restart', async () => {
    await r.cut();
    const down = await t.http().get('/api/health');
    expect(down.status).toBe(503);
    expect(down.body.db).toBe('down');
    await r.open();
    let status = 0;
    for (let i = 0; i < 20 && status !== 200; i++) {
      status = (await t.http().get('/api/health')).status;
      if (status !== 200) await new Promise((res) => setTimeout(res, 250));
    }
    expect(status).toBe(200);
  });

  it('when a route does not exist, then 404 in the error shape', async () => {
    const res = await t.http().get('/api/no-such-route');
    expect(res.status).toBe(404);
    expect(res.body.error).toMatchObject({ code: 'not_found' });
  });

  it('when any response is sent, then the security headers and a request id are present', async () => {
    const res = await t.http().get('/api/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['x-request-id']).toMatch(/^[\w-]{8,}$/);
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});
