import supertest from 'supertest';
import { describe, expect, it } from 'vitest';
import type { TestApi } from '@femtoslot/api/src/test-support/test-api';
import { pastSession } from '@femtoslot/api/src/test-support/past-session';
import { Account } from '@femtoslot/api/src/modules/accounts/account.entity';
import { TimelineBlock } from '@femtoslot/api/src/modules/bookings/timeline-block.entity';
import { Configuration } from '@femtoslot/api/src/modules/instruments/configuration.entity';
import { Instrument } from '@femtoslot/api/src/modules/instruments/instrument.entity';
import { User } from '@femtoslot/api/src/modules/users/user.entity';
import { screenshot, signInThroughForm } from '../support/browser';
import { browserJourney, type TestBrowser } from '../support/journey';

let t: TestApi;
let memberBrowser: TestBrowser;
let piBrowser: TestBrowser;
browserJourney({ browsers: 2 }, (api, [b0, b1]) => {
  t = api;
  memberBrowser = b0!;
  piBrowser = b1!;
});

/** Two upcoming bookings of the demo member, at night in New York, weeks ahead (clear of the seeded day-time sessions). */
async function upcomingForMember() {
  const db = t.api.ctx.db;
  const member = await db.getRepository(User).findOneByOrFail({ email: 'member@harrowpoint.test' });
  const account = await db.getRepository(Account).findOneByOrFail({ organisationId: member.organisationId, status: 'approved' });
  const aurora = await db.getRepository(Instrument).findOneByOrFail({ name: 'Aurora line' });
  const signal = await db.getRepository(Configuration).findOneByOrFail({ instrumentId: aurora.id, key: 'opa_signal' });
  const day = new Date(Date.now() + 40 * 86_400_000);
  day.setUTCHours(5, 0, 0, 0); // 00:00 or 01:00 in New York
  const approved = await pastSession(t, { instrumentId: aurora.id, configuration: signal, accountId: account.id, userId: member.id, organisationId: member.organisationId, startsAt: day, hours: 2, nm: 1310 });
  const requested = await pastSession(t, { instrumentId: aurora.id, configuration: signal, accountId: account.id, userId: member.id, organisationId: member.organisationId, startsAt: new Date(day.getTime() + 86_400_000), hours: 1, nm: 1320 });
  await db.getRepository(TimelineBlock).update({ id: requested.id }, { status: 'requested' });
  return { approved, requested };
}

describe('my beam time in Chromium', () => {
  it('when a member and their PI open My beam time, then the member sees their upcoming bookings with status, both zones and details, and the PI the group spend the API adds up', async () => {
    const { approved, requested } = await upcomingForMember();

    const member = await memberBrowser.context.newPage();
    await signInThroughForm(member, t.api.url, 'member@harrowpoint.test');
    await member.getByTestId('nav-beam-time').click();
    await member.waitForURL((u) => u.pathname === '/beam-time');
    await member.getByTestId('my-bookings').waitFor();
    const approvedRow = member.locator('[data-testid="my-booking-row"]', { has: member.locator(`a[href="/beam-time?booking=${approved.id}"]`) });
    expect(await approvedRow.getAttribute('data-status')).toBe('approved');
    expect(await member.locator('[data-testid="my-booking-row"]', { has: member.locator(`a[href="/beam-time?booking=${requested.id}"]`) }).getAttribute('data-status')).toBe('requested');
    // Facility zone first (America/New_York, EST/EDT), the viewer's zone beneath it when it differs.
    expect(await member.getByTestId('shown-zone').textContent()).toBe('America/New_York');
    const when = await approvedRow.getByTestId('my-booking-when').textContent();
    expect(when).toMatch(/E[SD]T|GMT-[45]/);
    await member.getByTestId('group-spend').waitFor();
    expect(await member.getByTestId('group-spend').getAttribute('data-scope')).toBe('own');
    await screenshot(member, 'my-beam-time-member');
    await approvedRow.getByTestId('my-booking-details').click();
    await member.getByTestId('booking-details-dialog').waitFor();
    expect(await member.getByTestId('booking-details-dialog').textContent()).toContain('past session');
    await screenshot(member, 'my-beam-time-member-details');

    const pi = await piBrowser.context.newPage();
    await signInThroughForm(pi, t.api.url, 'pi@harrowpoint.test');
    await pi.getByTestId('nav-beam-time').click();
    await pi.getByTestId('group-spend').waitFor();
    expect(await pi.getByTestId('group-spend').getAttribute('data-scope')).toBe('organisation');
    const piAgent = supertest.agent(t.api.url);
    expect((await piAgent.post('/api/auth/login').send({ email: 'pi@harrowpoint.test', password: 'femtoslot-demo' })).status).toBe(200);
    const spend = (await piAgent.get('/api/groups/spend')).body;
    expect(spend.totalMinor).toBe(spend.billedMinor + spend.unbilledMinor);
    expect(await pi.getByTestId('spend-total').textContent()).toBe(spend.totalFormatted);
    expect(await pi.getByTestId('spend-account-row').count()).toBe(spend.accounts.length);
    await screenshot(pi, 'my-beam-time-pi');
  });
});
