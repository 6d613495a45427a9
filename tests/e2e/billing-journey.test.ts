import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createStripeFake, type ListeningStripeFake } from '../../infra/local-fakes/stripe/create-stripe-fake';
import { freeLoopbackPort, startTestApi, type TestApi } from '@femtoslot/api/src/test-support/test-api';
import { scratchDatabase } from '@femtoslot/api/src/test-support/scratch-database';
import { freePastSlot, pastSession } from '@femtoslot/api/src/test-support/past-session';
import { seedDemo } from '@femtoslot/api/src/db/seed/seed';
import { Account } from '@femtoslot/api/src/modules/accounts/account.entity';
import { Configuration } from '@femtoslot/api/src/modules/instruments/configuration.entity';
import { Instrument } from '@femtoslot/api/src/modules/instruments/instrument.entity';
import { TimelineBlock } from '@femtoslot/api/src/modules/bookings/timeline-block.entity';
import { UsageLog } from '@femtoslot/api/src/modules/usage/usage-log.entity';
import { User } from '@femtoslot/api/src/modules/users/user.entity';
import { localDate } from '@femtoslot/shared';
import { monthBounds, monthOf, previousMonthOf } from '@femtoslot/shared/billing/billing-month';
import { launchBrowser, screenshot, signInThroughForm } from '../support/browser';

const SECRET = 'whsec_e2e_billing_only';
let t: TestApi;
let fakeServer: ListeningStripeFake;
let scratch: Awaited<ReturnType<typeof scratchDatabase>>;
let financeBrowser: Awaited<ReturnType<typeof launchBrowser>>;
let collaboratorBrowser: Awaited<ReturnType<typeof launchBrowser>>;

beforeAll(async () => {
  // Its own database (the close job's queue must not meet other suites) with the demo scenario, and a Stripe fake whose
  // webhooks come back to this API.
  scratch = await scratchDatabase();
  const apiPort = await freeLoopbackPort();
  fakeServer = await createStripeFake({ webhookUrl: `http://127.0.0.1:${apiPort}/api/webhooks/stripe`, webhookSecret: SECRET, webhookRetry: { initialDelayMs: 50 } }).listen(0);
  t = await startTestApi({
    DATABASE_URL: scratch.url, PORT: String(apiPort), WEB_DIST: process.env.TEST_WEB_DIST ?? '',
    STRIPE_HOST: '127.0.0.1', STRIPE_PORT: String(fakeServer.port), STRIPE_PROTOCOL: 'http', STRIPE_WEBHOOK_SECRET: SECRET,
  });
  await seedDemo(t.api.ctx.db);
  [financeBrowser, collaboratorBrowser] = await Promise.all([launchBrowser(), launchBrowser()]);
});
afterAll(async () => {
  await financeBrowser?.close();
  await collaboratorBrowser?.close();
  await t?.close();
  await fakeServer?.close();
  await scratch?.drop();
});

/**
 * A confirmed two-hour DFG session of the external collaborator and an unlogged one, both in free slots of the month
 * before last (facility zone): a month can be closed only once it has ended, and the demo seed has closed last month.
 */
