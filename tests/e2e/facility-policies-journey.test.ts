import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '@femtoslot/api/src/db/seed/seed';
import { scratchDatabase } from '@femtoslot/api/src/test-support/scratch-database';
import { makePeople, startTestApi, type TestApi } from '@femtoslot/api/src/test-support/test-api';
import { launchBrowser, screenshot, signInThroughForm } from '../support/browser';

// Saving policies changes the one facility row, so this journey runs on a database of its own.
let scratch: Awaited<ReturnType<typeof scratchDatabase>>;
let t: TestApi;
let browser: Awaited<ReturnType<typeof launchBrowser>>;
beforeAll(async () => {
  scratch = await scratchDatabase();
  t = await startTestApi({ DATABASE_URL: scratch.url, WEB_DIST: process.env.TEST_WEB_DIST ?? '' });
  await seedDemo(t.api.ctx.db);
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await t?.close();
  await scratch?.drop();
});

describe('facility policies journey in Chromium', () => {
  it('when an admin raises the horizon and narrows the session-log window on Settings, then the API answers the new values', async () => {
    const { users } = await makePeople(t, ['admin']);
    const page = await browser.context.newPage();
    await signInThroughForm(page, t.api.url, users.admin!.email, 'correct horse battery');
    await page.goto(`${t.api.url}/settings`);
    await page.getByTestId('policy-horizonDays').waitFor();
    await expect.poll(() => page.getByTestId('policy-horizonDays').inputValue()).toBe('60');
    await expect.poll(() => page.getByTestId('policy-zone-note').textContent()).toContain('America/New_York');
    await page.getByTestId('policy-horizonDays').fill('90');
    await page.getByTestId('policy-usageWindowMinutes').fill('45');
    await page.getByTestId('policy-weekday-6').check();
    await page.getByTestId('save-policies').click();
    await page.getByText('Facility policies saved').waitFor();
    await page.getByTestId('facility-policies').scrollIntoViewIfNeeded();
    await screenshot(page, 'facility-policies-admin');
    const rows: { policies: { horizonDays: number; workingHours: { weekdays: number[] } }; usage_window_minutes: number }[] =
      await t.api.ctx.db.query('SELECT policies, usage_window_minutes FROM facility_settings WHERE id = 1');
    expect(rows[0]).toMatchObject({ policies: { horizonDays: 90, workingHours: { weekdays: [1, 2, 3, 4, 5, 6] } }, usage_window_minutes: 45 });
  });
});
