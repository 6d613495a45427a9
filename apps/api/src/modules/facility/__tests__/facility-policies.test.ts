import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '../../../db/seed/seed';
import { hoursFromNow, makeBooker, makeInstrument, plusHours, plusMinutes } from '../../../test-support/booking-fixture';
import { pastSession } from '../../../test-support/past-session';
import { scratchDatabase } from '../../../test-support/scratch-database';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';

// The facility row is shared by every test of a database: this file changes it, so it works on a database of its own.
let scratch: Awaited<ReturnType<typeof scratchDatabase>>;
let t: TestApi;
let admin: Awaited<ReturnType<TestApi['signIn']>>;
let staff: Awaited<ReturnType<TestApi['signIn']>>;
let member: Awaited<ReturnType<TestApi['signIn']>>;
beforeAll(async () => {
  scratch = await scratchDatabase();
  t = await startTestApi({ DATABASE_URL: scratch.url });
  await seedDemo(t.api.ctx.db);
  const { users } = await makePeople(t, ['admin', 'staff', 'member']);
  [admin, staff, member] = await Promise.all([t.signIn(users.admin!.email), t.signIn(users.staff!.email), t.signIn(users.member!.email)]);
});
afterAll(async () => { await t?.close(); await scratch?.drop(); });

const patch = (body: object) => admin.patch('/api/facility/policies').send(body);

