import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { makeBooker } from '@femtoslot/api/src/test-support/booking-fixture';
import type { TestApi } from '@femtoslot/api/src/test-support/test-api';
import { screenshot, signInThroughForm } from '../support/browser';
import { browserJourney, facilityWeekdayAhead, selectOptionContaining, type TestBrowser } from '../support/journey';

let t: TestApi;
let memberBrowser: TestBrowser;
let officerBrowser: TestBrowser;
browserJourney({ browsers: 2 }, (api, [b0, b1]) => {
  t = api;
  memberBrowser = b0!;
  officerBrowser = b1!;
});

/** A Sunday at least eight days ahead in the facility's zone (the demo seed books weekdays only). */
const freeSunday = () => facilityWeekdayAhead('Sun', 8);

const dfgRow = (page: Page) => page.locator('[data-testid="authorisation-row"]', { hasText: 'DFG' }).filter({ hasText: 'Aurora line' });

describe('training journey in Chromium', () => {
  it('when a member lacking the DFG sign-off requests DFG time, then the form names what is missing; the officer records and grants, then revokes with a reason, and the member sees it', async () => {
    const booker = await makeBooker(t);
    const member = await memberBrowser.context.newPage();
    await signInThroughForm(member, t.api.url, booker.user.email, 'correct horse battery');
    await member.goto(`${t.api.url}/calendar`);
    await member.getByTestId('calendar').waitFor();
    await member.getByTestId('new-request-button').click();
    const form = member.getByTestId('request-form');
    await form.waitFor();
    const day = freeSunday();
    await selectOptionContaining(member, '[data-testid="request-form"] select[name="configurationId"]', 'DFG');
    await form.locator('input[name="targetValue"]').fill('4500');
    await form.locator('input[name="startDate"]').fill(day);
    await form.locator('input[name="startTime"]').fill('10:00');
    await form.locator('input[name="endDate"]').fill(day);
    await form.locator('input[name="endTime"]').fill('12:00');
    await form.locator('[name="purpose"]').fill('CH₄ line strengths at 3.3 µm');
    const missing = member.getByTestId('training-missing');
    await missing.waitFor({ timeout: 15_000 });
    expect(await missing.textContent()).toMatch(/Mid-infrared beam handling \(none on record\)/);
    expect(await missing.textContent()).toMatch(/supervised session/);
    await missing.scrollIntoViewIfNeeded();
    await screenshot(member, 'training-01-member-request-lacks-signoff');

    await member.goto(`${t.api.url}/training`);
    await dfgRow(member).waitFor();
    expect(await dfgRow(member).getAttribute('data-ok')).toBe('false');
    expect(await member.getByTestId('record-training-form').count()).toBe(0);
    await screenshot(member, 'training-02-member-own-training');

    const officer = await officerBrowser.context.newPage();
    await signInThroughForm(officer, t.api.url, 'staff@harrowpoint.test');
    await officer.getByTestId('nav-training').click();
    await officer.locator('input[name="q"]').fill(booker.user.name);
    await officer.locator(`[data-testid="person-result"][data-person-id="${booker.user.id}"]`).click();
    const panel = officer.locator(`[data-testid="person-training"][data-person-id="${booker.user.id}"]`);
    await panel.waitFor();
    const recordForm = officer.getByTestId('record-training-form');
    await recordForm.waitFor();
    await selectOptionContaining(officer, '[data-testid="record-training-form"] select[name="courseId"]', 'Mid-infrared beam handling');
    await recordForm.getByTestId('record-training-submit').click();
    await panel.locator('[data-testid="training-record-row"]', { hasText: 'Mid-infrared beam handling' }).waitFor();
    await selectOptionContaining(officer, '[data-testid="grant-signoff-form"] select[name="configurationId"]', 'DFG');
    await officer.getByTestId('grant-signoff-form').locator('input[name="note"]').fill('Supervised DFG alignment session');
    await officer.getByTestId('grant-signoff-submit').click();
    await panel.locator('[data-testid="signoff-row"][data-state="valid"]').waitFor();
    await expect.poll(() => dfgRow(officer).getAttribute('data-ok'), { timeout: 10_000 }).toBe('true');
    await screenshot(officer, 'training-03-officer-recorded-and-granted');

    await panel.locator('[data-testid="signoff-row"][data-state="valid"]').getByRole('button', { name: 'Revoke' }).click();
    const dialog = officer.getByTestId('revoke-dialog');
    await dialog.locator('input[name="reason"]').fill('Beam left unenclosed during alignment');
    await screenshot(officer, 'training-04-officer-revoke-dialog');
    await dialog.getByTestId('confirm-revoke').click();
    await panel.locator('[data-testid="signoff-row"][data-state="revoked"]').waitFor();
    await screenshot(officer, 'training-05-officer-revoked');
    await officer.getByTestId('courses-section').locator('summary').click();
    const dfgRequirement = officer.locator('[data-testid="requirement-row"]', { hasText: 'DFG mid-IR · Aurora line' });
    await dfgRequirement.waitFor();
    expect(await dfgRequirement.locator('input[name="signoffLabel"]').inputValue()).toMatch(/supervised session/);
    await officer.getByTestId('courses-section').scrollIntoViewIfNeeded();
    await screenshot(officer, 'training-07-officer-courses-and-requirements', { fullPage: false });

    await member.reload();
    await dfgRow(member).waitFor();
    expect(await dfgRow(member).getAttribute('data-ok')).toBe('false');
    expect(await dfgRow(member).textContent()).toContain('revoked: Beam left unenclosed during alignment');
    await screenshot(member, 'training-06-member-sees-revocation');
    const audit = await t.api.ctx.db.query(`SELECT a.action FROM audit_events a JOIN users u ON u.id = a.actor_user_id
      WHERE u.email = 'staff@harrowpoint.test' AND a.entity_type IN ('training_record', 'configuration_signoff') AND (a.after->>'userId' = $1 OR a.after ? 'reason')
      ORDER BY a.created_at DESC LIMIT 3`, [booker.user.id]);
    expect(audit.map((a: { action: string }) => a.action)).toEqual(['signoff.revoked', 'signoff.granted', 'training.recorded']);
  }, 150_000);
});
