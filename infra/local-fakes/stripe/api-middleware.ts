import type { RequestHandler } from 'express';
import { StripeError } from './stripe-error';
import { type FakeStore, type IdempotencyRecord, newId, nowSeconds } from './store';

export const DEFAULT_API_VERSION = '2026-10-28.endive'; // the version stripe-node 23.1 pins

export const requestContext: RequestHandler = (req, res, next) => {
  const requestId = newId('req', 14);
  res.locals.requestId = requestId;
  res.locals.apiVersion = req.get('stripe-version') ?? DEFAULT_API_VERSION;
  res.setHeader('Request-Id', requestId);
  res.setHeader('Stripe-Version', res.locals.apiVersion as string);
  next();
};

function keyFromRequest(header: string | undefined): string | null {
  if (!header) return null;
  const [scheme, value = ''] = header.split(' ', 2);
  if (scheme?.toLowerCase() === 'bearer') return value.trim() || null;
  if (scheme?.toLowerCase() === 'basic') {
    // curl -u sk_test_…: sends the key as the Basic user with an empty password
    const decoded = Buffer.from(value, 'base64').toString('utf8');
    return decoded.split(':', 1)[0] || null;
  }
  return null;
}

function unauthorized(message: string): StripeError {
  return new StripeError(401, 'invalid_request_error', message, { savedForIdempotency: false });
}

/** Accepts the listed keys, or when none are listed any test-mode secret key (`sk_test_…`). */
export function authenticate(acceptedKeys: readonly string[] | undefined): RequestHandler {
  return (req, res, next) => {
    const key = keyFromRequest(req.get('authorization'));
    if (!key) {
      throw unauthorized('No API key provided. Send it as "Authorization: Bearer sk_test_…" or as the HTTP Basic user name.');
    }
    if (key.startsWith('sk_live_') || key.startsWith('rk_live_')) {
      throw unauthorized('This local Stripe fake refuses live-mode keys; use a test key (sk_test_…).');
    }
    const accepted = acceptedKeys?.length ? acceptedKeys.includes(key) : key.startsWith('sk_test_');
    if (!accepted) throw unauthorized(`Invalid API Key provided: ${key.slice(0, 8)}${'*'.repeat(4)}${key.slice(-4)}`);
    res.locals.apiKey = key;
    next();
  };
}

function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`;
  if (value && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonical(v)}`).join(',')}}`;
  }
  return JSON.stringify(value ?? null);
}

/**
 * Stripe's idempotency layer (API reference, "Idempotent requests"): POST only, keys scoped to the API
 * key, the first saved result replayed for the same parameters, an `idempotency_error` for different ones.
 * Results are saved only once the endpoint has started executing (see `savedForIdempotency`).
 */
export function idempotency(store: FakeStore): RequestHandler {
  const inFlight = new Set<string>();
  return (req, res, next) => {
    const key = req.get('idempotency-key');
    if (req.method !== 'POST' || key === undefined) return next();
    if (key.length === 0 || key.length > 255) {
      throw new StripeError(400, 'invalid_request_error', 'Idempotency-Key must be 1 to 255 characters.', {
        savedForIdempotency: false,
      });
    }
    res.locals.idempotencyKey = key;
    const scope = `${String(res.locals.apiKey)}\n${key}`;
    const fingerprint = `${req.method} ${req.path} ${canonical(req.body ?? {})}`;
    let saved: IdempotencyRecord | undefined = store.data.idempotency[scope];
    // Stripe may prune keys once they are 24 hours old; after that the key runs a new request
    if (saved && nowSeconds() - saved.createdAt > 86_400) {
      delete store.data.idempotency[scope];
      saved = undefined;
    }
    if (saved) {
      if (saved.fingerprint !== fingerprint) {
        throw new StripeError(
          400,
          'idempotency_error',
          `Idempotency-Key '${key}' was first used with other parameters or another endpoint; use a new key for a different request.`,
          { savedForIdempotency: false },
        );
      }
      res.setHeader('Idempotent-Replayed', 'true');
      res.setHeader('Original-Request', saved.requestId);
      res.status(saved.status).json(saved.body);
      return;
    }
    if (inFlight.has(scope)) {
      throw new StripeError(409, 'idempotency_error', `A request with Idempotency-Key '${key}' is still being processed.`, {
        code: 'idempotency_key_in_use',
        savedForIdempotency: false,
      });
    }
    inFlight.add(scope);
    res.on('close', () => inFlight.delete(scope));
    const json = res.json.bind(res);
    res.json = (body: unknown) => {
      inFlight.delete(scope);
      if (res.locals.savedForIdempotency !== false) {
        store.data.idempotency[scope] = {
          fingerprint,
          status: res.statusCode,
          body,
          requestId: String(res.locals.requestId),
          createdAt: nowSeconds(),
        };
        store.changed();
      }
      return json(body);
    };
    next();
  };
}
