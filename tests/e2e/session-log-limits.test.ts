import { describe, expect, it } from 'vitest';
import type { TestApi } from '@femtoslot/api/src/test-support/test-api';
import { interferometricTrace, traceCsv } from '@femtoslot/api/src/test-support/traces';
import { screenshot, signInThroughForm } from '../support/browser';
import { browserJourney, type TestBrowser } from '../support/journey';
import { fixtureFile, memberPastFundamentalSession } from '../support/session-fixtures';

let t: TestApi;
let browser: TestBrowser;
browserJourney({ browsers: 1 }, (api, [b]) => { t = api; browser = b!; });

/** A fringe-resolved (interferometric) autocorrelation of a 30 fs pulse at 800 nm, 8 : 1 (Diels & Rudolph). */
const fringeFile = () => fixtureFile('iac-fringes-800nm.csv', traceCsv(interferometricTrace(30, 800), { delayDigits: 4 }));

describe('session-log limits in Chromium', () => {
  it('when a member drops a fringe-resolved trace and types times outside the window, then the page says why, draws the trace and stores nothing', async () => {
    const { db, session } = await memberPastFundamentalSession(t);

    const page = await browser.context.newPage();
    await signInThroughForm(page, t.api.url, 'member@harrowpoint.test');
    await page.goto(`${t.api.url}/sessions/${session.id}`);
    const form = page.getByTestId('usage-form');
    await form.waitFor();
    expect(await page.getByTestId('usage-window').textContent()).toMatch(/60 min either side of the booking/);
    await form.locator('[name="segments.0.minValue"]').fill('795');
    await form.locator('[name="segments.0.maxValue"]').fill('805');
    await page.getByTestId('trace-drop').first().locator('input[type="file"]').setInputFiles(fringeFile());
    const error = page.getByTestId('trace-error').first();
    await error.waitFor({ timeout: 15_000 });
    // One optical cycle at 795 nm: 795e-9 m / 299 792 458 m/s = 2.65 fs (CODATA 2018 c)
    expect(await error.textContent()).toMatch(/shorter than one optical cycle at 795 nm \(2\.65 fs\)/);
    await page.getByTestId('trace-plot').first().waitFor();
    await form.locator('[name="actualStartTime"]').fill('00:00');
    await page.getByTestId('outside-window-hint').waitFor();
    await screenshot(page, 'session-limits-01-fringe-trace-and-window');
    const [{ n }] = await db.query('SELECT count(*)::int AS n FROM attachments WHERE booking_id = $1', [session.id]);
    expect(n).toBe(0);
  });
});
