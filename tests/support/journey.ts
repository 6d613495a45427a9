import { afterAll, beforeAll, expect } from 'vitest';
import type { Page } from 'playwright-core';
import { seedDemo } from '@femtoslot/api/src/db/seed/seed';
import { scratchDatabase } from '@femtoslot/api/src/test-support/scratch-database';
import { startTestApi, type TestApi } from '@femtoslot/api/src/test-support/test-api';
import { launchBrowser } from './browser';

export type TestBrowser = Awaited<ReturnType<typeof launchBrowser>>;

/**
 * A browser journey's suite setup: before all tests, a test API serving the web build and `browsers` headless
 * Chromiums (one per person, so their sessions stay apart), handed to `ready`; after all, everything closed again.
 * With `scratch`, the API gets its own freshly seeded demo database, dropped afterwards.
 */
export function browserJourney(
  opts: { browsers: number; scratch?: boolean },
  ready: (t: TestApi, browsers: TestBrowser[]) => void,
): void {
  let t: TestApi | undefined;
  let scratch: Awaited<ReturnType<typeof scratchDatabase>> | undefined;
  let browsers: TestBrowser[] = [];
  beforeAll(async () => {
    const overrides: Record<string, string> = { WEB_DIST: process.env.TEST_WEB_DIST ?? '' };
    if (opts.scratch) {
      scratch = await scratchDatabase();
      overrides.DATABASE_URL = scratch.url;
    }
    t = await startTestApi(overrides);
    if (opts.scratch) await seedDemo(t.api.ctx.db);
    browsers = await Promise.all(Array.from({ length: opts.browsers }, () => launchBrowser()));
    ready(t, browsers);
  });
  afterAll(async () => {
    for (const b of browsers) await b.close();
    await t?.close();
    await scratch?.drop();
  });
}

/** Picks the option of a <select> whose text contains `text`; fails the test when there is none. */
export async function selectOptionContaining(page: Page, selector: string, text: string): Promise<void> {
  const value = await page.$eval(selector, (el, s) => [...(el as HTMLSelectElement).options].find((o) => o.textContent?.includes(s))?.value ?? '', text);
  expect(value).not.toBe('');
  await page.selectOption(selector, value);
}

/** The demo facility's zone (America/New_York), where the seed's weekday bookings fall. */
export const FACILITY_ZONE = 'America/New_York';

/** The first `weekday` at least `minDays` ahead, as YYYY-MM-DD in the facility's zone. */
export function facilityWeekdayAhead(weekday: 'Sat' | 'Sun', minDays: number): string {
  const weekdayOf = new Intl.DateTimeFormat('en-US', { timeZone: FACILITY_ZONE, weekday: 'short' });
  for (let d = minDays; d < minDays + 7; d++) {
    const day = new Date(Date.now() + d * 86_400_000);
    if (weekdayOf.format(day) === weekday) return new Intl.DateTimeFormat('en-CA', { timeZone: FACILITY_ZONE }).format(day);
  }
  throw new Error(`no ${weekday} found`);
}
