import { forgotPasswordInputSchema, loginInputSchema, setPasswordInputSchema } from '@femtoslot/shared';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { AppContext } from '../../lib/context';
import { AppError, unauthenticated } from '../../lib/errors/app-error';
import { clearSession, issueSession, revokeSession } from '../../lib/auth/session';
import type { RouteDef } from '../../lib/auth/routes';
import { User } from '../users/user.entity';
import { toUserDto } from '../users/user.dto';
import { authService } from './auth.service';

export function authRoutes(ctx: AppContext): RouteDef[] {
  const service = authService(ctx);
  const tooMany = (message: string) => (_req: unknown, _res: unknown, next: (e: unknown) => void) =>
    next(new AppError('rate_limited', message, 429));
  // Keyed by address and e-mail, so one attacker cannot lock everyone out and one account cannot be guessed at.
  const loginLimiter = rateLimit({
    windowMs: ctx.env.LOGIN_RATE_WINDOW_MINUTES * 60_000,
    limit: ctx.env.LOGIN_RATE_LIMIT,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String(req.body?.email ?? '').trim().toLowerCase()}`,
    handler: tooMany('Too many sign-in attempts. Wait a few minutes and try again.'),
  });
  const mailLimiter = rateLimit({
    windowMs: 15 * 60_000, limit: ctx.env.MAIL_RATE_LIMIT, standardHeaders: 'draft-8', legacyHeaders: false,
    handler: tooMany('Too many requests for e-mail links. Wait a few minutes and try again.'),
  });

  return [
    {
      method: 'post', path: '/auth/login', access: 'public', before: [loginLimiter],
      handler: async (req, res) => {
        const user = await service.login(loginInputSchema.parse(req.body));
        issueSession(ctx, res, user);
        req.log.info({ userId: user.id }, 'signed in');
        res.json({ user: toUserDto(user) });
      },
    },
    {
      method: 'post', path: '/auth/logout', access: 'public',
      handler: async (req, res) => { await revokeSession(ctx, req); clearSession(ctx, res); res.status(204).end(); },
    },
    {
      method: 'get', path: '/auth/me', access: 'public',
      handler: async (req, res) => {
        if (!req.user) throw unauthenticated();
        const user = await ctx.db.getRepository(User).findOneOrFail({ where: { id: req.user.id } });
        res.json({ user: toUserDto(user) });
      },
    },
    {
      method: 'post', path: '/auth/forgot-password', access: 'public', before: [mailLimiter],
      handler: async (req, res) => {
        await service.requestPasswordReset(forgotPasswordInputSchema.parse(req.body));
        res.status(202).json({ ok: true });
      },
    },
    {
      method: 'post', path: '/auth/reset-password', access: 'public', before: [mailLimiter],
      handler: async (req, res) => {
        const user = await service.setPasswordWithToken(setPasswordInputSchema.parse(req.body), 'password_reset', String(req.id));
        issueSession(ctx, res, user);
        res.json({ user: toUserDto(user) });
      },
    },
    {
      method: 'get', path: '/auth/invitations/:token', access: 'public',
      handler: async (req, res) => {
        const token = String(req.params.token ?? '');
        if (token.length < 20 || token.length > 200) throw new AppError('invalid_token', 'This invitation link is malformed', 404);
        const user = await service.peekToken(token, 'invitation');
        res.json({ invitation: { email: user.email, name: user.name, role: user.role, organisation: { name: user.organisation.name } } });
      },
    },
    {
      method: 'post', path: '/auth/accept-invitation', access: 'public', before: [mailLimiter],
      handler: async (req, res) => {
        const user = await service.setPasswordWithToken(setPasswordInputSchema.parse(req.body), 'invitation', String(req.id));
        issueSession(ctx, res, user);
        res.json({ user: toUserDto(user) });
      },
    },
  ];
}
