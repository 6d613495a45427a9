import { describe, expect, it } from 'vitest';
import { hoursFromNow, makeBooker, makeInstrument, plusHours, plusMinutes } from '@femtoslot/api/src/test-support/booking-fixture';
import type { TestApi } from '@femtoslot/api/src/test-support/test-api';
import { launchBrowser, screenshot, signInThroughForm } from '../support/browser';
import { browserJourney, selectOptionContaining, type TestBrowser } from '../support/journey';

let t: TestApi;
let browser: TestBrowser;
browserJourney({ browsers: 1 }, (api, [b]) => { t = api; browser = b!; });

describe('sources & stations in Chromium', () => {
  it('when staff slow a changeover, then the preview names the booking it would squeeze before saving; a new bench can be added', async () => {
    // A private source (so no other test's timeline moves) with two bookings 30 min apart: fundamental, then SHG.
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const start = hoursFromNow(30);
    for (const [key, at, nm] of [['fundamental', start, 800], ['shg', plusMinutes(plusHours(start, 2), 30), 400]] as const) {
      const r = await me.agent.post('/api/bookings').send({ instrumentId: instrument.id, configurationId: configs[key].id, accountId: me.account.id, startsAt: at.toISOString(), endsAt: plusHours(at, 2).toISOString(), purpose: 'Carrier dynamics', targetNm: nm });
      expect(r.status).toBe(201);
    }

    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 1400, height: 1100 });
    await signInThroughForm(page, t.api.url, 'staff@harrowpoint.test');
    await page.getByTestId('nav-sources').click();
    await page.getByTestId('instrument-list').waitFor();
    await page.getByTestId('instrument-list').getByText(instrument.name).click();
    await page.locator(`[data-testid="instrument-panel"][data-instrument-id="${instrument.id}"]`).waitFor();
    await screenshot(page, 'sources-01-instrument');

    const matrix = page.getByTestId('changeover-matrix');
    await matrix.getByLabel('Minutes from Fundamental 800 nm to SHG').fill('40');
    expect(await matrix.getByTestId('save-change').isDisabled()).toBe(true);
    await matrix.getByTestId('preview-change').click();
    const affected = matrix.getByTestId('affected-booking');
    await affected.first().waitFor();
    // 40 min base + 5 min pulse check (demo model) against the 30 min that are free.
    expect(await affected.count()).toBe(1);
    expect(await affected.first().textContent()).toMatch(/45 min; 30 min are free/);
    await matrix.scrollIntoViewIfNeeded();
    await screenshot(page, 'sources-02-changeover-preview');
    const saved = page.waitForResponse((r) => r.url().endsWith('/changeover-pairs') && r.request().method() === 'PUT');
    await matrix.getByTestId('save-change').click();
    expect((await saved).status()).toBe(200);

    await page.locator('[data-testid="configuration-row"][data-key="shg"]').getByTestId('edit-configuration').click();
    const form = page.getByTestId('configuration-form');
    await form.waitFor();
    await form.locator('input[name="maxNm"]').fill('380');
    expect(await form.getByTestId('field-error').first().textContent()).toMatch(/short to long/);
    await form.locator('input[name="maxNm"]').fill('405');
    await form.getByTestId('preview-change').click();
    // The slower changeover saved above already squeezes the SHG booking; the narrower range adds nothing new.
    const stillSqueezed = form.getByTestId('affected-booking');
    await stillSqueezed.first().waitFor();
    expect(await stillSqueezed.first().getAttribute('data-new')).toBe('false');
    await form.scrollIntoViewIfNeeded();
    await screenshot(page, 'sources-03-configuration-form');

    await page.getByTestId('add-instrument').click();
    const created = page.getByTestId('instrument-form');
    await created.locator('input[name="name"]').fill('Kerr-lens bench (test)');
    await created.locator('select[name="kind"]').selectOption('bench');
    await created.locator('input[name="pumpNm"]').fill('');
    const posted = page.waitForResponse((r) => r.url().endsWith('/api/instruments') && r.request().method() === 'POST');
    await created.getByTestId('save-change').click();
    expect((await posted).status()).toBe(201);
    await page.getByTestId('instrument-list').getByText('Kerr-lens bench (test)').waitFor();
    await screenshot(page, 'sources-04-bench-added');
    await page.close();
  });

  it('when a member opens a DFG request, then the safety step shows the OD each wavelength needs and the eyewear for it', async () => {
    const me = await makeBooker(t);
    const memberBrowser = await launchBrowser();
    const page = await memberBrowser.context.newPage();
    await page.setViewportSize({ width: 1400, height: 1300 });
    await signInThroughForm(page, t.api.url, me.user.email, 'correct horse battery');
    await page.goto(`${t.api.url}/calendar`);
    await page.getByTestId('calendar').waitFor();
    await page.getByTestId('new-request-button').click();
    const form = page.getByTestId('request-form');
    await form.waitFor();
    await selectOptionContaining(page, '[data-testid="request-form"] select[name="configurationId"]', 'DFG');
    await form.locator('input[name="targetValue"]').fill('4500');
    const day = new Intl.DateTimeFormat('en-CA', { timeZone: 'America/New_York' }).format(new Date(Date.now() + 20 * 86_400_000));
    await form.locator('input[name="startDate"]').fill(day);
    await form.locator('input[name="startTime"]').fill('10:00');
    await form.locator('input[name="endDate"]').fill(day);
    await form.locator('input[name="endTime"]').fill('12:00');
    await form.locator('[name="purpose"]').fill('Gas-cell absorption at 4.5 µm');
    const pump = page.locator('[data-testid="od-row"][data-role="pump_residual"]');
    await pump.waitFor({ timeout: 10_000 });
    // Demo ODs are invented: the pump residual band asks OD 7, the mid-IR band OD 5.
    expect(await pump.getAttribute('data-required-od')).toBe('7');
    expect(await page.locator('[data-testid="od-row"][data-role="dfg"]').getAttribute('data-required-od')).toBe('5');
    expect(await page.getByTestId('laser-caution').first().isVisible()).toBe(true);
    await page.getByTestId('on-table').scrollIntoViewIfNeeded();
    await screenshot(page, 'sources-05-request-safety-step');
    await memberBrowser.close();
  });
});
