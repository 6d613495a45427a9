import { zonedToUtc } from '@femtoslot/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeBooker, makeInstrument, plusHours } from '../../../test-support/booking-fixture';
import { makePeople, startTestApi, uniqueTag, type TestApi } from '../../../test-support/test-api';
import { laserSafetyCourseId } from '../../../test-support/training';
import { facilityToday } from '../training.queries';

let t: TestApi;
let zone: string;
beforeAll(async () => {
  t = await startTestApi();
  zone = ((await t.api.ctx.db.query(`SELECT time_zone FROM facility_settings WHERE id = 1`)) as { time_zone: string }[])[0]!.time_zone;
});
afterAll(async () => { await t?.close(); });

const addDays = (isoDate: string, days: number) => new Date(Date.parse(`${isoDate}T12:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
/** Noon on a facility date, so that a 2-hour session stays inside that date. */
const noonOn = (isoDate: string) => {
  const [year, month, day] = isoDate.split('-').map(Number) as [number, number, number];
  return zonedToUtc({ year, month, day, hour: 12, minute: 0 }, zone);
};

/** A private source whose DFG configuration asks for a course of its own and a supervised-session sign-off. */
async function world() {
  const { instrument, configs } = await makeInstrument(t);
  const { users } = await makePeople(t, ['staff']);
  await t.api.ctx.db.query(`UPDATE users SET is_laser_safety_officer = true WHERE id = $1`, [users.staff!.id]);
  const officer = await t.signIn(users.staff!.email);
  const course = await officer.post('/api/training/courses').send({ name: `Mid-IR handling ${uniqueTag()}`, validityMonths: 12 });
  expect(course.status, JSON.stringify(course.body)).toBe(201);
  const label = 'DFG mid-IR only after a supervised session';
  const req = await officer.put(`/api/training/requirements/${configs.dfg.id}`).send({ courseIds: [course.body.course.id], signoffLabel: label });
  expect(req.status, JSON.stringify(req.body)).toBe(200);
  const booker = await makeBooker(t);
  const book = (configurationId: string, start: Date, targetNm: number) => booker.agent.post('/api/bookings').send({
    instrumentId: instrument.id, configurationId, accountId: booker.account.id, startsAt: start.toISOString(), endsAt: plusHours(start, 2).toISOString(), purpose: 'Gas absorption line scan', targetNm,
  });
  return { instrument, configs, officer, officerUser: users.staff!, course: course.body.course as { id: string; name: string }, label, booker, book, today: await facilityToday(t.api.ctx.db) };
}

describe('training and sign-offs in the booking check', () => {
  it('when a member lacks the configuration’s course and sign-off, then 422 training_required names both, and a configuration without them books', async () => {
    const w = await world();
    const start = noonOn(addDays(w.today, 3));
    const r = await w.book(w.configs.dfg.id, start, 4300);
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('training_required');
    expect(r.body.error.details.gaps).toEqual([
      expect.objectContaining({ kind: 'course', name: w.course.name, reason: 'missing' }),
      expect.objectContaining({ kind: 'signoff', name: w.label, reason: 'missing' }),
    ]);
    expect(r.body.error.message).toContain(w.course.name);
    expect(r.body.error.message).toContain(w.label);
    expect((await w.book(w.configs.opa_signal.id, start, 1300)).status).toBe(201);
  });

  it('when the officer records the course and grants the sign-off, then the booking goes through and both acts are audited', async () => {
    const w = await world();
    const rec = await w.officer.post('/api/training/records').send({ userId: w.booker.user.id, courseId: w.course.id, completedOn: addDays(w.today, -10) });
    expect(rec.status, JSON.stringify(rec.body)).toBe(201);
    // Default expiry: completion + the course's 12 months (PostgreSQL date + interval '12 months').
    expect(rec.body.record.expiresOn).toBe(`${Number(addDays(w.today, -10).slice(0, 4)) + 1}${addDays(w.today, -10).slice(4)}`);
    const grant = await w.officer.post('/api/training/signoffs').send({ userId: w.booker.user.id, configurationId: w.configs.dfg.id, grantedOn: w.today, note: 'Supervised alignment' });
    expect(grant.status, JSON.stringify(grant.body)).toBe(201);
    expect(grant.body.signoff).toMatchObject({ state: 'valid', grantedByName: w.officerUser.name });
    expect((await w.book(w.configs.dfg.id, noonOn(addDays(w.today, 3)), 4300)).status).toBe(201);
    const audit: { action: string; actor_user_id: string }[] = await t.api.ctx.db.query(
      `SELECT action, actor_user_id FROM audit_events WHERE entity_id IN ($1, $2) ORDER BY created_at`, [rec.body.record.id, grant.body.signoff.id]);
    expect(audit.map((a) => a.action)).toEqual(['training.recorded', 'signoff.granted']);
    expect(audit.every((a) => a.actor_user_id === w.officerUser.id)).toBe(true);
  });

  it('when the course expired, then the refusal names the course and its expiry date', async () => {
    const w = await world();
    await w.officer.post('/api/training/records').send({ userId: w.booker.user.id, courseId: w.course.id, completedOn: '2024-01-10', expiresOn: '2025-01-10' });
    await w.officer.post('/api/training/signoffs').send({ userId: w.booker.user.id, configurationId: w.configs.dfg.id, grantedOn: w.today });
    const r = await w.book(w.configs.dfg.id, noonOn(addDays(w.today, 2)), 4300);
    expect(r.status).toBe(422);
    expect(r.body.error.details.gaps).toEqual([expect.objectContaining({ kind: 'course', name: w.course.name, reason: 'expired', expiredOn: '2025-01-10' })]);
    expect(r.body.error.message).toContain('expired 2025-01-10');
  });

  it('when the sign-off is revoked with a reason, then booking is refused with the reason, and revoking twice is 409', async () => {
    const w = await world();
    await w.officer.post('/api/training/records').send({ userId: w.booker.user.id, courseId: w.course.id, completedOn: w.today });
    const grant = await w.officer.post('/api/training/signoffs').send({ userId: w.booker.user.id, configurationId: w.configs.dfg.id, grantedOn: w.today });
    const revoke = await w.officer.post(`/api/training/signoffs/${grant.body.signoff.id}/revoke`).send({ reason: 'Left the enclosure open' });
    expect(revoke.status).toBe(200);
    expect(revoke.body.signoff).toMatchObject({ state: 'revoked', revokedReason: 'Left the enclosure open' });
    const r = await w.book(w.configs.dfg.id, noonOn(addDays(w.today, 2)), 4300);
    expect(r.status).toBe(422);
    expect(r.body.error.details.gaps).toEqual([expect.objectContaining({ kind: 'signoff', reason: 'revoked', revokedReason: 'Left the enclosure open' })]);
    expect((await w.officer.post(`/api/training/signoffs/${grant.body.signoff.id}/revoke`).send({ reason: 'again' })).status).toBe(409);
    const audit = await t.api.ctx.db.query(`SELECT action FROM audit_events WHERE entity_id = $1 ORDER BY created_at`, [grant.body.signoff.id]);
    expect(audit.map((a: { action: string }) => a.action)).toEqual(['signoff.granted', 'signoff.revoked']);
  });

  it('when a record is valid today but expires before the session date, then it is refused; valid through the session date, it books', async () => {
    const w = await world();
    const session = addDays(w.today, 10);
    await w.officer.post('/api/training/records').send({ userId: w.booker.user.id, courseId: w.course.id, completedOn: w.today, expiresOn: addDays(session, -1) });
    await w.officer.post('/api/training/signoffs').send({ userId: w.booker.user.id, configurationId: w.configs.dfg.id, grantedOn: w.today });
    const refused = await w.book(w.configs.dfg.id, noonOn(session), 4300);
    expect(refused.status).toBe(422);
    expect(refused.body.error.details).toMatchObject({ from: session, to: session, gaps: [expect.objectContaining({ reason: 'expired', expiredOn: addDays(session, -1) })] });
    await w.officer.post('/api/training/records').send({ userId: w.booker.user.id, courseId: w.course.id, completedOn: w.today, expiresOn: session });
    expect((await w.book(w.configs.dfg.id, noonOn(session), 4300)).status).toBe(201);
  });

  it('when a sign-off only counts from a later date, then a session on that date books although it is not valid today, and an earlier one is refused', async () => {
    const w = await world();
    const from = addDays(w.today, 7);
    await w.officer.post('/api/training/records').send({ userId: w.booker.user.id, courseId: w.course.id, completedOn: w.today });
    const grant = await w.officer.post('/api/training/signoffs').send({ userId: w.booker.user.id, configurationId: w.configs.dfg.id, grantedOn: from, note: 'Supervised session booked for the day before' });
    expect(grant.body.signoff.state).toBe('not_yet_valid');
    const early = await w.book(w.configs.dfg.id, noonOn(addDays(w.today, 2)), 4300);
    expect(early.status).toBe(422);
    expect(early.body.error.details.gaps).toEqual([expect.objectContaining({ kind: 'signoff', reason: 'not_yet_valid', validFrom: from })]);
    expect((await w.book(w.configs.dfg.id, noonOn(from), 4300)).status).toBe(201);
    const tooFar = await w.officer.post('/api/training/signoffs').send({ userId: w.booker.user.id, configurationId: w.configs.dfg.id, grantedOn: addDays(w.today, 400) });
    expect([tooFar.status, tooFar.body.error.code]).toEqual([422, 'rule_violation']);
  });

  it('when a session sits either side of midnight in the facility zone on the first day of daylight saving time, then the expiry date counts in that zone', async () => {
    // US daylight saving time starts on the second Sunday of March at 02:00 (Energy Policy Act of 2005; IANA tz
    // database, America/New_York): on 2027-03-14 midnight local is 04:00Z (UTC−4), not 05:00Z as in winter.
    expect(zone).toBe('America/New_York');
    const { instrument, configs } = await makeInstrument(t);
    const booker = await makeBooker(t, { trained: false });
    await t.api.ctx.db.query(`INSERT INTO training_records (user_id, course_id, completed_on, expires_on) VALUES ($1, $2, '2026-03-15', '2027-03-14')`,
      [booker.user.id, await laserSafetyCourseId(t.api.ctx.db)]);
    const check = async (startsAt: string, endsAt: string) => {
      const r = await booker.agent.post('/api/bookings/check').send({ instrumentId: instrument.id, configurationId: configs.fundamental.id, accountId: booker.account.id, startsAt, endsAt, purpose: 'Edge', targetNm: 800 });
      expect(r.status).toBe(200);
      return (r.body.problems as { code: string; details: { from: string; to: string; gaps: { expiredOn: string }[] } }[]).find((p) => p.code === 'training_required');
    };
    // 23:00–24:00 EDT on 14 March: the last day of the training; the end instant is not part of the session.
    expect(await check('2027-03-15T03:00:00Z', '2027-03-15T04:00:00Z')).toBeUndefined();
    // 00:00–01:00 EDT on 15 March (a fixed winter offset would still call it 23:00 on the 14th).
    const late = await check('2027-03-15T04:00:00Z', '2027-03-15T05:00:00Z');
    expect(late?.details).toMatchObject({ from: '2027-03-15', to: '2027-03-15', gaps: [expect.objectContaining({ expiredOn: '2027-03-14' })] });
  });
});
