import type { NextFunction, Request, Response } from 'express';
import { createSecretKey, type KeyObject } from 'node:crypto';
import jwt from 'jsonwebtoken';
import type { Role } from '@femtoslot/shared';
import type { AppContext } from '../context';
import { User } from '../../modules/users/user.entity';

export const SESSION_COOKIE = 'femtoslot_session';

export interface SessionUser {
  id: string;
  role: Role;
  organisationId: string;
  email: string;
  name: string;
}

declare module 'express-serve-static-core' {
  interface Request {
    user?: SessionUser;
  }
}

// One key object per secret: handing jsonwebtoken a string makes it try (and fail) to read a public key on every call.
const keys = new Map<string, KeyObject>();
function keyFor(secret: string): KeyObject {
  let k = keys.get(secret);
  if (!k) keys.set(secret, (k = createSecretKey(Buffer.from(secret, 'utf8'))));
  return k;
}

export function issueSession(ctx: AppContext, res: Response, user: { id: string }): void {
  const ttlSeconds = Math.round(ctx.env.SESSION_TTL_HOURS * 3600);
  const token = jwt.sign({}, keyFor(ctx.env.JWT_SECRET), { subject: user.id, expiresIn: ttlSeconds, algorithm: 'HS256', issuer: 'femtoslot' });
  res.cookie(SESSION_COOKIE, token, {
    httpOnly: true,
    sameSite: 'lax',
    secure: ctx.env.APP_URL.startsWith('https:'),
    maxAge: ttlSeconds * 1000,
    path: '/',
  });
}

export function clearSession(ctx: AppContext, res: Response): void {
  res.clearCookie(SESSION_COOKIE, { httpOnly: true, sameSite: 'lax', secure: ctx.env.APP_URL.startsWith('https:'), path: '/' });
}

/** Reads the cookie and loads the user fresh from the database, so role changes and deactivation apply at once. */
export function authenticate(ctx: AppContext) {
  return async (req: Request, _res: Response, next: NextFunction) => {
    const token = req.cookies?.[SESSION_COOKIE];
    if (typeof token === 'string' && token.length > 0) {
      let userId: string | undefined;
      try {
        const payload = jwt.verify(token, keyFor(ctx.env.JWT_SECRET), { algorithms: ['HS256'], issuer: 'femtoslot' });
        userId = typeof payload === 'object' ? payload.sub : undefined;
      } catch {
        userId = undefined;
      }
      if (userId && /^[0-9a-f-]{36}$/i.test(userId)) {
        const user = await ctx.db.getRepository(User).findOne({ where: { id: userId, active: true }, loadEagerRelations: false });
        if (user) req.user = { id: user.id, role: user.role, organisationId: user.organisationId, email: user.email, name: user.name };
      }
    }
    next();
  };
}
