import { describe, expect, it } from 'vitest';
import type { TestApi } from '@femtoslot/api/src/test-support/test-api';
import { screenshot, signInThroughForm } from '../support/browser';
import { browserJourney, facilityWeekdayAhead, selectOptionContaining, type TestBrowser } from '../support/journey';

let t: TestApi;
let collaboratorBrowser: TestBrowser;
let staffBrowser: TestBrowser;
browserJourney({ browsers: 2 }, (api, [b0, b1]) => {
  t = api;
  collaboratorBrowser = b0!;
  staffBrowser = b1!;
});

/** A Saturday at least six days ahead, as YYYY-MM-DD in the facility's zone: the demo seed books weekdays only. */
const freeSaturday = () => facilityWeekdayAhead('Sat', 6);

describe('beam-time journey in Chromium', () => {
  it('when a collaborator requests a DFG slot, staff approve it, then block maintenance over it, then the collaborator rebooks an alternative', async () => {
    const day = freeSaturday();
    const collaborator = await collaboratorBrowser.context.newPage();
    await signInThroughForm(collaborator, t.api.url, 'collaborator@harrowpoint.test');
    await collaborator.goto(`${t.api.url}/calendar`);
    await collaborator.getByTestId('calendar').waitFor();
    await collaborator.getByTestId('new-request-button').click();
    const form = collaborator.getByTestId('request-form');
    await form.waitFor();
    await selectOptionContaining(collaborator, '[data-testid="request-form"] select[name="configurationId"]', 'DFG');
    await form.locator('input[name="targetValue"]').fill('4500');
    await form.locator('input[name="startDate"]').fill(day);
    await form.locator('input[name="startTime"]').fill('10:00');
    await form.locator('input[name="endDate"]').fill(day);
    await form.locator('input[name="endTime"]').fill('13:00');
    await form.locator('[name="purpose"]').fill('Mid-IR absorption of a dye film at 4.5 µm');
    // Derived wavelengths with an 800 nm pump (1/λp = 1/λs + 1/λi, 1/λDFG = 1/λs − 1/λi; Boyd, Nonlinear Optics).
    await expect.poll(() => collaborator.getByTestId('derived-wavelengths').first().textContent(), { timeout: 10_000 }).toMatch(/idler/i);
    await expect.poll(() => collaborator.getByTestId('eyewear-covering').first().isVisible(), { timeout: 10_000 }).toBe(true);
    await expect.poll(() => collaborator.getByTestId('request-outcome').first().getAttribute('data-status'), { timeout: 10_000 }).toBe('requested');
    expect(await collaborator.getByTestId('laser-caution').first().isVisible()).toBe(true);
    await expect.poll(() => collaborator.getByTestId('request-check').first().textContent(), { timeout: 10_000 }).not.toMatch(/overlaps/);
    await screenshot(collaborator, 'journey-01-collaborator-request-form');
    const created = collaborator.waitForResponse((r) => r.url().endsWith('/api/bookings') && r.request().method() === 'POST');
    await collaborator.getByTestId('submit-request').click();
    const response = await created;
    expect(response.status()).toBe(201);
    const bookingId = (await response.json()).booking.id as string;
    await form.waitFor({ state: 'hidden' });

    const staff = await staffBrowser.context.newPage();
    await signInThroughForm(staff, t.api.url, 'staff@harrowpoint.test');
    await staff.goto(`${t.api.url}/calendar`);
    const pendingRow = staff.getByTestId('pending-request').filter({ hasText: '4,500 nm' }).first();
    await pendingRow.waitFor();
    await screenshot(staff, 'journey-02-staff-pending');
    const approved = staff.waitForResponse((r) => r.url().endsWith(`/api/bookings/${bookingId}/approve`));
    await pendingRow.getByTestId('approve-booking').click();
    expect((await approved).status()).toBe(200);

    await staff.getByTestId('new-maintenance-button').click();
    const mform = staff.getByTestId('maintenance-form');
    await mform.waitFor();
    await mform.locator('input[name="startDate"]').fill(day);
    await mform.locator('input[name="startTime"]').fill('09:00');
    await mform.locator('input[name="endDate"]').fill(day);
    await mform.locator('input[name="endTime"]').fill('14:00');
    await mform.locator('[name="reason"]').fill('DFG crystal realignment');
    const blocked = staff.waitForResponse((r) => r.url().endsWith('/api/maintenance') && r.request().method() === 'POST');
    await staff.getByTestId('save-maintenance').click();
    const maintenance = await blocked;
    expect(maintenance.status()).toBe(201);
    expect((await maintenance.json()).displaced.map((b: { id: string }) => b.id)).toContain(bookingId);
    await screenshot(staff, 'journey-03-staff-maintenance');

    await collaborator.reload();
    const displaced = collaborator.getByTestId('displaced-booking').first();
    await displaced.waitFor();
    await expect.poll(() => displaced.getByTestId('rebook-slot').count()).toBe(3);
    await screenshot(collaborator, 'journey-04-collaborator-displaced');
    const rebooked = collaborator.waitForResponse((r) => r.url().endsWith('/api/bookings') && r.request().method() === 'POST');
    await displaced.getByTestId('rebook-slot').first().click();
    expect((await rebooked).status()).toBe(201);
    await expect.poll(() => collaborator.getByTestId('displaced-booking').count(), { timeout: 10_000 }).toBe(0);
    await screenshot(collaborator, 'journey-05-collaborator-rebooked');
  });
});
