import type { NextFunction, Request, Response } from 'express';
import { AppError } from '../errors/app-error';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

function originOf(value: string | undefined): string | null {
  if (!value) return null;
  try {
    return new URL(value).origin;
  } catch {
    return 'invalid';
  }
}

/**
 * Cross-site request forgery guard for the cookie session: a state-changing request must come from the app's own
 * origin (Origin header, or Referer when Origin is absent). Requests carrying neither come from non-browser
 * clients, which cannot ride on a victim's cookie. Webhooks are signed and exempt.
 */
export function originCheck(appUrl: string, exemptPrefixes: string[] = ['/api/webhooks/']) {
  const appOrigin = new URL(appUrl).origin;
  return (req: Request, _res: Response, next: NextFunction) => {
    if (SAFE.has(req.method) || exemptPrefixes.some((p) => req.path.startsWith(p))) return next();
    const claimed = originOf(req.get('origin')) ?? originOf(req.get('referer'));
    if (claimed === null) return next();
    const selfOrigin = `${req.protocol}://${req.get('host')}`;
    if (claimed === appOrigin || claimed === selfOrigin) return next();
    next(new AppError('cross_site_request', 'This request did not come from Femtoslot itself and was refused', 403));
  };
}
