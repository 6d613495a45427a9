import { describe, expect, it } from 'vitest';
import type { TestApi } from '@femtoslot/api/src/test-support/test-api';
import { gaussianTrace, traceCsv } from '@femtoslot/api/src/test-support/traces';
import { screenshot, signInThroughForm } from '../support/browser';
import { browserJourney, type TestBrowser } from '../support/journey';
import { fixtureFile, memberPastFundamentalSession } from '../support/session-fixtures';

let t: TestApi;
let memberBrowser: TestBrowser;
let staffBrowser: TestBrowser;
browserJourney({ browsers: 2 }, (api, [b0, b1]) => {
  t = api;
  memberBrowser = b0!;
  staffBrowser = b1!;
});

/** A Gaussian intensity autocorrelation for a 90 fs pulse: AC FWHM = √2 × pulse FWHM (Diels & Rudolph). */
const traceFile = () => fixtureFile('ac-trace-90fs.csv', traceCsv(gaussianTrace(90, { baseline: 0.03, samplesPerFwhm: 30 })));

describe('session-log journey in Chromium', () => {
  it('when a member logs a session with an autocorrelation trace, then the pulse is computed, staff confirm it, and the reports draw their charts', async () => {
    const { session } = await memberPastFundamentalSession(t);

    const page = await memberBrowser.context.newPage();
    await signInThroughForm(page, t.api.url, 'member@harrowpoint.test');
    await page.goto(`${t.api.url}/sessions`);
    const row = page.locator(`[data-testid="session-row"][data-booking-id="${session.id}"]`);
    await row.waitFor();
    expect(await row.getAttribute('data-log-status')).toBe('needs_log');
    await row.getByTestId('log-session').click();
    const form = page.getByTestId('usage-form');
    await form.waitFor();
    await form.locator('[name="segments.0.minValue"]').fill('795');
    await form.locator('[name="segments.0.maxValue"]').fill('805');
    await form.locator('[name="segments.0.averagePowerMw"]').fill('900');
    await page.getByTestId('trace-drop').first().locator('input[type="file"]').setInputFiles(traceFile());
    const result = page.getByTestId('trace-result').first();
    await result.waitFor({ timeout: 15_000 });
    expect(Math.abs(Number(await result.getAttribute('data-pulse-fs')) - 90) / 90).toBeLessThan(0.01);
    await page.getByTestId('trace-plot').first().waitFor();
    await screenshot(page, 'session-01-member-log-with-trace');
    const saved = page.waitForResponse((r) => r.url().endsWith(`/api/bookings/${session.id}/usage`) && r.request().method() === 'POST');
    await page.getByTestId('save-usage').click();
    const res = await saved;
    expect(res.status()).toBe(200);
    expect((await res.json()).log.segments[0]).toMatchObject({ minNm: 795, maxNm: 805, pulseShape: expect.any(String) });

    const staff = await staffBrowser.context.newPage();
    await signInThroughForm(staff, t.api.url, 'staff@harrowpoint.test');
    await staff.goto(`${t.api.url}/sessions`);
    await staff.getByTestId('to-confirm-tab').click();
    const staffRow = staff.locator(`[data-testid="session-row"][data-booking-id="${session.id}"]`);
    await staffRow.waitFor();
    await staffRow.getByTestId('log-session').click();
    const confirmed = staff.waitForResponse((r) => /\/api\/usage\/[0-9a-f-]+\/confirm$/.test(r.url()));
    await staff.getByTestId('confirm-usage').first().click();
    expect((await confirmed).status()).toBe(200);
    await screenshot(staff, 'session-02-staff-confirmed');

    await staff.goto(`${t.api.url}/reports`);
    await staff.getByTestId('utilisation-chart').waitFor();
    await staff.getByTestId('tuning-chart').waitFor();
    await staff.getByTestId('pulse-chart').waitFor();
    await expect.poll(() => staff.getByTestId('utilisation-table').locator('tbody tr').count(), { timeout: 10_000 }).toBeGreaterThan(0);
    expect(await staff.getByTestId('export-csv').count()).toBeGreaterThanOrEqual(3);
    await staff.waitForTimeout(500);
    await screenshot(staff, 'session-03-staff-reports');
  });
});
