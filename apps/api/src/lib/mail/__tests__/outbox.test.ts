import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OutboxMessage } from '../outbox-message.entity';
import { freeLoopbackPort, makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';
import { tcpRelay } from '../../../test-support/tcp-relay';
import { scratchDatabase } from '../../../test-support/scratch-database';

let t: TestApi;
const relay = tcpRelay(Number(process.env.TEST_SMTP_PORT));
let smtpPort = 0;
let scratch: Awaited<ReturnType<typeof scratchDatabase>>;
beforeAll(async () => {
  smtpPort = await freeLoopbackPort();
  scratch = await scratchDatabase();
  // The API is pointed at a port where, for now, nothing listens: the mail server is "down".
  t = await startTestApi({ DATABASE_URL: scratch.url, SMTP_PORT: String(smtpPort), OUTBOX_RETRY_DELAY_SECONDS: '1' });
});
afterAll(async () => { await relay.cut(); await t?.close(); await scratch?.drop(); });

async function until<T>(probe: () => Promise<T | null | undefined | false>, timeoutMs = 20_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const v = await probe();
    if (v) return v;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error('condition not met in time');
}

describe('mail outbox', () => {
  it('when the mail server is down, then the message waits with its error, and is delivered exactly once when it returns', async () => {
    const { users } = await makePeople(t, ['member']);
    const email = users.member!.email;
    expect((await t.http().post('/api/auth/forgot-password').send({ email })).status).toBe(202);
    const repo = t.api.ctx.db.getRepository(OutboxMessage);
    const failed = await until(async () => {
      const row = await repo.findOneBy({ toAddress: email });
      return row && row.attempts >= 1 ? row : null;
    });
    expect(failed.status).toBe('pending');
    expect(failed.lastError).toBeTruthy();

    await relay.open(smtpPort); // the mail server is back
    const sent = await until(async () => {
      const row = await repo.findOneBy({ toAddress: email });
      return row?.status === 'sent' ? row : null;
    }, 30_000);
    expect(sent.attempts).toBeGreaterThanOrEqual(2);
    await new Promise((r) => setTimeout(r, 1500));
    const all = (await (await fetch(`${process.env.TEST_MAILDEV_URL}/api/email`)).json()) as { to: { address: string }[] }[];
    expect(all.filter((m) => m.to.some((x) => x.address === email))).toHaveLength(1);
  });
});
