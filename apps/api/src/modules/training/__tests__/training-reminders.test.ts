import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeInstrument } from '../../../test-support/booking-fixture';
import { waitForMail } from '../../../test-support/maildev';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';
import { laserSafetyCourseId } from '../../../test-support/training';
import { facilityToday } from '../training.queries';
import { TRAINING_REMINDER_CRON, TRAINING_REMINDER_QUEUE, sendTrainingReminders } from '../training-reminders';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

const addDays = (isoDate: string, days: number) => new Date(Date.parse(`${isoDate}T12:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
const mailsTo = async (address: string) => (await t.api.ctx.db.query(`SELECT subject, template FROM outbox_messages WHERE to_address = $1 ORDER BY created_at`, [address])) as { subject: string; template: string }[];

describe('reminders before training expires', () => {
  it('when a record expires within the window, then its holder gets one e-mail, however many runs there are, side by side or on later days', async () => {
    const { users } = await makePeople(t, ['member']);
    const member = users.member!;
    const db = t.api.ctx.db;
    const today = await facilityToday(db);
    const course = await laserSafetyCourseId(db);
    await db.query(`INSERT INTO training_records (user_id, course_id, completed_on, expires_on) VALUES ($1, $2, $3, $4)`, [member.id, course, addDays(today, -700), addDays(today, 12)]);
    // Two processes at once (the row lock decides), then a re-run the next morning.
    await Promise.all([sendTrainingReminders(t.api.ctx), sendTrainingReminders(t.api.ctx)]);
    await sendTrainingReminders(t.api.ctx, new Date(Date.now() + 86_400_000));
    const mail = await waitForMail(member.email, { subjectIncludes: 'expires' });
    expect(mail.subject).toBe(`Your laser training "Class 4 laser safety" expires on ${addDays(today, 12)}`);
    expect(mail.text).toContain('(in 12 days)');
    expect(mail.text).toContain('/training');
    expect(await mailsTo(member.email)).toEqual([{ subject: mail.subject, template: 'training_expiry' }]);
  });

  it('when a record expires beyond the window, or was renewed, or revoked, then no reminder; a sign-off with an expiry inside it gets one', async () => {
    const { configs } = await makeInstrument(t);
    const { users } = await makePeople(t, ['member', 'pi', 'staff']);
    const db = t.api.ctx.db;
    const today = await facilityToday(db);
    const course = await laserSafetyCourseId(db);
    const insert = (userId: string, from: string, to: string, revoked = false) => db.query(
      `INSERT INTO training_records (user_id, course_id, completed_on, expires_on, revoked_at, revoked_by, revoked_reason) VALUES ($1, $2, $3, $4, $5, $6, $7)`,
      [userId, course, from, to, revoked ? new Date() : null, revoked ? users.staff!.id : null, revoked ? 'Wrong person' : null]);
    await insert(users.member!.id, addDays(today, -700), addDays(today, 45));
    await insert(users.pi!.id, addDays(today, -700), addDays(today, 5));
    await insert(users.pi!.id, addDays(today, -3), addDays(today, 720));
    await insert(users.staff!.id, addDays(today, -700), addDays(today, 5), true);
    await db.query(`INSERT INTO configuration_signoffs (user_id, configuration_id, granted_by, granted_on, expires_on) VALUES ($1, $2, $3, $4, $5)`,
      [users.staff!.id, configs.dfg.id, users.staff!.id, addDays(today, -100), addDays(today, 3)]);
    await sendTrainingReminders(t.api.ctx);
    expect(await mailsTo(users.member!.email)).toEqual([]);
    expect(await mailsTo(users.pi!.email)).toEqual([]);
    const signoffMail = await waitForMail(users.staff!.email, { subjectIncludes: 'sign-off' });
    expect(signoffMail.subject).toContain(`DFG`);
    expect(signoffMail.subject).toContain(`expires on ${addDays(today, 3)}`);
    // Fifteen days on, the member's record (45 days out today) is inside the default 30-day window.
    await sendTrainingReminders(t.api.ctx, new Date(Date.now() + 15 * 86_400_000));
    expect((await mailsTo(users.member!.email)).map((m) => m.template)).toEqual(['training_expiry']);
  });

  it('when the API starts, then the daily run is scheduled with pg-boss in the facility’s zone', async () => {
    const rows = await t.api.ctx.db.query(`SELECT s.cron, s.timezone, f.time_zone FROM pgboss.schedule s, facility_settings f WHERE s.name = $1`, [TRAINING_REMINDER_QUEUE]);
    expect(rows).toEqual([{ cron: TRAINING_REMINDER_CRON, timezone: rows[0]?.time_zone, time_zone: rows[0]?.time_zone }]);
    expect(rows[0].timezone).toBe('America/New_York');
  });
});
