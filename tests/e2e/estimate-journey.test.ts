import { copyFile, readFile } from 'node:fs/promises';
import path from 'node:path';
import { PDFParse } from 'pdf-parse';
import { describe, expect, it } from 'vitest';
import type { TestApi } from '@femtoslot/api/src/test-support/test-api';
import { screenshot, signInThroughForm } from '../support/browser';
import { browserJourney, facilityWeekdayAhead, selectOptionContaining, type TestBrowser } from '../support/journey';

let t: TestApi;
let browser: TestBrowser;
browserJourney({ browsers: 1, scratch: true }, (api, [b]) => { t = api; browser = b!; });

/** A Saturday at least six days ahead (facility zone): the demo seed books weekdays only, so nothing comes before it that day. */
const freeSaturday = () => facilityWeekdayAhead('Sat', 6);

describe('price estimate in Chromium', () => {
  it('when a collaborator fills in a DFG request, then the form shows the charge and the cancellation fees, and the quote PDF downloads with them', async () => {
    const day = freeSaturday();
    const page = await browser.context.newPage();
    await signInThroughForm(page, t.api.url, 'collaborator@harrowpoint.test');
    await page.goto(`${t.api.url}/calendar`);
    await page.getByTestId('calendar').waitFor();
    await page.getByTestId('new-request-button').click();
    const form = page.getByTestId('request-form');
    await form.waitFor();
    await selectOptionContaining(page, '[data-testid="request-form"] select[name="configurationId"]', 'DFG');
    await form.locator('input[name="targetValue"]').fill('4500');
    await form.locator('input[name="startDate"]').fill(day);
    await form.locator('input[name="startTime"]').fill('10:00');
    await form.locator('input[name="endDate"]').fill(day);
    await form.locator('input[name="endTime"]').fill('13:00');
    const estimate = page.getByTestId('booking-estimate');
    // By hand from the demo rate card (external academic $110/h, DFG class +25 % = $137.50/h, facility absorbs changeover):
    // 3 h × $137.50 = $412.50; cancelling 72–24 h before costs 50 % = $206.25, later 100 % = $412.50.
    await expect.poll(() => estimate.getAttribute('data-total-minor'), { timeout: 15_000 }).toBe('41250');
    expect(await page.getByTestId('estimate-total').textContent()).toBe('$412.50');
    const windows = page.getByTestId('estimate-window');
    expect(await windows.evaluateAll((els) => els.map((e) => [e.getAttribute('data-percent'), e.getAttribute('data-amount-minor')]))).toEqual([['0', '0'], ['50', '20625'], ['100', '41250']]);
    await estimate.scrollIntoViewIfNeeded();
    const shots = path.dirname(await screenshot(page, 'estimate-01-request-form'));
    await estimate.screenshot({ path: path.join(shots, 'estimate-02-panel.png') });

    const download = page.waitForEvent('download');
    await page.getByTestId('download-quote').click();
    const file = await (await download).path();
    await copyFile(file, path.join(shots, 'estimate-03-quote.pdf'));
    const parser = new PDFParse({ data: new Uint8Array(await readFile(file)) });
    const text = (await parser.getText()).text.replace(/\s+/g, ' ');
    await parser.destroy();
    expect(text).toContain('Estimated total $412.50');
    expect(text).toContain('50 % — $206.25');
    expect(text).toMatch(/Quote FS-Q-\d{8}-[0-9A-F]{6}/);
  });
});
