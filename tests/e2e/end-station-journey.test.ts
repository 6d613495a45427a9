import { describe, expect, it } from 'vitest';
import type { TestApi } from '@femtoslot/api/src/test-support/test-api';
import { screenshot, signInThroughForm } from '../support/browser';
import { browserJourney, selectOptionContaining, type TestBrowser } from '../support/journey';

let t: TestApi;
let browser: TestBrowser;
browserJourney({ browsers: 1 }, (api, [b]) => { t = api; browser = b!; });

const zone = 'America/New_York';
const localDay = (d: Date) => new Intl.DateTimeFormat('en-CA', { timeZone: zone }).format(d);
const localTime = (d: Date) => new Intl.DateTimeFormat('en-GB', { timeZone: zone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(d);

describe('end stations in Chromium', () => {
  it('when a member books the pump-probe station with the source, then only compatible stations are offered, a busy station is flagged, and the bench calendar shows the booking', async () => {
    // The demo's maintenance window on the pump-probe station (seeded for tomorrow evening).
    const [window] = await t.api.ctx.db.query(
      `SELECT b.instrument_id, b.starts_at, b.ends_at FROM timeline_blocks b JOIN instruments i ON i.id = b.instrument_id
        WHERE i.name = 'Pump-probe station' AND b.kind = 'maintenance' AND b.status = 'scheduled' AND b.starts_at > now() ORDER BY b.starts_at LIMIT 1`) as { instrument_id: string; starts_at: Date; ends_at: Date }[];
    expect(window).toBeDefined();
    const pumpProbeId = window!.instrument_id;
    const day = localDay(window!.starts_at);

    const page = await browser.context.newPage();
    await signInThroughForm(page, t.api.url, 'member@harrowpoint.test');
    await page.goto(`${t.api.url}/calendar`);
    await page.getByTestId('calendar').waitFor();
    await page.getByTestId('new-request-button').click();
    const form = page.getByTestId('request-form');
    await form.waitFor();
    const configuration = '[data-testid="request-form"] select[name="configurationId"]';
    const picker = page.getByTestId('station-picker');

    // DFG mid-IR feeds neither bench in the demo list; OPA signal feeds both.
    await selectOptionContaining(page, configuration, 'DFG');
    await picker.getByTestId('no-station').waitFor();
    await selectOptionContaining(page, configuration, 'OPA signal');
    await expect.poll(() => picker.getByTestId('station-option').count()).toBe(2);
    await selectOptionContaining(page, configuration, 'Fundamental');
    await form.locator('input[name="targetValue"]').fill('800');
    await picker.locator(`[data-station-id="${pumpProbeId}"]`).check();

    // Inside the station's maintenance window: the live check says the bench is taken.
    await form.locator('input[name="startDate"]').fill(day);
    await form.locator('input[name="startTime"]').fill(localTime(window!.starts_at));
    await form.locator('input[name="endDate"]').fill(day);
    await form.locator('input[name="endTime"]').fill(localTime(window!.ends_at));
    await form.locator('[name="purpose"]').fill('Carrier lifetime in InGaAs quantum wells');
    await page.locator('[data-testid="check-problems"] [data-code="station_busy"]').waitFor({ timeout: 10_000 });
    await screenshot(page, 'stations-01-request-station-busy');

    // After the window: free on both timelines.
    const start = new Date(window!.ends_at.getTime() + 30 * 60_000);
    const end = new Date(start.getTime() + 2 * 3_600_000);
    await form.locator('input[name="startDate"]').fill(localDay(start));
    await form.locator('input[name="startTime"]').fill(localTime(start));
    await form.locator('input[name="endDate"]').fill(localDay(end));
    await form.locator('input[name="endTime"]').fill(localTime(end));
    await expect.poll(() => page.locator('[data-testid="check-problems"] [data-code="station_busy"]').count(), { timeout: 10_000 }).toBe(0);
    await expect.poll(() => page.getByTestId('request-outcome').first().getAttribute('data-status'), { timeout: 10_000 }).toBe('approved');
    await screenshot(page, 'stations-02-request-with-station');
    const created = page.waitForResponse((r) => r.url().endsWith('/api/bookings') && r.request().method() === 'POST');
    await page.getByTestId('submit-request').click();
    const response = await created;
    expect(response.status()).toBe(201);
    const booking = (await response.json()).booking as { id: string; stationIds: string[] };
    expect(booking.stationIds).toEqual([pumpProbeId]);
    await form.waitFor({ state: 'hidden' });

    // The bench's own calendar: the booking that includes it and the bench's maintenance window.
    await page.selectOption('[data-testid="instrument-filter"]', pumpProbeId);
    if ((await page.locator(`.fc-timegrid-col[data-date="${localDay(start)}"]`).count()) === 0) await page.locator('.fc-next-button').click();
    const event = page.locator(`[data-testid="booking-event"][data-booking-id="${booking.id}"]`);
    await event.waitFor({ timeout: 10_000 });
    expect(await event.getAttribute('data-stations')).toBe(pumpProbeId);
    expect(await event.textContent()).toContain('with Pump-probe station');
    expect(await page.locator('[data-testid="maintenance-event"]').count()).toBeGreaterThan(0);
    await screenshot(page, 'stations-03-bench-calendar');
    await event.click();
    const stations = page.getByTestId('booking-stations');
    await stations.waitFor();
    expect(await stations.textContent()).toContain('Pump-probe station');
    await screenshot(page, 'stations-04-booking-details');
  });
});
