import Stripe from 'stripe';
import type { Configuration } from '../../instruments/configuration.entity';
import { createStripeFake, type ListeningStripeFake, type StripeFake } from '../../../../../../infra/local-fakes/stripe/create-stripe-fake';
import { FacilitySettings } from '../../facility/facility-settings.entity';
import { TimelineBlock } from '../../bookings/timeline-block.entity';
import { UsageLog } from '../../usage/usage-log.entity';
import { pastSession } from '../../../test-support/past-session';
import { scratchDatabase } from '../../../test-support/scratch-database';
import { freeLoopbackPort, makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';

export const WEBHOOK_SECRET = 'whsec_billing_tests_only';

/** Test rates, invented for these tests (not the demo seed): DFG class = standard + 25 %. */
export const testRates = {
  internal: { standard: 6_000, dfg: 7_500 },
  external_academic: { standard: 11_000, dfg: 13_750 },
  industry: { standard: 26_000, dfg: 32_500 },
};

export interface BillingWorld {
  t: TestApi;
  fake: StripeFake;
  fakeServer: ListeningStripeFake;
  stripe: Stripe;
  close(): Promise<void>;
}

/**
 * A database of its own (the close job's pg-boss queue and facility-wide periods must not meet other test files),
 * a facility row, and an in-process Stripe fake whose webhooks go to this API.
 */
export async function startBillingWorld(): Promise<BillingWorld> {
  const scratch = await scratchDatabase();
  const apiPort = await freeLoopbackPort();
  const fake = createStripeFake({ webhookUrl: `http://127.0.0.1:${apiPort}/api/webhooks/stripe`, webhookSecret: WEBHOOK_SECRET, webhookRetry: { initialDelayMs: 50 } });
  const fakeServer = await fake.listen(0);
  const t = await startTestApi({
    DATABASE_URL: scratch.url, PORT: String(apiPort), STRIPE_HOST: '127.0.0.1', STRIPE_PORT: String(fakeServer.port), STRIPE_PROTOCOL: 'http', STRIPE_WEBHOOK_SECRET: WEBHOOK_SECRET,
  });
  await t.api.ctx.db.getRepository(FacilitySettings).insert({
    id: 1, name: 'Test Ultrafast Core', timeZone: 'America/New_York', currency: 'USD',
    policies: { minBookingHours: 1, maxBookingHours: 12, horizonDays: 60, externalLeadHours: 12, cancellationFreeHours: 72, cancellationHalfFeeHours: 24 },
  });
  const stripe = new Stripe('sk_test_billing_tests', { host: '127.0.0.1', port: fakeServer.port, protocol: 'http', maxNetworkRetries: 0, telemetry: false });
  return {
    t, fake, fakeServer, stripe,
    close: async () => { await t.close(); await fakeServer.close(); await scratch.drop(); },
  };
}

export async function financeAgent(t: TestApi) {
  const { users } = await makePeople(t, ['finance', 'staff']);
  return { finance: await t.signIn(users.finance!.email), staff: await t.signIn(users.staff!.email), financeUser: users.finance! };
}

/** A rate card for one month only, so each test prices its own month with its own card. */
export async function monthRateCard(agent: Awaited<ReturnType<typeof financeAgent>>['finance'], month: string, over: Record<string, unknown> = {}) {
  const [y, m] = month.split('-').map(Number) as [number, number];
  const next = m === 12 ? `${y + 1}-01` : `${y}-${String(m + 1).padStart(2, '0')}`;
  const r = await agent.post('/api/rate-cards').send({ name: `Card ${month}`, effectiveFrom: `${month}-01`, effectiveTo: `${next}-01`, currency: 'USD', rates: testRates, ...over });
  if (r.status !== 201) throw new Error(`rate card: ${r.status} ${JSON.stringify(r.body)}`);
  return r.body.rateCard;
}

interface Who { account: { id: string }; user: { id: string }; org: { id: string } }

/** A past session with a confirmed log (inserted: the API cannot book the past). */
export async function confirmedSession(t: TestApi, o: { instrumentId: string; configuration: Configuration; who: Who; startsAt: string; bookedHours: number; actualEnd: string; confirmedBy: string }) {
  const booking = await pastSession(t, { instrumentId: o.instrumentId, configuration: o.configuration, accountId: o.who.account.id, userId: o.who.user.id, organisationId: o.who.org.id, startsAt: new Date(o.startsAt), hours: o.bookedHours, nm: o.configuration.defaultNm });
  await t.api.ctx.db.getRepository(TimelineBlock).update({ id: booking.id }, { status: 'completed' });
  const log = await t.api.ctx.db.getRepository(UsageLog).save({
    bookingId: booking.id, status: 'confirmed', actualStartsAt: new Date(o.startsAt), actualEndsAt: new Date(o.actualEnd), outsideGrace: false, notes: '', attachmentIds: [],
    submittedBy: o.who.user.id, submittedAt: new Date(o.actualEnd), confirmedBy: o.confirmedBy, confirmedAt: new Date(o.actualEnd), billedBy: null, billedAt: null,
  } as Omit<UsageLog, 'id'>);
  return { booking, log };
}

/** A booking cancelled (fee decided at cancellation) or displaced, inserted as the bookings module leaves it. */
export async function endedBooking(t: TestApi, o: { instrumentId: string; configuration: Configuration; who: Who; startsAt: string; hours: number; status: 'cancelled' | 'displaced'; feePercent?: number; cancelledAt?: string }) {
  const booking = await pastSession(t, { instrumentId: o.instrumentId, configuration: o.configuration, accountId: o.who.account.id, userId: o.who.user.id, organisationId: o.who.org.id, startsAt: new Date(o.startsAt), hours: o.hours, nm: o.configuration.defaultNm });
  await t.api.ctx.db.getRepository(TimelineBlock).update({ id: booking.id }, {
    status: o.status, cancellationFeePercent: o.feePercent ?? null, cancelledAt: o.cancelledAt ? new Date(o.cancelledAt) : null,
  });
  return booking;
}

export async function until<T>(probe: () => Promise<T | null | undefined | false>, timeoutMs = 20_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const v = await probe();
    if (v) return v;
    if (Date.now() > deadline) throw new Error('condition not met in time');
    await new Promise((r) => setTimeout(r, 150));
  }
}
