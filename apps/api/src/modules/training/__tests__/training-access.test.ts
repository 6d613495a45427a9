import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeInstrument } from '../../../test-support/booking-fixture';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';
import { giveLaserSafetyTraining, laserSafetyCourseId } from '../../../test-support/training';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

describe('who records, revokes and reads training', () => {
  it('when staff, an admin or a member who is not laser-safety officer tries to record or grant, then 403 and nothing is written', async () => {
    const { configs } = await makeInstrument(t);
    const { users } = await makePeople(t, ['staff', 'admin', 'member']);
    const courseId = await laserSafetyCourseId(t.api.ctx.db);
    for (const role of ['staff', 'admin', 'member'] as const) {
      const agent = await t.signIn(users[role]!.email);
      const rec = await agent.post('/api/training/records').send({ userId: users.member!.id, courseId, completedOn: '2026-06-01' });
      const grant = await agent.post('/api/training/signoffs').send({ userId: users.member!.id, configurationId: configs.dfg.id, grantedOn: '2026-06-01' });
      const expected = role === 'member' ? 'forbidden' : 'not_laser_safety_officer';
      expect([rec.status, rec.body.error.code, grant.status, grant.body.error.code]).toEqual([403, expected, 403, expected]);
    }
    const written = await t.api.ctx.db.query(`SELECT (SELECT count(*) FROM training_records WHERE user_id = $1)::int + (SELECT count(*) FROM configuration_signoffs WHERE user_id = $1)::int AS n`, [users.member!.id]);
    expect(written[0].n).toBe(0);
  });

  it('when an admin names a staff member laser-safety officer, then they may record and revoke, the change is audited, and a member cannot be named', async () => {
    const { users } = await makePeople(t, ['staff', 'admin', 'member']);
    const admin = await t.signIn(users.admin!.email);
    const named = await admin.patch(`/api/users/${users.staff!.id}`).send({ laserSafetyOfficer: true });
    expect(named.status).toBe(200);
    expect(named.body.user.laserSafetyOfficer).toBe(true);
    const refused = await admin.patch(`/api/users/${users.member!.id}`).send({ laserSafetyOfficer: true });
    expect([refused.status, refused.body.error.code]).toEqual([422, 'rule_violation']);
    const officer = await t.signIn(users.staff!.email);
    const rec = await officer.post('/api/training/records').send({ userId: users.member!.id, courseId: await laserSafetyCourseId(t.api.ctx.db), completedOn: '2026-06-01' });
    expect(rec.status).toBe(201);
    const revoke = await officer.post(`/api/training/records/${rec.body.record.id}/revoke`).send({ reason: 'Recorded for the wrong person' });
    expect(revoke.body.record).toMatchObject({ state: 'revoked', revokedReason: 'Recorded for the wrong person', revokedByName: users.staff!.name });
    expect((await officer.post(`/api/training/records/${rec.body.record.id}/revoke`).send({ reason: '' })).status).toBe(400);
    const audit = await t.api.ctx.db.query(`SELECT action, after FROM audit_events WHERE entity_id = $1 ORDER BY created_at`, [users.staff!.id]);
    expect(audit.at(-1)).toMatchObject({ action: 'user.updated', after: expect.objectContaining({ laserSafetyOfficer: true }) });
  });

  it('when a member reads training, then they see their own records and no one else’s; staff see anyone’s', async () => {
    const { users } = await makePeople(t, ['member', 'staff', 'pi']);
    await giveLaserSafetyTraining(t.api.ctx.db, users.member!.id);
    const member = await t.signIn(users.member!.email);
    const mine = await member.get('/api/training/me');
    expect(mine.status).toBe(200);
    expect(mine.body.person.id).toBe(users.member!.id);
    expect(mine.body.records).toEqual([expect.objectContaining({ courseName: 'Class 4 laser safety', state: 'valid', expiresOn: '2028-01-01' })]);
    expect(mine.body.authorisations.length).toBeGreaterThan(0);
    expect((await member.get(`/api/training/people/${users.pi!.id}`)).status).toBe(403);
    expect((await member.get('/api/training/people?q=a')).status).toBe(403);
    const staff = await t.signIn(users.staff!.email);
    const theirs = await staff.get(`/api/training/people/${users.member!.id}`);
    expect(theirs.body.records).toHaveLength(1);
    const found = await staff.get(`/api/training/people?q=${encodeURIComponent(users.member!.name)}`);
    expect(found.body.people.map((p: { id: string }) => p.id)).toEqual([users.member!.id]);
    expect((await staff.get('/api/training/people?q=%25')).status).toBe(200);
  });
});
