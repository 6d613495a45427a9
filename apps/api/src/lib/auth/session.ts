import type { NextFunction, Request, Response } from 'express';
import { createSecretKey, randomUUID, type KeyObject } from 'node:crypto';
import jwt from 'jsonwebtoken';
import type { Role } from '@femtoslot/shared';
import type { AppContext } from '../context';
import { preparedQuery } from '../../db/prepared';
import { isUuid } from '../ids';

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
    /** The signed-in session's token id and expiry, for signing it out. */
    session?: { id: string; expiresAt: Date };
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
  const token = jwt.sign({ sep: user.sessionEpoch }, keyFor(ctx.env.JWT_SECRET), { subject: user.id, expiresIn: ttlSeconds, algorithm: 'HS256', issuer: 'femtoslot', jwtid: randomUUID() });
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

/**
 * Signing out ends this session only. Raising the session epoch would end every device's session (right for a password
 * reset, which is about a stolen credential), but "sign out" on one device is expected to leave the others signed in.
 * So the token's id goes on a deny list in PostgreSQL, shared by every API process, until the token expires by itself;
 * expired rows are cleared by the next sign-out, so the list holds at most one TTL's worth of sign-outs.
 */
export async function revokeSession(ctx: AppContext, req: Request): Promise<void> {
  if (!req.user || !req.session) return;
  await ctx.db.query(
    `WITH cleared AS (DELETE FROM revoked_sessions WHERE expires_at < now())
     INSERT INTO revoked_sessions (jti, user_id, expires_at) VALUES ($1, $2, $3) ON CONFLICT (jti) DO NOTHING`,
    [req.session.id, req.user.id, req.session.expiresAt]);
}

/** Reads the cookie and loads the user fresh from the database, so role changes and deactivation apply at once. */
export function authenticate(ctx: AppContext) {
  return async (req: Request, _res: Response, next: NextFunction) => {
    const token = req.cookies?.[SESSION_COOKIE];
    if (typeof token === 'string' && token.length > 0) {
      let claims: { userId: string; epoch: number; id: string; exp: number } | undefined;
      try {
        const payload = jwt.verify(token, keyFor(ctx.env.JWT_SECRET), { algorithms: ['HS256'], issuer: 'femtoslot' });
        if (typeof payload === 'object' && isUuid(payload.sub) && isUuid(payload.jti) && typeof payload.exp === 'number') {
          claims = { userId: payload.sub, epoch: Number.isInteger(payload.sep) ? (payload.sep as number) : 0, id: payload.jti, exp: payload.exp };
        }
      } catch {
        claims = undefined;
      }
      // A token without an id cannot be signed out, so it is not honoured (tokens are issued with one).
      if (claims) {
        // Every signed-in request runs this: one plain statement, no entity hydration, and the reference revision with
        // it so that a route that reads the cached reference data needs no statement of its own for that.
        const rows: { id: string; role: Role; organisation_id: string; email: string; name: string; revision: string }[] = await preparedQuery(ctx.db.manager, 'session-user-v2',
          `SELECT u.id, u.role, u.organisation_id, u.email, u.name, r.revision::text AS revision
             FROM users u CROSS JOIN reference_revision r WHERE u.id = $1 AND u.active AND u.session_epoch = $2
              AND NOT EXISTS (SELECT 1 FROM revoked_sessions s WHERE s.jti = $3)`, [claims.userId, claims.epoch, claims.id]);
        const user = rows[0];
        if (user) {
          req.user = { id: user.id, role: user.role, organisationId: user.organisation_id, email: user.email, name: user.name };
          req.referenceRevision = user.revision;
          req.session = { id: claims.id, expiresAt: new Date(claims.exp * 1000) };
        }
      }
    }
    next();
  };
}
