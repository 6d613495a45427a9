import { invitableRolesBy, type InviteInput, type UpdateUserInput } from '@femtoslot/shared';
import type { AppContext } from '../../lib/context';
import { AppError, forbidden, notFound } from '../../lib/errors/app-error';
import type { SessionUser } from '../../lib/auth/session';
import { newOpaqueToken } from '../../lib/auth/tokens';
import { invitationMail } from '../../lib/mail/templates';
import { recordAudit } from '../audit/audit.service';
import { AuthToken } from '../auth/auth-token.entity';
import { FacilitySettings } from '../facility/facility-settings.entity';
import { Organisation } from '../organisations/organisation.entity';
import { User } from './user.entity';

const snapshot = (u: User) => ({ role: u.role, active: u.active, email: u.email, organisationId: u.organisationId, laserSafetyOfficer: u.isLaserSafetyOfficer });

export function usersService(ctx: AppContext) {
  async function list(): Promise<User[]> {
    return ctx.db.getRepository(User).find({ order: { createdAt: 'ASC' } });
  }

  async function invite(actor: SessionUser, input: InviteInput, requestId?: string): Promise<User> {
    if (!invitableRolesBy[actor.role].includes(input.role)) throw forbidden(`As ${actor.role} you cannot invite someone as ${input.role}`);
    if (actor.role === 'pi' && input.organisationId !== actor.organisationId) throw forbidden('A PI invites people into their own group only');
    return ctx.db.transaction(async (m) => {
      const organisation = await m.getRepository(Organisation).findOne({ where: { id: input.organisationId } });
      if (!organisation) throw new AppError('unknown_organisation', 'That organisation does not exist', 422);
      const existing = await m.getRepository(User).findOne({ where: { email: input.email } });
      if (existing) throw new AppError('email_taken', 'Someone with that e-mail address already has an account', 409);
      const user = await m.getRepository(User).save({
        email: input.email, name: input.name, role: input.role, organisationId: organisation.id, passwordHash: null, active: true,
      });
      const { token, hash } = newOpaqueToken();
      await m.getRepository(AuthToken).insert({
        userId: user.id, purpose: 'invitation', tokenHash: hash, expiresAt: new Date(Date.now() + ctx.env.INVITATION_TTL_HOURS * 3_600_000),
      });
      const facility = await m.getRepository(FacilitySettings).findOne({ where: { id: 1 } });
      const inviter = await m.getRepository(User).findOneOrFail({ where: { id: actor.id } });
      await ctx.outbox.enqueue(m, user.email, invitationMail({
        name: user.name, inviterName: inviter.name, facility: facility?.name ?? 'the facility', role: user.role,
        url: `${ctx.env.APP_URL}/accept-invitation?token=${token}`, hours: ctx.env.INVITATION_TTL_HOURS,
      }));
      await recordAudit(m, { actorUserId: actor.id, action: 'user.invited', entityType: 'user', entityId: user.id, after: snapshot({ ...user, organisationId: organisation.id } as User), requestId });
      return m.getRepository(User).findOneOrFail({ where: { id: user.id } });
    });
  }

  async function update(actor: SessionUser, id: string, input: UpdateUserInput, requestId?: string): Promise<User> {
    if (id === actor.id && (input.active === false || (input.role && input.role !== actor.role))) {
      throw new AppError('rule_violation', 'You cannot deactivate yourself or change your own role; ask another admin', 422);
    }
    return ctx.db.transaction(async (m) => {
      const repo = m.getRepository(User);
      const user = await repo.findOne({ where: { id }, lock: { mode: 'pessimistic_write', tables: ['users'] } });
      if (!user) throw notFound('User');
      const before = snapshot(user);
      const role = input.role ?? user.role;
      const officer = input.laserSafetyOfficer ?? user.isLaserSafetyOfficer;
      // The laser-safety officer duty sits on staff or admin only (users_lso_is_staff); moving to another role ends it.
      if (input.laserSafetyOfficer && !['staff', 'admin'].includes(role)) throw new AppError('rule_violation', 'Only staff or an admin can be named laser-safety officer', 422);
      await repo.update({ id }, {
        ...(input.role ? { role: input.role } : {}), ...(input.active !== undefined ? { active: input.active } : {}),
        isLaserSafetyOfficer: officer && ['staff', 'admin'].includes(role),
      });
      const after = await repo.findOneOrFail({ where: { id } });
      await recordAudit(m, { actorUserId: actor.id, action: 'user.updated', entityType: 'user', entityId: id, before, after: snapshot(after), requestId });
      return after;
    });
  }

  return { list, invite, update };
}
