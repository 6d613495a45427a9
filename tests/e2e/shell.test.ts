import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import type { TestApi } from '@femtoslot/api/src/test-support/test-api';
import { launchBrowser, screenshot, signInThroughForm } from '../support/browser';
import { browserJourney, type TestBrowser } from '../support/journey';

let t: TestApi;
let browser: TestBrowser;
browserJourney({ browsers: 1 }, (api, [b]) => { t = api; browser = b!; });

async function navAreas(page: Page): Promise<string[]> {
  const nav = page.locator('nav[aria-label="Main"]');
  await nav.waitFor();
  return (await nav.locator('[data-testid^="nav-"]').evaluateAll((els) => els.map((e) => e.getAttribute('data-testid')!))).sort();
}

describe('web shell in Chromium', () => {
  it('when signed out, then a protected page sends you to sign-in', async () => {
    const page = await browser.context.newPage();
    await page.goto(`${t.api.url}/calendar`);
    await page.waitForURL(/\/sign-in/);
    expect(await page.locator('input[name="email"]').isVisible()).toBe(true);
    await screenshot(page, '01-sign-in');
    await page.close();
  });

  it('when the password is wrong, then the form shows the generic message', async () => {
    const page = await browser.context.newPage();
    await page.goto(`${t.api.url}/sign-in`);
    await page.fill('input[name="email"]', 'staff@harrowpoint.test');
    await page.fill('input[name="password"]', 'not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect.poll(() => page.getByTestId('sign-in-error').textContent()).toMatch(/do not match/);
    await screenshot(page, '02-sign-in-wrong-password');
    await page.close();
  });

  it('when staff and a collaborator sign in, then each sees the navigation of their role', async () => {
    const staffContext = await launchBrowser();
    const collaboratorContext = await launchBrowser();
    try {
      const staff = await staffContext.context.newPage();
      await signInThroughForm(staff, t.api.url, 'staff@harrowpoint.test');
      expect(await navAreas(staff)).toEqual(['nav-beam-time', 'nav-calendar', 'nav-reports', 'nav-sessions', 'nav-settings', 'nav-sources', 'nav-training']);
      expect(await staff.getByTestId('laser-caution').first().isVisible()).toBe(true);
      await screenshot(staff, '03-staff-calendar');

      const collaborator = await collaboratorContext.context.newPage();
      await signInThroughForm(collaborator, t.api.url, 'collaborator@harrowpoint.test');
      expect(await navAreas(collaborator)).toEqual(['nav-beam-time', 'nav-billing', 'nav-calendar', 'nav-sessions', 'nav-training']);
      await collaborator.goto(`${t.api.url}/people`);
      await collaborator.getByTestId('not-available').waitFor();
      await screenshot(collaborator, '04-collaborator-people-refused');
    } finally {
      await staffContext.close();
      await collaboratorContext.close();
    }
  });

  it('when admin opens People, then the users table lists the demo accounts', async () => {
    const ctx = await launchBrowser();
    try {
      const page = await ctx.context.newPage();
      await signInThroughForm(page, t.api.url, 'admin@harrowpoint.test');
      expect(await navAreas(page)).toContain('nav-people');
      await page.getByTestId('nav-people').click();
      await page.getByTestId('users-table').waitFor();
      await page.locator('[data-testid="user-row"][data-email="collaborator@harrowpoint.test"]').waitFor();
      await screenshot(page, '05-admin-people');
      await page.getByTestId('theme-toggle').click();
      expect(await page.evaluate(() => document.documentElement.classList.contains('dark'))).toBe(true);
      await screenshot(page, '06-admin-people-dark');
    } finally {
      await ctx.close();
    }
  });
});
