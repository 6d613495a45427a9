import type { RequestHandler } from 'express';
import { AppError } from '../errors/app-error';
import { isUuid } from '../ids';

/** Route parameters that name a record: `:id` and `:somethingId`. Tokens and file names are not ids. */
const ID_PARAM = /:(id|[a-z]\w*Id)\b/g;

/**
 * For a router-table path with id parameters, a guard that refuses any value that is not a UUID before the route runs
 * (404, as for an id that names nothing: no record can have it). Built from the path, so every route gets it.
 */
export function idParamGuard(path: string): RequestHandler | null {
  const names = [...path.matchAll(ID_PARAM)].map((m) => m[1]!);
  if (names.length === 0) return null;
  return (req, _res, next) => {
    next(names.every((n) => isUuid(req.params[n])) ? undefined : new AppError('not_found', 'No such record', 404));
  };
}

// PostgreSQL cannot store U+0000 in text or jsonb (22021 / 22P05); a lone surrogate is not Unicode text at all and
// comes out as U+FFFD (or an error) wherever it is encoded to UTF-8.
const UNSTORABLE = /\u0000|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

type Path = (string | number)[];

/** The path to the first string (or object key) in `value` that holds NUL or a lone surrogate; iterative, so depth is no risk. */
function firstUnstorable(value: unknown): Path | null {
  const stack: [unknown, Path][] = [[value, []]];
  while (stack.length > 0) {
    const [v, path] = stack.pop()!;
    if (typeof v === 'string') {
      if (UNSTORABLE.test(v)) return path;
    } else if (Array.isArray(v)) {
      for (let i = v.length - 1; i >= 0; i--) stack.push([v[i], [...path, i]]);
    } else if (v && typeof v === 'object' && !ArrayBuffer.isView(v)) {
      for (const [k, child] of Object.entries(v)) {
        if (UNSTORABLE.test(k)) return [...path, k];
        stack.push([child, [...path, k]]);
      }
    }
  }
  return null;
}

/**
 * One check for every text that arrives (JSON or form body, query string, path parameters), before any route sees it: NUL and lone
 * surrogates are refused with 400 invalid_text, naming where, instead of failing deep inside (a 500 from PostgreSQL).
 */
export const refuseUnstorableText: RequestHandler = (req, _res, next) => {
  for (const [location, value] of [['body', req.body], ['query', req.query], ['path', req.params]] as const) {
    const path = firstUnstorable(value);
    if (path) {
      return next(new AppError('invalid_text', 'Text may not contain NUL characters (U+0000) or unpaired UTF-16 surrogates', 400, [{ location, path }]));
    }
  }
  next();
};
