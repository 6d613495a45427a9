import { zonedToUtc } from '@femtoslot/shared';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import type { TestApi } from '@femtoslot/api/src/test-support/test-api';
import { screenshot, signInThroughForm } from '../support/browser';
import { browserJourney, facilityWeekdayAhead, selectOptionContaining, type TestBrowser } from '../support/journey';

let t: TestApi;
let browser: TestBrowser;
browserJourney({ browsers: 1 }, (api, [b]) => { t = api; browser = b!; });

const zone = 'America/New_York'; // the demo facility's zone

/** The second Sunday at least fifteen days ahead (facility zone): the demo seed books weekdays, other browser tests nearer Sundays. */
const quietSunday = () => facilityWeekdayAhead('Sun', 15);

describe('calendar month view and request verdict in Chromium', () => {
  it('when the month view opens on December 2026, then the columns are named Mon to Sun and the first cell is 30 November', async () => {
    await browser.context.clearCookies();
    const page = await browser.context.newPage();
    await signInThroughForm(page, t.api.url, 'member@harrowpoint.test');
    await page.goto(`${t.api.url}/calendar`);
    await page.getByTestId('calendar').waitFor();
    await page.locator('.fc-dayGridMonth-button').click();
    const title = page.locator('.fc-toolbar-title');
    // Page to December 2026 from whatever month the machine's clock is in.
    for (let i = 0; i < 24 && (await title.textContent()) !== 'December 2026'; i++) {
      const shown = new Date(`1 ${await title.textContent()} UTC`);
      await page.locator(shown < new Date(Date.UTC(2026, 11, 1)) ? '.fc-next-button' : '.fc-prev-button').click();
    }
    expect(await title.textContent()).toBe('December 2026');
    expect(await page.locator('th.fc-col-header-cell').allTextContents()).toEqual(['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun']);
    // 1 December 2026 is a Tuesday (Gregorian calendar), so a grid from Monday starts on 30 November.
    expect(await page.locator('td.fc-daygrid-day[data-date]').first().getAttribute('data-date')).toBe('2026-11-30');
    await screenshot(page, 'calendar-month-december-2026');
    await page.close();
  });

  it('when a request overlaps a booking, then the form gives one refusing verdict with the earliest start in both zones and Send is off; a clear time fits', async () => {
    const day = quietSunday();
    const [y, m, d] = day.split('-').map(Number) as [number, number, number];
    // The DFG session is booked by the collaborator, who holds the demo's DFG sign-off; the member (who lacks it) asks next to it.
    const booker = await t.signIn('collaborator@harrowpoint.test', 'femtoslot-demo');
    const instruments = (await booker.get('/api/instruments')).body.instruments as { id: string; name: string }[];
    const aurora = instruments.find((i) => i.name === 'Aurora line')!;
    const configurations = (await booker.get('/api/configurations').query({ instrumentId: aurora.id })).body.configurations as { id: string; key: string }[];
    const accounts = (await booker.get('/api/accounts')).body.accounts as { id: string; usable: boolean }[];
    const startsAt = zonedToUtc({ year: y, month: m, day: d, hour: 10, minute: 0 }, zone);
    const existing = await booker.post('/api/bookings').send({
      instrumentId: aurora.id, configurationId: configurations.find((c) => c.key === 'dfg')!.id, accountId: accounts.find((a) => a.usable)!.id,
      startsAt: startsAt.toISOString(), endsAt: new Date(startsAt.getTime() + 3 * 3_600_000).toISOString(), targetNm: 4500, purpose: 'Mid-IR reference run',
    });
    expect(existing.status).toBe(201);

    await browser.context.clearCookies();
    const page = await browser.context.newPage();
    await signInThroughForm(page, t.api.url, 'member@harrowpoint.test');
    await page.goto(`${t.api.url}/calendar`);
    await page.getByTestId('new-request-button').click();
    const form = page.getByTestId('request-form');
    await form.waitFor();
    await selectOptionContaining(page, '[data-testid="request-form"] select[name="configurationId"]', 'Fundamental');
    await form.locator('input[name="targetValue"]').fill('800');
    const setTimes = async (from: string, to: string) => {
      await form.locator('input[name="startDate"]').fill(day);
      await form.locator('input[name="startTime"]').fill(from);
      await form.locator('input[name="endDate"]').fill(day);
      await form.locator('input[name="endTime"]').fill(to);
    };
    await form.locator('[name="purpose"]').fill('Carrier lifetime of an InGaAs wafer');
    await setTimes('11:00', '12:30');
    const verdict = page.getByTestId('request-verdict');
    await expect.poll(() => verdict.getAttribute('data-verdict'), { timeout: 15_000 }).toBe('overlap');
    expect(await page.getByTestId('request-verdict').count()).toBe(1);
    expect(await page.getByTestId('request-check').textContent()).not.toMatch(/fits/i);
    expect(await page.getByTestId('submit-request').isDisabled()).toBe(true);
    const earliest = (await page.getByTestId('earliest-start').textContent()) ?? '';
    expect(earliest).not.toMatch(/\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/);
    expect(earliest).toContain('(America/New_York)');
    await page.getByTestId('request-check').scrollIntoViewIfNeeded();
    await screenshot(page, 'request-verdict-overlap');

    // Ten minutes after the DFG session ends: the DFG → fundamental changeover needs far more.
    await setTimes('13:10', '14:10');
    await expect.poll(() => verdict.getAttribute('data-verdict'), { timeout: 15_000 }).toBe('changeover_short');
    expect(await page.getByTestId('submit-request').isDisabled()).toBe(true);
    await screenshot(page, 'request-verdict-changeover-short');

    await setTimes('16:00', '17:00');
    await expect.poll(() => verdict.getAttribute('data-verdict'), { timeout: 15_000 }).toBe('fits');
    expect(await page.getByTestId('submit-request').isDisabled()).toBe(false);
    await screenshot(page, 'request-verdict-fits');
    await page.close();
  }, 120_000);
});
