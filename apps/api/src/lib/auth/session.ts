import type { NextFunction, Request, Response } from 'express';
import { createSecretKey, type KeyObject } from 'node:crypto';
import jwt from 'jsonwebtoken';
import type { Role } from '@femtoslot/shared';
import type { AppContext } from '../context';
import { preparedQuery } from '../../db/prepared';

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
    /** reference_revision as read with the session user (see ReferenceCache). */
    referenceRevision?: string;
  }
}

// One key object per secret: handing jsonwebtoken a string makes it try (and fail) to read a public key on every call.
const keys = new Map<string, KeyObject>();
function keyFor(secret: string): KeyObject {
  let k = keys.get(secret);
  if (!k) keys.set(secret, (k = createSecretKey(Buffer.from(secret, 'utf8'))));
  return k;
}

export function issueSession(ctx: AppContext, res: Response, user: { id: string; sessionEpoch: number }): void {
  const ttlSeconds = Math.round(ctx.env.SESSION_TTL_HOURS * 3600);
  const token = jwt.sign({ sep: user.sessionEpoch }, keyFor(ctx.env.JWT_SECRET), { subject: user.id, expiresIn: ttlSeconds, algorithm: 'HS256', issuer: 'femtoslot' });
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
      let epoch = 0;
      try {
        const payload = jwt.verify(token, keyFor(ctx.env.JWT_SECRET), { algorithms: ['HS256'], issuer: 'femtoslot' });
        userId = typeof payload === 'object' ? payload.sub : undefined;
        epoch = typeof payload === 'object' && Number.isInteger(payload.sep) ? (payload.sep as number) : 0;
      } catch {
        userId = undefined;
      }
      if (userId && /^[0-9a-f-]{36}$/i.test(userId)) {
        // Every signed-in request runs this: one plain statement, no entity hydration, and the reference revision with
        // it so that a route that reads the cached reference data needs no statement of its own for that.
        const rows: { id: string; role: Role; organisation_id: string; email: string; name: string; revision: string }[] = await preparedQuery(ctx.db.manager, 'session-user',
          `SELECT u.id, u.role, u.organisation_id, u.email, u.name, r.revision::text AS revision
             FROM users u CROSS JOIN reference_revision r WHERE u.id = $1 AND u.active AND u.session_epoch = $2`, [userId, epoch]);
        const user = rows[0];
        if (user) {
          req.user = { id: user.id, role: user.role, organisationId: user.organisation_id, email: user.email, name: user.name };
          req.referenceRevision = user.revision;
        }
      }
    }
    next();
  };
}
