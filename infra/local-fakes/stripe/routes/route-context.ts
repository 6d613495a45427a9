import type { Request, Response } from 'express';
import type { Actor, BillingContext } from '../billing';

export interface RouteContext extends BillingContext {
  /** Base URL written into `hosted_invoice_url`; by default the address the request came in on. */
  publicUrl?: string;
}

export function baseUrl(context: RouteContext, req: Request): string {
  return context.publicUrl ?? `${req.protocol}://${req.get('host') ?? '127.0.0.1'}`;
}

export function actorOf(context: RouteContext, req: Request, res: Response): Actor {
  return {
    requestId: (res.locals.requestId as string | undefined) ?? null,
    idempotencyKey: (res.locals.idempotencyKey as string | undefined) ?? null,
    apiVersion: String(res.locals.apiVersion),
    baseUrl: baseUrl(context, req),
  };
}

/** Express 5 types route params as string | string[]; our routes only use single segments. */
export function pathId(req: Request, name = 'id'): string {
  return String(req.params[name]);
}