async function confirmedCollaboratorSession() {
  const db = t.api.ctx.db;
  const user = await db.getRepository(User).findOneByOrFail({ email: 'collaborator@harrowpoint.test' });
  const staff = await db.getRepository(User).findOneByOrFail({ email: 'staff@harrowpoint.test' });
  const account = await db.getRepository(Account).findOneByOrFail({ organisationId: user.organisationId });
  const aurora = await db.getRepository(Instrument).findOneByOrFail({ name: 'Aurora line' });
  const dfg = await db.getRepository(Configuration).findOneByOrFail({ instrumentId: aurora.id, key: 'dfg' });
  const monthBeforeLastEnd = monthBounds(previousMonthOf(monthOf(new Date(), 'America/New_York')), 'America/New_York').startsAt;
  const start = await freePastSlot(db, aurora.id, 2, new Date(monthBeforeLastEnd.getTime() - 3_600_000));
  const booking = await pastSession(t, { instrumentId: aurora.id, configuration: dfg, accountId: account.id, userId: user.id, organisationId: user.organisationId, startsAt: start, hours: 2, nm: 4300 });
  await db.getRepository(TimelineBlock).update({ id: booking.id }, { status: 'completed' });
  const end = new Date(start.getTime() + 2 * 3_600_000);
  await db.getRepository(UsageLog).save({
    bookingId: booking.id, status: 'confirmed', actualStartsAt: start, actualEndsAt: end, outsideGrace: false, notes: '', attachmentIds: [],
    submittedBy: user.id, submittedAt: end, confirmedBy: staff.id, confirmedAt: end, billedBy: null, billedAt: null,
  } as Omit<UsageLog, 'id'>);
  const unloggedStart = await freePastSlot(db, aurora.id, 2, new Date(start.getTime() - 3_600_000));
  await pastSession(t, { instrumentId: aurora.id, configuration: dfg, accountId: account.id, userId: user.id, organisationId: user.organisationId, startsAt: unloggedStart, hours: 2, nm: 4300 });
  return { month: localDate(start, 'America/New_York').slice(0, 7), account };
}

describe('billing journey in Chromium', () => {
  it('when finance closes the month, then the progress bar runs to the end; the collaborator pays on the hosted page; Femtoslot shows the invoice paid', async () => {
    const { month, account } = await confirmedCollaboratorSession();
    const finance = await financeBrowser.context.newPage();
    await signInThroughForm(finance, t.api.url, 'finance@harrowpoint.test');
    await finance.goto(`${t.api.url}/billing`);
    await finance.getByTestId('billing-page').waitFor();
    await finance.getByTestId('period-month').fill(month);
    await finance.getByTestId('open-period').click();
    await finance.getByTestId('period-preview').waitFor();
    await finance.getByTestId('preview-account').filter({ hasText: account.name }).first().waitFor();
    await finance.getByTestId('left-out-row').first().waitFor();
    expect(await finance.getByTestId('close-period').isDisabled()).toBe(true);
    await screenshot(finance, 'billing-01-finance-preview');
    await finance.getByTestId('left-out').scrollIntoViewIfNeeded();
    await screenshot(finance, 'billing-01b-left-out');
    await finance.getByTestId('confirm-left-out').check();
    await finance.getByTestId('close-period').click();
    const progress = finance.getByTestId('close-progress');
    await progress.waitFor();
    await screenshot(finance, 'billing-02-finance-progress');
    await finance.getByTestId('period-closed').waitFor({ timeout: 30_000 });
    await screenshot(finance, 'billing-03-finance-closed');

    const collaborator = await collaboratorBrowser.context.newPage();
    await signInThroughForm(collaborator, t.api.url, 'collaborator@harrowpoint.test');
    await collaborator.goto(`${t.api.url}/billing`);
    const row = collaborator.getByTestId('invoice-row').first();
    await row.waitFor();
    expect(await row.getAttribute('data-status')).toBe('open');
    const href = await row.getByTestId('pay-invoice').getAttribute('href');
    expect(href).toMatch(/\/hosted\/invoices\/in_/);
    const hosted = await collaboratorBrowser.context.newPage();
    await hosted.goto(href!);
    await hosted.fill('#card_number', '4242 4242 4242 4242');
    await screenshot(hosted, 'billing-04-hosted-page');
    await hosted.getByRole('button', { name: 'Pay invoice' }).click();
    await hosted.waitForLoadState();
    await screenshot(hosted, 'billing-05-hosted-paid');

    await expect.poll(async () => {
      await collaborator.reload();
      const r = collaborator.getByTestId('invoice-row').first();
      await r.waitFor();
      return r.getAttribute('data-status');
    }, { timeout: 20_000, interval: 1000 }).toBe('paid');
    await screenshot(collaborator, 'billing-06-collaborator-paid');
  });
});
