import { In } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OutboxMessage } from '@femtoslot/api/src/lib/mail/outbox-message.entity';
import { scratchDatabase } from '@femtoslot/api/src/test-support/scratch-database';
import { tcpRelay } from '@femtoslot/api/src/test-support/tcp-relay';
import { freeLoopbackPort, makePeople, startTestApi, type TestApi } from '@femtoslot/api/src/test-support/test-api';
import { until } from './support/api-process';

let t: TestApi;
let scratch: Awaited<ReturnType<typeof scratchDatabase>>;
const relay = tcpRelay(Number(process.env.TEST_SMTP_PORT));
let smtpPort = 0;
beforeAll(async () => {
  smtpPort = await freeLoopbackPort();
  scratch = await scratchDatabase();
  // SMTP goes through a relay port where, for now, nothing listens: the mail server is down.
  t = await startTestApi({ DATABASE_URL: scratch.url, SMTP_PORT: String(smtpPort), OUTBOX_RETRY_DELAY_SECONDS: '1' });
}, 60_000);
afterAll(async () => { await relay.cut(); await t?.close(); await scratch?.drop(); });

// `npm run test:soak` sends ten times as many.
const N = process.env.FEMTOSLOT_SOAK === '1' ? 200 : 20;

describe('mail outbox through a mail-server outage', () => {
  it(`when ${N} invitations are sent while the mail server is down and it then returns, then every invitee gets exactly one mail`, async () => {
    const { org, users } = await makePeople(t, ['admin']);
    const admin = await t.signIn(users.admin!.email);
    const tag = org.id.slice(0, 8);
    const emails = Array.from({ length: N }, (_, i) => `invitee${i}.${tag}@example.test`);
    const started = Date.now();
    for (const [i, email] of emails.entries()) {
      const r = await admin.post('/api/users/invitations').send({ email, name: `Invitee ${i}`, role: 'member', organisationId: org.id });
      expect(r.status, JSON.stringify(r.body)).toBe(201);
    }
    const repo = t.api.ctx.db.getRepository(OutboxMessage);
    const rows = () => repo.findBy({ toAddress: In(emails) });

    // An outage of a few seconds: a good part of the messages tried and failed, each still pending with the SMTP error.
    // (Not every one: the worker takes ten jobs per poll, and retries of the oldest messages come first, so with the
    // soak's 200 the newest wait their turn; see docs/reliability.md.)
    let last: OutboxMessage[] = [];
    await until(async () => {
      last = await rows();
      return last.length === N && last.filter((m) => m.attempts >= 1).length >= Math.min(N / 2, 10) && Date.now() - started > 4000;
    }, 30_000, 'failed attempts for half the messages (ten at most)').catch((err: Error) => {
      throw new Error(`${err.message}: ${JSON.stringify(last.map((m) => [m.status, m.attempts, m.lastError]))}`);
    });
    const failed = await rows();
    expect(failed.every((m) => m.status === 'pending')).toBe(true);
    expect(failed.filter((m) => m.attempts >= 1).every((m) => m.lastError?.includes('ECONNREFUSED'))).toBe(true);
    const outageMs = Date.now() - started;
    const attemptsDuringOutage = failed.reduce((s, m) => s + m.attempts, 0);
    const triedDuringOutage = failed.filter((m) => m.attempts >= 1).length;

    await relay.open(smtpPort); // the mail server is back
    const back = Date.now();
    const sent = await until(async () => {
      const all = await rows();
      return all.every((m) => m.status === 'sent') ? all : null;
    }, Math.max(50_000, N * 500), 'every message sent');
    const drainMs = Date.now() - back;
    // Long enough for a duplicate delivery to show up in the capture if one was going to.
    await new Promise((r) => setTimeout(r, 2000));
    const captured = (await (await fetch(`${process.env.TEST_MAILDEV_URL}/api/email`)).json()) as { to: { address: string }[]; subject: string }[];
    const perRecipient = emails.map((e) => captured.filter((m) => m.to.some((x) => x.address.toLowerCase() === e)).length);
    console.log(`[reliability] ${N} invitations during an SMTP outage: ${attemptsDuringOutage} failed attempts on ${triedDuringOutage} messages in ${outageMs} ms; all sent ${drainMs} ms after SMTP returned; attempts per message ${Math.min(...sent.map((m) => m.attempts))}–${Math.max(...sent.map((m) => m.attempts))}; mails per recipient ${[...new Set(perRecipient)].join(',')}`);
    expect(perRecipient).toEqual(emails.map(() => 1));
    expect(sent.every((m) => m.sentAt && m.lastError === null)).toBe(true);
    expect(sent.filter((m) => m.attempts >= 2).length).toBeGreaterThanOrEqual(triedDuringOutage);
  });
});
