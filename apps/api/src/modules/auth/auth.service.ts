import type { ForgotPasswordInput, LoginInput, SetPasswordInput } from '@femtoslot/shared';
import { IsNull, MoreThan } from 'typeorm';
import type { AppContext } from '../../lib/context';
import { AppError } from '../../lib/errors/app-error';
import { hashPassword, verifyPassword } from '../../lib/auth/passwords';
import { hashToken, newOpaqueToken } from '../../lib/auth/tokens';
import { passwordResetMail } from '../../lib/mail/templates';
import { recordAudit } from '../audit/audit.service';
import { User } from '../users/user.entity';
import { AuthToken, type AuthTokenPurpose } from './auth-token.entity';

const invalidCredentials = () => new AppError('invalid_credentials', 'That e-mail and password do not match an active account', 401);
const invalidToken = () => new AppError('invalid_token', 'This link is not valid any more: it was used, it expired, or it was mistyped', 400);

export function authService(ctx: AppContext) {
  const users = () => ctx.db.getRepository(User);

  async function login(input: LoginInput): Promise<User> {
    const user = await users().findOne({ where: { email: input.email } });
    const ok = await verifyPassword(input.password, user?.passwordHash);
    if (!user || !ok || !user.active) throw invalidCredentials();
    return user;
  }

  /**
   * Answers in the same time whether or not the address has an account: the request only queues a job with the address
   * (one pg-boss insert, the same statement for every address); the lookup, the token and the e-mail happen in the
   * worker, off the request path (sendPasswordReset). Before, a known address also wrote the token and the mail inside
   * the request: bench §7 measured medians of 105 ms against 31 ms under load (now 40 against 43 ms: noise).
   */
  async function requestPasswordReset(input: ForgotPasswordInput): Promise<void> {
    await ctx.outbox.sendJob(PASSWORD_RESET_QUEUE, { email: input.email });
  }

  /** The worker's half: an active account with a password gets a single-use link; any other address gets nothing. */
  async function sendPasswordReset(input: ForgotPasswordInput): Promise<void> {
    const user = await users().findOne({ where: { email: input.email, active: true } });
    if (!user || !user.passwordHash) return;
    await ctx.db.transaction(async (m) => {
      const { token, hash } = newOpaqueToken();
      await m.getRepository(AuthToken).insert({
        userId: user.id, purpose: 'password_reset', tokenHash: hash, expiresAt: new Date(Date.now() + ctx.env.RESET_TTL_MINUTES * 60_000),
      });
      const url = `${ctx.env.APP_URL}/reset-password?token=${token}`;
      await ctx.outbox.enqueue(m, user.email, passwordResetMail({ name: user.name, url, minutes: ctx.env.RESET_TTL_MINUTES }));
    });
  }

  /** Looks a token up without spending it (the accept-invitation page shows who is being invited). */
  async function peekToken(token: string, purpose: AuthTokenPurpose): Promise<User> {
    const row = await ctx.db.getRepository(AuthToken).findOne({
      where: { tokenHash: hashToken(token), purpose, usedAt: IsNull(), expiresAt: MoreThan(new Date()) },
    });
    if (!row) throw new AppError('invalid_token', 'This invitation is not valid any more: it was used, it expired, or it was mistyped', 410);
    const user = await users().findOne({ where: { id: row.userId } });
    if (!user || !user.active) throw invalidToken();
    return user;
  }

  /** Spends a single-use token and sets the password, atomically: a second use of the same link fails. */
  async function setPasswordWithToken(input: SetPasswordInput, purpose: AuthTokenPurpose, requestId?: string): Promise<User> {
    const hash = await hashPassword(input.password);
    return ctx.db.transaction(async (m) => {
      const spent: { user_id: string }[] = await m.query(
        `UPDATE auth_tokens SET used_at = now() WHERE token_hash = $1 AND purpose = $2 AND used_at IS NULL AND expires_at > now() RETURNING user_id`,
        [hashToken(input.token), purpose]);
      const first = Array.isArray(spent[0]) ? (spent[0] as { user_id: string }[])[0] : spent[0];
      if (!first) throw invalidToken();
      const user = await m.getRepository(User).findOne({ where: { id: first.user_id } });
      if (!user || !user.active) throw invalidToken();
      // A reset ends every session issued before it (a stolen cookie stops working); accepting an invitation has none to end.
      const epoch = purpose === 'password_reset' ? user.sessionEpoch + 1 : user.sessionEpoch;
      await m.getRepository(User).update({ id: user.id }, { passwordHash: hash, sessionEpoch: epoch });
      user.sessionEpoch = epoch;
      // Any other outstanding links for this purpose stop working once one has been used.
      await m.query(`UPDATE auth_tokens SET used_at = now() WHERE user_id = $1 AND purpose = $2 AND used_at IS NULL`, [user.id, purpose]);
      await recordAudit(m, { actorUserId: user.id, action: purpose === 'invitation' ? 'invitation.accepted' : 'password.reset', entityType: 'user', entityId: user.id, requestId });
      user.passwordHash = hash;
      return user;
    });
  }

  return { login, requestPasswordReset, sendPasswordReset, peekToken, setPasswordWithToken };
}

export const PASSWORD_RESET_QUEUE = 'auth-password-reset';

/** Works the password-reset queue (every API process with workers does). */
export async function startAuthJobs(ctx: AppContext): Promise<void> {
  const service = authService(ctx);
  await ctx.outbox.work<ForgotPasswordInput>(PASSWORD_RESET_QUEUE, (data) => service.sendPasswordReset(data));
}
