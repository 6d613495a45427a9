import { roles } from '@femtoslot/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../../audit/audit-event.entity';
import { AuthToken } from '../../auth/auth-token.entity';
import { linkToken, waitForMail } from '../../../test-support/maildev';
import { makePeople, startTestApi, uniqueTag, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

describe('admin-only user list', () => {
  it('when each role asks for GET /api/users, then only admin gets 200 and every other role 403', async () => {
    const { users } = await makePeople(t, [...roles]);
    const statuses: Record<string, number> = {};
    for (const role of roles) {
      const agent = await t.signIn(users[role]!.email);
      statuses[role] = (await agent.get('/api/users')).status;
    }
    expect(statuses).toEqual({ collaborator: 403, member: 403, pi: 403, staff: 403, finance: 403, admin: 200 });
    expect((await t.http().get('/api/users')).status).toBe(401);
  });

  it('when admin lists users, then no password hash is in the answer', async () => {
    const { users } = await makePeople(t, ['admin']);
    const r = await (await t.signIn(users.admin!.email)).get('/api/users');
    expect(r.body.users.length).toBeGreaterThan(0);
    expect(JSON.stringify(r.body)).not.toMatch(/\$2[aby]\$/);
  });
});

describe('invitations', () => {
  it('when admin invites someone, then they get a mail whose single-use link sets a password and signs them in', async () => {
    const { users, org } = await makePeople(t, ['admin']);
    const admin = await t.signIn(users.admin!.email);
    const email = `invitee.${uniqueTag()}@example.test`;
    const created = await admin.post('/api/users/invitations').send({ email, name: 'Ada Invitee', role: 'member', organisationId: org.id });
    expect(created.status).toBe(201);
    expect(created.body.user).toMatchObject({ email, invitationPending: true, role: 'member' });

    const mail = await waitForMail(email, { subjectIncludes: 'invited' });
    expect(mail.html).toContain('Set my password');
    const token = linkToken(mail);
    const stored = await t.api.ctx.db.getRepository(AuthToken).findOneByOrFail({ userId: created.body.user.id });
    expect(stored.tokenHash).not.toContain(token); // only the hash is stored

    const peek = await t.http().get(`/api/auth/invitations/${token}`);
    expect(peek.status).toBe(200);
    expect(peek.body.invitation).toMatchObject({ email, name: 'Ada Invitee' });

    const accepted = await t.http().post('/api/auth/accept-invitation').send({ token, password: 'a long new password' });
    expect(accepted.status).toBe(200);
    expect(accepted.body.user.invitationPending).toBe(false);
    expect(String(accepted.headers['set-cookie'])).toMatch(/femtoslot_session=/);

    const again = await t.http().post('/api/auth/accept-invitation').send({ token, password: 'another long password' });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('invalid_token');
    expect((await t.http().post('/api/auth/login').send({ email, password: 'a long new password' })).status).toBe(200);

    const audit = await t.api.ctx.db.getRepository(AuditEvent).findBy({ entityId: created.body.user.id });
    expect(audit.map((a) => a.action).sort()).toEqual(['invitation.accepted', 'user.invited']);
  });

  it('when an invitation has expired, then the link is refused', async () => {
    const { users, org } = await makePeople(t, ['admin']);
    const admin = await t.signIn(users.admin!.email);
    const email = `late.${uniqueTag()}@example.test`;
    const created = await admin.post('/api/users/invitations').send({ email, name: 'Late Invitee', role: 'member', organisationId: org.id });
    const token = linkToken(await waitForMail(email));
    await t.api.ctx.db.getRepository(AuthToken).update({ userId: created.body.user.id }, { expiresAt: new Date(Date.now() - 1000) });
    expect((await t.http().get(`/api/auth/invitations/${token}`)).status).toBe(410);
    expect((await t.http().post('/api/auth/accept-invitation').send({ token, password: 'a long new password' })).status).toBe(400);
  });

  it('when a pi invites into another organisation, or as staff, then 403', async () => {
    const a = await makePeople(t, ['pi']);
    const b = await makePeople(t, ['member']);
    const pi = await t.signIn(a.users.pi!.email);
    const other = await pi.post('/api/users/invitations').send({ email: `x.${uniqueTag()}@example.test`, name: 'X', role: 'member', organisationId: b.org.id });
    expect(other.status).toBe(403);
    const asStaff = await pi.post('/api/users/invitations').send({ email: `y.${uniqueTag()}@example.test`, name: 'Y', role: 'staff', organisationId: a.org.id });
    expect(asStaff.status).toBe(403);
    const ok = await pi.post('/api/users/invitations').send({ email: `z.${uniqueTag()}@example.test`, name: 'Z', role: 'member', organisationId: a.org.id });
    expect(ok.status).toBe(201);
  });

  it('when the e-mail already has an account, then 409 email_taken', async () => {
    const { users, org } = await makePeople(t, ['admin', 'member']);
    const r = await (await t.signIn(users.admin!.email)).post('/api/users/invitations')
      .send({ email: users.member!.email, name: 'Dup', role: 'member', organisationId: org.id });
    expect(r.status).toBe(409);
    expect(r.body.error.code).toBe('email_taken');
  });

  it('when the invitation body is bad, then 400 with details per field and nothing is created', async () => {
    const { users } = await makePeople(t, ['admin']);
    const r = await (await t.signIn(users.admin!.email)).post('/api/users/invitations').send({ email: 'nope', role: 'wizard', organisationId: 'x' });
    expect(r.status).toBe(400);
    expect(r.body.error.details.map((d: { path: string[] }) => d.path[0]).sort()).toEqual(['email', 'name', 'organisationId', 'role']);
  });
});

describe('role change and deactivation', () => {
  it('when admin changes a role, then the change applies to the live session and is audited', async () => {
    const { users } = await makePeople(t, ['admin', 'member']);
    const admin = await t.signIn(users.admin!.email);
    const member = await t.signIn(users.member!.email);
    const r = await admin.patch(`/api/users/${users.member!.id}`).send({ role: 'pi' });
    expect(r.status).toBe(200);
    expect((await member.get('/api/auth/me')).body.user.role).toBe('pi');
    const audit = await t.api.ctx.db.getRepository(AuditEvent).findOneByOrFail({ entityId: users.member!.id, action: 'user.updated' });
    expect(audit.before).toMatchObject({ role: 'member' });
    expect(audit.after).toMatchObject({ role: 'pi' });
  });

  it('when admin tries to deactivate themself, then 422 and nothing changes', async () => {
    const { users } = await makePeople(t, ['admin']);
    const admin = await t.signIn(users.admin!.email);
    const r = await admin.patch(`/api/users/${users.admin!.id}`).send({ active: false });
    expect(r.status).toBe(422);
    expect((await admin.get('/api/auth/me')).status).toBe(200);
  });

  it('when the user id is unknown, then 404', async () => {
    const { users } = await makePeople(t, ['admin']);
    const r = await (await t.signIn(users.admin!.email)).patch('/api/users/00000000-0000-4000-8000-000000000000').send({ active: false });
    expect(r.status).toBe(404);
  });
});
