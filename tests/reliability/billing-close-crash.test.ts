import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createStripeFake, type ListeningStripeFake, type StripeFake } from '../../infra/local-fakes/stripe/create-stripe-fake';
import { FacilitySettings } from '@femtoslot/api/src/modules/facility/facility-settings.entity';
import { confirmedSession, testRates } from '@femtoslot/api/src/modules/billing/__tests__/billing-fixture';
import { makeBooker, makeInstrument } from '@femtoslot/api/src/test-support/booking-fixture';
import { makePeople } from '@femtoslot/api/src/test-support/test-api';
import { signIn, startApiProcess, until, type ApiProcess, type Session } from './support/api-process';
import { scratchWorld, type ScratchWorld } from './support/world';

const MONTH = '2026-10';
let w: ScratchWorld;
let fake: StripeFake;
let fakeServer: ListeningStripeFake;
const procs: ApiProcess[] = [];
beforeAll(async () => {
  w = await scratchWorld({ seed: false });
  await w.db.getRepository(FacilitySettings).insert({
    id: 1, name: 'Reliability Ultrafast Core', timeZone: 'America/New_York', currency: 'USD',
    policies: { minBookingHours: 1, maxBookingHours: 12, horizonDays: 60, externalLeadHours: 12, cancellationFreeHours: 72, cancellationHalfFeeHours: 24 },
  });
  fake = createStripeFake({});
  fakeServer = await fake.listen(0);
}, 60_000);
afterAll(async () => {
  await Promise.all(procs.map((p) => p.kill()));
  await fakeServer?.close();
  await w?.close();
});

const apiEnv = () => ({ DATABASE_URL: w.url, STRIPE_HOST: '127.0.0.1', STRIPE_PORT: String(fakeServer.port), STRIPE_PROTOCOL: 'http' });

/** Eight external accounts and two internal groups, one confirmed session each, priced by a card for MONTH. */
async function monthOfSessions(base: string) {
  const t = w.fixtureApi(base);
  const { users } = await makePeople(t, ['finance']);
  const finance = await signIn(base, users.finance!.email);
  const card = await finance.request(base, 'POST', '/api/rate-cards', { name: `Card ${MONTH}`, effectiveFrom: `${MONTH}-01`, effectiveTo: '2026-11-01', currency: 'USD', rates: testRates });
  if (card.status !== 201) throw new Error(`rate card: ${card.status} ${JSON.stringify(card.body)}`);
  const { instrument, configs } = await makeInstrument(t);
  const kinds = [...Array(4).fill('external_academic'), ...Array(4).fill('industry'), 'internal', 'internal'] as const;
  const who = [];
  for (const [i, kind] of kinds.entries()) {
    const b = await makeBooker(t, { kind });
    const day = String(2 + i).padStart(2, '0');
    await confirmedSession(t, { instrumentId: instrument.id, configuration: i % 2 ? configs.dfg : configs.opa_signal, who: b, startsAt: `${MONTH}-${day}T13:00:00Z`, bookedHours: 2 + (i % 3), actualEnd: `${MONTH}-${day}T${15 + (i % 3)}:00:00Z`, confirmedBy: users.finance!.id });
    who.push({ kind, accountId: b.account.id });
  }
  return { finance, external: who.filter((x) => x.kind !== 'internal').map((x) => x.accountId) };
}

const progress = async (periodId: string) => (await w.db.query(
  `SELECT count(*) FILTER (WHERE status = 'done')::int AS done, count(*) FILTER (WHERE stripe_invoice_id IS NOT NULL)::int AS drafted, count(*)::int AS total
     FROM billing_period_accounts WHERE period_id = $1`, [periodId]))[0] as { done: number; drafted: number; total: number };

const jobRow = async (jobId: string) => (await w.db.query(`SELECT status, done, total FROM billing_jobs WHERE id = $1`, [jobId]))[0] as { status: string; done: number; total: number };

async function finished(s: Session, base: string, jobId: string, timeoutMs = 40_000) {
  return until(async () => {
    const r = await s.request(base, 'GET', `/api/billing/jobs/${jobId}`);
    return ['completed', 'failed'].includes(r.body?.job?.status) ? r.body.job : null;
  }, timeoutMs, `billing job ${jobId} finished`);
}