describe('facility policies are edited through PATCH /api/facility/policies', () => {
  it.each([
    [{ minBookingHours: 0 }, ['minBookingHours']],
    [{ minBookingHours: 1.3 }, ['minBookingHours']],
    [{ maxBookingHours: 25 }, ['maxBookingHours']],
    [{ minBookingHours: 6, maxBookingHours: 4 }, ['maxBookingHours']],
    [{ horizonDays: 0 }, ['horizonDays']],
    [{ horizonDays: 10.5 }, ['horizonDays']],
    [{ externalLeadHours: -1 }, ['externalLeadHours']],
    [{ cancellationFreeHours: 12, cancellationHalfFeeHours: 24 }, ['cancellationFreeHours']],
    [{ cancellationHalfFeeHours: -2 }, ['cancellationHalfFeeHours']],
    [{ usageGraceMinutes: -5 }, ['usageGraceMinutes']],
    [{ trainingReminderDays: 0 }, ['trainingReminderDays']],
    [{ invoiceDaysUntilDue: 400 }, ['invoiceDaysUntilDue']],
    [{ workingHours: { start: '18:00', end: '08:00', weekdays: [1] } }, ['workingHours', 'end']],
    [{ workingHours: { start: '8:00', end: '18:00', weekdays: [1] } }, ['workingHours', 'start']],
    [{ workingHours: { start: '08:00', end: '24:00', weekdays: [1] } }, ['workingHours', 'end']],
    [{ workingHours: { start: '08:00', end: '18:00', weekdays: [1, 1] } }, ['workingHours', 'weekdays']],
    [{ workingHours: { start: '08:00', end: '18:00', weekdays: [7] } }, ['workingHours', 'weekdays', 0]],
    [{ workingHours: { start: '08:00', end: '18:00', weekdays: [] } }, ['workingHours', 'weekdays']],
    [{ usageWindowMinutes: 1441 }, ['usageWindowMinutes']],
    [{ usageWindowMinutes: -1 }, ['usageWindowMinutes']],
    [{ horizonDays: '90' }, ['horizonDays']],
  ])('when the body is %j, then 400 names the field %j and nothing changes', async (body, path) => {
    const before = (await admin.get('/api/facility')).body.facility;
    const r = await patch(body);
    expect(r.status).toBe(400);
    expect(r.body.error.details.map((d: { path: unknown[] }) => d.path)).toContainEqual(path);
    expect((await admin.get('/api/facility')).body.facility).toEqual(before);
  });

  it('when the body carries an unknown key or a time zone, then 400 names it (the zone is not edited here)', async () => {
    for (const key of ['timeZone', 'sneaky']) {
      const r = await patch({ horizonDays: 61, [key]: 'x' });
      expect(r.status).toBe(400);
      expect(JSON.stringify(r.body.error.details)).toContain(key);
    }
  });

  it('when a single field would break a rule with the stored values, then the merged check refuses it at that field', async () => {
    // Free cancellation is stored at 72 h (seed): a half-fee window of 700 h is within its own bounds but above it.
    const alone = await patch({ cancellationHalfFeeHours: 700 });
    expect(alone.status).toBe(400);
    expect(alone.body.error.details.map((d: { path: unknown[] }) => d.path)).toContainEqual(['cancellationFreeHours']);
  });

  it('when staff or a member send a change, then 403 and staff can still read the policies', async () => {
    expect((await staff.patch('/api/facility/policies').send({ horizonDays: 61 })).status).toBe(403);
    expect((await member.patch('/api/facility/policies').send({ horizonDays: 61 })).status).toBe(403);
    const read = await staff.get('/api/facility');
    expect(read.status).toBe(200);
    expect(read.body.facility).toMatchObject({ usageWindowMinutes: expect.any(Number), policies: { horizonDays: expect.any(Number) } });
  });

  it('when an admin changes the working hours, then one audit row holds the values before and after', async () => {
    const before = (await admin.get('/api/facility')).body.facility;
    const r = await patch({ workingHours: { start: '07:30', end: '19:00', weekdays: [1, 2, 3, 4, 5, 6] }, usageGraceMinutes: 45 });
    expect(r.status).toBe(200);
    const rows: { before: Record<string, unknown>; after: Record<string, unknown>; actor_user_id: string }[] = await t.api.ctx.db.query(
      `SELECT before, after, actor_user_id FROM audit_events WHERE action = 'facility.policies_updated' AND entity_type = 'facility' ORDER BY created_at DESC, id DESC LIMIT 1`);
    expect(rows[0]!.before).toEqual({ ...before.policies, usageWindowMinutes: before.usageWindowMinutes });
    expect(rows[0]!.after).toMatchObject({ workingHours: { start: '07:30', end: '19:00', weekdays: [1, 2, 3, 4, 5, 6] }, usageGraceMinutes: 45, horizonDays: before.policies.horizonDays });
    expect((await admin.get('/api/facility')).body.facility.policies.workingHours).toEqual({ start: '07:30', end: '19:00', weekdays: [1, 2, 3, 4, 5, 6] });
  });

  it('when the horizon is raised, then the next booking check accepts a start beyond the old horizon', async () => {
    const { configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const old = (await admin.get('/api/facility')).body.facility.policies.horizonDays as number;
    const start = hoursFromNow((old + 5) * 24);
    const check = () => me.agent.post('/api/bookings/check').send({
      instrumentId: configs.opa_signal.instrumentId, configurationId: configs.opa_signal.id, accountId: me.account.id,
      startsAt: start.toISOString(), endsAt: plusHours(start, 2).toISOString(), purpose: 'Pump-probe scan', targetNm: 1300,
    });
    const rules = (r: Awaited<ReturnType<typeof check>>) => (r.body.problems as { details?: { rule?: string } }[]).map((p) => p.details?.rule);
    expect(rules(await check())).toContain('horizon');
    expect((await patch({ horizonDays: old + 30 })).status).toBe(200);
    expect(rules(await check())).not.toContain('horizon');
  });

  it('when the session-log window is changed, then the bound of a log follows at once', async () => {
    const { configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const start = new Date(Date.now() - 6 * 3_600_000);
    start.setUTCMinutes(0, 0, 0);
    const b = await pastSession(t, { instrumentId: configs.opa_signal.instrumentId, configuration: configs.opa_signal, accountId: me.account.id, userId: me.user.id, organisationId: me.org.id, startsAt: start, hours: 3, nm: 1300 });
    const from = plusMinutes(start, -45);
    const log = () => me.agent.post(`/api/bookings/${b.id}/usage`).send({
      actualStartsAt: from.toISOString(), actualEndsAt: plusHours(start, 3).toISOString(),
      segments: [{ configurationId: configs.opa_signal.id, startsAt: from.toISOString(), endsAt: plusHours(start, 3).toISOString(), minNm: 1300, maxNm: 1300 }],
    });
    expect((await patch({ usageWindowMinutes: 30 })).status).toBe(200);
    const refused = await log();
    expect(refused.status).toBe(422);
    expect(refused.body.error.details).toMatchObject({ windowMinutes: 30, earliestStartsAt: plusMinutes(start, -30).toISOString() });
    expect((await patch({ usageWindowMinutes: 90 })).status).toBe(200);
    expect((await me.agent.get(`/api/bookings/${b.id}/usage`)).body.window.windowMinutes).toBe(90);
    expect((await log()).status).toBe(200);
  });
});
