import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import type { TestApi } from '@femtoslot/api/src/test-support/test-api';
import { screenshot, signInThroughForm } from '../support/browser';
import { browserJourney, facilityWeekdayAhead, type TestBrowser } from '../support/journey';

let t: TestApi;
let staffBrowser: TestBrowser;
let collaboratorBrowser: TestBrowser;
browserJourney({ browsers: 2 }, (api, [b0, b1]) => {
  t = api;
  staffBrowser = b0!;
  collaboratorBrowser = b1!;
});

/** A Sunday at least eight days ahead, as YYYY-MM-DD in the facility's zone: the demo seed books weekdays only. */
const freeSunday = () => facilityWeekdayAhead('Sun', 8);

/** Drags 13:00–15:00 on `day` in the week grid, paging forward until that day is shown. */
async function dragAfternoon(page: Page, day: string) {
  const column = page.locator(`td.fc-timegrid-col[data-date="${day}"]`);
  for (let i = 0; i < 5 && (await column.count()) === 0; i++) await page.locator('.fc-next-button').click();
  const from = page.locator('td.fc-timegrid-slot-lane[data-time="13:00:00"]');
  const to = page.locator('td.fc-timegrid-slot-lane[data-time="14:30:00"]');
  await from.scrollIntoViewIfNeeded();
  const [col, top, bottom] = await Promise.all([column.boundingBox(), from.boundingBox(), to.boundingBox()]);
  const x = col!.x + col!.width / 2;
  await page.mouse.move(x, top!.y + 4);
  await page.mouse.down();
  await page.mouse.move(x, top!.y + 30, { steps: 5 });
  await page.mouse.move(x, bottom!.y + bottom!.height - 4, { steps: 8 });
  await page.mouse.up();
}

describe('picking a range on the calendar in Chromium', () => {
  it('when staff drag an afternoon, then they choose what it is for and the request form opens on that range', async () => {
    const day = freeSunday();
    const page = await staffBrowser.context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await signInThroughForm(page, t.api.url, 'staff@harrowpoint.test');
    await page.goto(`${t.api.url}/calendar`);
    await page.getByTestId('calendar').waitFor();
    await dragAfternoon(page, day);
    await page.getByTestId('selection-choice').locator('[data-testid="choose-request"]').click();
    const form = page.getByTestId('request-form');
    await form.waitFor();
    await screenshot(page, 'selection-01-staff-request-form');
    expect(await form.locator('input[name="startDate"]').inputValue()).toBe(day);
    expect(await form.locator('input[name="startTime"]').inputValue()).toBe('13:00');
    expect(await form.locator('input[name="endTime"]').inputValue()).toBe('15:00');
    expect(errors).toEqual([]);
    await page.close();
  });

  it('when a collaborator drags an afternoon, then the request form opens on that range', async () => {
    const day = freeSunday();
    const page = await collaboratorBrowser.context.newPage();
    await signInThroughForm(page, t.api.url, 'collaborator@harrowpoint.test');
    await page.goto(`${t.api.url}/calendar`);
    await page.getByTestId('calendar').waitFor();
    await dragAfternoon(page, day);
    const form = page.getByTestId('request-form');
    await form.waitFor();
    expect(await form.locator('input[name="startTime"]').inputValue()).toBe('13:00');
    expect(await form.locator('input[name="endTime"]').inputValue()).toBe('15:00');
    await page.close();
  });
});
