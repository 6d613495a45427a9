import type { Request, RequestHandler, Response, Router } from 'express';
import type { Role } from '@femtoslot/shared';
import { AppError, forbidden, unauthenticated } from '../errors/app-error';
import { idParamGuard, refuseUnstorableText } from '../http/request-guards';
import { isUuid } from '../ids';

export type Access = 'public' | 'signed_in' | readonly Role[];

/** One row of the router table; the security suite walks these rows to build its authorisation matrix. */
export interface RouteDef {
  method: 'get' | 'post' | 'patch' | 'put' | 'delete';
  path: string;
  access: Access;
  /** Whether a record of another organisation is refused or redacted (documents the rule for the matrix). */
  scope?: 'organisation' | 'facility';
  /** With scope 'organisation' and an `:id`: what the id names, so the security suite can try another organisation's. */
  owner?: 'booking' | 'usage_log' | 'attachment' | 'invoice' | 'account';
  before?: RequestHandler[];
  handler: (req: Request, res: Response) => Promise<void> | void;
}

export function guard(access: Access): RequestHandler {
  return (req, _res, next) => {
    if (access === 'public') return next();
    if (!req.user) return next(unauthenticated());
    if (access === 'signed_in' || access.includes(req.user.role)) return next();
    next(forbidden());
  };
}

/**
 * Every row gets the same edges, in this order: who may call it, ids that are UUIDs, the row's own parsers and limits
 * (multipart, rate limits), then no unstorable text anywhere in what was parsed.
 */
export function mount(router: Router, routes: RouteDef[]): void {
  for (const r of routes) {
    const ids = idParamGuard(r.path);
    router[r.method](r.path, guard(r.access), ...(ids ? [ids] : []), ...(r.before ?? []), refuseUnstorableText, r.handler);
  }
}

export function currentUser(req: Request) {
  if (!req.user) throw unauthenticated();
  return req.user;
}

export function param(req: Request, name: string): string {
  const v = req.params[name];
  if (!isUuid(v)) throw new AppError('not_found', 'No such record', 404);
  return v;
}