describe('period close under Stripe faults and a killed worker', () => {
  it('when the API process running a close is killed with SIGKILL half-way and Stripe fails 30 % of calls, then a fresh process resumes the same job, and each external account ends with exactly one Stripe invoice whose total equals the preview', async () => {
    const a = await startApiProcess(apiEnv());
    procs.push(a);
    const { finance, external } = await monthOfSessions(a.url);
    const opened = await finance.request(a.url, 'POST', '/api/billing/periods', { month: MONTH });
    expect(opened.status).toBe(200);
    const periodId = opened.body.period.id as string;
    const preview = new Map<string, number>(opened.body.preview.accounts.map((x: { accountId: string; totalMinor: number }) => [x.accountId, x.totalMinor]));
    expect(preview.size).toBe(10);

    fake.knobs.set({ errorRate: 0.3, errorKind: 'mixed', latencyMs: 100, seed: 42 });
    const close = await finance.request(a.url, 'POST', `/api/billing/periods/${periodId}/close`, {});
    expect(close.status).toBe(202);
    const jobId = close.body.job.id as string;

    // Half-way: some accounts have reached Stripe, some are still pending, and the job is still running.
    const atKill = await until(async () => {
      const p = await progress(periodId);
      return p.drafted >= 3 && p.done < p.total ? p : null;
    }, 40_000, 'close half-way');
    await a.kill();
    const left = await jobRow(jobId);
    const [{ state: bossState }] = await w.db.query(`SELECT state FROM pgboss.job WHERE name = 'billing-close' AND data->>'jobId' = $1`, [jobId]);
    console.log(`[reliability] close killed at ${atKill.done}/${atKill.total} accounts done, ${atKill.drafted} with a Stripe draft; job row "${left.status}", pg-boss job "${bossState}"`);
    expect(left.status).toBe('running');
    expect(bossState).toBe('active');

    const restartedAt = Date.now();
    const b = await startApiProcess(apiEnv());
    procs.push(b);
    const healthyMs = Date.now() - restartedAt;
    // The same job, with no new request from anyone: the fresh process's start-up sweep picks it up.
    const resumed = await finished(finance, b.url, jobId);
    const resumedMs = Date.now() - restartedAt;
    let runs = 1;
    let job = resumed;
    // A run leaves the accounts Stripe failed for pending; finance closes again, and each run resumes where it stopped.
    while (job.status === 'failed' && runs < 30) {
      const again = await finance.request(b.url, 'POST', `/api/billing/periods/${periodId}/close`, {});
      expect(again.status).toBe(202);
      job = await finished(finance, b.url, again.body.job.id);
      runs++;
    }
    console.log(`[reliability] fresh process healthy in ${healthyMs} ms, resumed job ${resumed.status} (${resumed.done}/${resumed.total}) ${resumedMs} ms after its start; ${runs} run(s) after the kill to complete; Stripe faults injected so far: errorRate 0.3, latency 100 ms`);
    expect(job).toMatchObject({ status: 'completed', done: 10, total: 10 });

    fake.knobs.set({ errorRate: 0, latencyMs: 0 });
    const invoices = Object.values(fake.state.data.invoices).filter((i) => i.metadata.femtoslot_period === periodId);
    const items = Object.values(fake.state.data.invoiceItems);
    for (const accountId of external) {
      const mine = invoices.filter((i) => i.metadata.femtoslot_account === accountId);
      expect(mine, `Stripe invoices of account ${accountId}`).toHaveLength(1);
      const lines = items.filter((it) => it.invoice === mine[0]!.id);
      expect(lines).toHaveLength(1);
      expect(lines.reduce((s, it) => s + it.amount, 0)).toBe(preview.get(accountId));
      expect(mine[0]!.status).toBe('open');
      expect(Object.values(fake.state.data.customers).filter((c) => c.metadata.femtoslot_account === accountId)).toHaveLength(1);
    }
    expect(invoices).toHaveLength(8);
    const ours: { account_id: string; n: number; total: string }[] = await w.db.query(
      `SELECT account_id, count(*)::int AS n, sum(total_minor)::text AS total FROM invoices WHERE period_id = $1 GROUP BY account_id`, [periodId]);
    expect(ours).toHaveLength(10);
    for (const r of ours) {
      expect(r.n).toBe(1);
      expect(Number(r.total)).toBe(preview.get(r.account_id));
    }
    const [{ status }] = await w.db.query(`SELECT status FROM billing_periods WHERE id = $1`, [periodId]);
    expect(status).toBe('closed');
    expect(b.alive()).toBe(true);
  }, 90_000);
});
