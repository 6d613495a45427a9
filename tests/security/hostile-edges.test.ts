/**
 * Hostile requests at the edges, generated over the router table so that a new route is probed without being listed:
 * ids that are not UUIDs on every `:id` route, NUL and lone surrogates in every text field, body encodings, malformed
 * multipart on every upload route, and impossible dates. Never a 5xx; every refusal has the `{error:{code,message}}`
 * shape; the classes with one right answer are held to it. Each class prints `[hostile] …` with its counts
 * (docs/reliability.md quotes them).
 */
import { roles, type Role } from '@femtoslot/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RouteDef } from '@femtoslot/api/src/lib/auth/routes';
import { routeTable } from '@femtoslot/api/src/server';
import { makePeople, startTestApi, type TestApi } from '@femtoslot/api/src/test-support/test-api';
import { concretePath } from '../support/routes';
import { bodySamples, DATE, INSTANT, MONTH, querySamples, stringLeaves, withLeaf } from '../support/route-samples';
import { multipartVariants } from './support/multipart-variants';

type Agent = ReturnType<TestApi['http']> | Awaited<ReturnType<TestApi['signIn']>>;
type Res = { status: number; body: { error?: { code?: unknown; message?: unknown } }; headers: Record<string, string> };

let t: TestApi;
let agents: Record<Role, Agent>;
beforeAll(async () => {
  t = await startTestApi({ LOGIN_RATE_LIMIT: '100000', MAIL_RATE_LIMIT: '100000' });
  const { users } = await makePeople(t, [...roles]);
  agents = {} as typeof agents;
  for (const role of roles) agents[role] = await t.signIn(users[role]!.email);
});

const tallies = new Map<string, { tried: number; serverErrors: number; failures: string[] }>();
afterAll(async () => {
  for (const [name, c] of tallies) console.log(`[hostile] ${name}: ${c.tried} requests, ${c.serverErrors} 5xx, ${c.failures.length} failures`);
  await t?.close();
});

/** Counts one probe: never a 5xx, every refusal in the error shape, and whatever `expected` asks of the answer. */
function check(cls: string, label: string, res: Res, expected: (r: Res) => string | null = refused): void {
  const tally = tallies.get(cls) ?? { tried: 0, serverErrors: 0, failures: [] };
  tallies.set(cls, tally);
  tally.tried++;
  const shaped = typeof res.body?.error?.code === 'string' && typeof res.body.error.message === 'string';
  let wrong: string | null;
  if (res.status >= 500) { tally.serverErrors++; wrong = '5xx'; }
  else if (res.status >= 400 && !shaped) wrong = 'no {error:{code,message}} body';
  else wrong = expected(res);
  if (wrong) tally.failures.push(`${label} → ${res.status} ${JSON.stringify(res.body).slice(0, 160)} (${wrong})`);
}
const failuresOf = (cls: string) => tallies.get(cls)?.failures ?? ['no probes were sent'];
const refused = (r: Res) => (r.status >= 400 ? null : 'accepted');
/** For requests that a route may well take (it ignores its body): only the two rules above. */
const either = () => null;
const answer = (status: number | number[], code?: string) => (r: Res) => {
  const ok = (Array.isArray(status) ? status : [status]).includes(r.status) && (code === undefined || r.body.error?.code === code);
  return ok ? null : `expected ${status}${code ? ` ${code}` : ''}`;
};

const key = (r: RouteDef) => `${r.method} ${r.path}`;
/** An allowed caller, so that the probe reaches the edge it is meant for rather than the access guard. */
const agentFor = (r: RouteDef): Agent => r.access === 'public' ? t.http() : agents[r.access === 'signed_in' ? 'member' : r.access[0]!];
const table = () => routeTable(t.api.ctx);
const writes = () => table().filter((r) => r.method !== 'get');
const isUpload = (r: RouteDef) => (r.before ?? []).some((m) => m.name === 'multerMiddleware');
const send = (r: RouteDef, url: string) => agentFor(r)[r.method](url);

describe('hostile edges over the router table', () => {
  it('when the table is read, then every write route and every GET route with a query has an example request', () => {
    const missing = writes().filter((r) => !(key(r) in bodySamples)).map(key);
    expect(missing).toEqual([]);
    const stale = Object.keys({ ...bodySamples, ...querySamples }).filter((k) => !table().some((r) => key(r) === k));
    expect(stale).toEqual([]);
  });

  it('when an :id is 36 characters (or any length) but not a UUID, then 404 or 400 on every route with an id', async () => {
    const badIds = ['zzzzzzzz-zzzz-zzzz-zzzz-zzzzzzzzzzzz', '-'.repeat(36), '0123456789abcdef0123456789abcdef0123', '00000000-0000-4000-8000-00000000000g',
      '0000000-00000-4000-8000-000000000000', '00000000000000000000000000000000', '00000000-0000-4000-8000-0000000000000',
      '{00000000-0000-4000-8000-0000000000}', "0000000' OR '1'='1-0000-0000-00000000", '\u0000'.repeat(36), 'ä'.repeat(36), '9'.repeat(5000), '%ZZ', '%'];
    const idRoutes = table().filter((r) => /:(id|\w+Id)\b/.test(r.path));
    expect(idRoutes.length).toBeGreaterThan(20);
    for (const r of idRoutes) {
      for (const bad of badIds) {
        const raw = bad.startsWith('%') ? bad : encodeURIComponent(bad);
        const url = concretePath(r.path.replace(/:(id|\w+Id)\b/g, raw));
        const res = await send(r, url).set('Content-Type', 'application/json').send(JSON.stringify(bodySamples[key(r)] ?? {}));
        check('non-UUID ids', `${key(r)} with ${JSON.stringify(bad.slice(0, 40))}`, res, answer([400, 404]));
      }
    }
    expect(failuresOf('non-UUID ids')).toEqual([]);
  }, 300_000);

  it('when any text field of a JSON body holds NUL or a lone surrogate, then 400 invalid_text on every write route', async () => {
    const bad = [(v: string) => `${v}\u0000`, (v: string) => `${v}\uD800`, (v: string) => `\uDC00${v}`];
    for (const r of writes()) {
      const sample = bodySamples[key(r)] ?? {};
      const bodies = [
        ...stringLeaves(sample).flatMap((leaf) => bad.map((f) => ({ label: `${leaf.path.join('.')}`, body: withLeaf(sample, leaf.path, f(leaf.value)) }))),
        { label: 'an extra field', body: { ...sample, note: 'a\u0000b' } },
        { label: 'a key', body: { ...sample, 'na\u0000me': 'x' } },
        { label: 'an array of text', body: { ...sample, tags: ['ok', '\uDBFF'] } },
      ];
      for (const { label, body } of bodies) {
        const res = await send(r, concretePath(r.path)).set('Content-Type', 'application/json').send(JSON.stringify(body));
        check('NUL / lone surrogate in JSON text', `${key(r)} ${label}`, res, answer(400, 'invalid_text'));
      }
    }
    expect(failuresOf('NUL / lone surrogate in JSON text')).toEqual([]);
  }, 300_000);

  it('when a query or path parameter holds NUL, then 400 invalid_text on every GET route', async () => {
    for (const r of table().filter((x) => x.method === 'get')) {
      const sample = querySamples[key(r)] ?? {};
      const variants = [{ ...sample, probe: 'a\u0000b' }, ...Object.keys(sample).map((k) => ({ ...sample, [k]: `${sample[k]}\u0000` }))];
      for (const q of variants) {
        const res = await send(r, `${concretePath(r.path)}?${new URLSearchParams(q)}`);
        check('NUL in query or path text', `${key(r)} ?${new URLSearchParams(q)}`, res, answer(400, 'invalid_text'));
      }
    }
    // Path parameters that are not ids (an invitation token, a calendar feed's file name) are text too.
    for (const r of table().filter((x) => /:(token|file)\b/.test(x.path))) {
      const url = concretePath(r.path.replace(/:(token|file)\b/, `${'x'.repeat(24)}%00${'x'.repeat(8)}`));
      check('NUL in query or path text', `${key(r)} ${url}`, await send(r, url), answer(400, 'invalid_text'));
    }
    expect(failuresOf('NUL in query or path text')).toEqual([]);
  }, 300_000);

  it('when a date or instant is impossible (year 0000, offset beyond ±14:00, 30 February), then 400 validation_failed', async () => {
    const edges: [RegExp, string[]][] = [
      [INSTANT, ['0000-01-01T00:00:00Z', '0000-06-01T12:00:00+01:00', '2026-01-01T00:00:00+16:00', '2026-01-01T00:00:00-16:00', '2026-01-01T00:00:00+23:59',
        '2026-01-01T00:00:00+14:30', '2026-02-30T09:00:00Z', '2026-01-01T24:00:00Z', '2026-01-01T23:59:60Z', '2026-01-01T09:00:00', '+275760-09-13T00:00:00Z', '10000-01-01T00:00:00Z']],
      [DATE, ['2031-02-30', '2030-02-29', '0000-01-01', '2026-04-31', '2026-13-01', '2026-00-01']],
      [MONTH, ['0000-01', '2026-13', '2026-00']],
    ];
    const probes: { r: RouteDef; label: string; run: () => Promise<Res> }[] = [];
    for (const r of table()) {
      const body = bodySamples[key(r)];
      const query = querySamples[key(r)];
      for (const leaf of [...stringLeaves(body ?? {}), ...stringLeaves(query ?? {})]) {
        const values = edges.find(([pattern]) => pattern.test(leaf.value))?.[1] ?? [];
        for (const v of values) {
          probes.push(body
            ? { r, label: `${key(r)} ${leaf.path.join('.')}=${v}`, run: () => send(r, concretePath(r.path)).set('Content-Type', 'application/json').send(JSON.stringify(withLeaf(body, leaf.path, v))) }
            : { r, label: `${key(r)} ?${leaf.path.join('.')}=${v}`, run: () => send(r, `${concretePath(r.path)}?${new URLSearchParams(withLeaf(query!, leaf.path, v))}`) });
        }
      }
    }
    expect(probes.length).toBeGreaterThan(100);
    for (const p of probes) check('impossible dates', p.label, await p.run(), answer(400, 'validation_failed'));
    expect(failuresOf('impossible dates')).toEqual([]);
  }, 300_000);

  it('when the body has a charset, encoding, size or syntax the API does not take, then 415, 400 or 413 on every write route', async () => {
    const big = JSON.stringify({ filler: 'x'.repeat(4 * 1024 * 1024 + 10) });
    const variants: { name: string; type?: string; encoding?: string; body: string | Buffer; expect: (r: Res) => string | null }[] = [
      { name: 'charset koi8-xyz', type: 'application/json; charset=koi8-xyz', body: '{}', expect: answer(415, 'unsupported_charset') },
      // body-parser decodes the utf-* charsets iconv-lite knows (UTF-7 among them): refused later, or taken, but never a 5xx.
      { name: 'charset utf-7', type: 'application/json; charset=utf-7', body: '{}', expect: either },
      { name: 'Content-Encoding bogus', type: 'application/json', encoding: 'bogus', body: '{}', expect: answer(415, 'unsupported_encoding') },
      { name: 'Content-Encoding gzip, gzip-x', type: 'application/json', encoding: 'gzip, gzip-x', body: '{}', expect: answer(415, 'unsupported_encoding') },
      { name: 'gzip that is not gzip', type: 'application/json', encoding: 'gzip', body: '{"not":"compressed"}', expect: answer(400) },
      { name: 'deflate that is not deflate', type: 'application/json', encoding: 'deflate', body: Buffer.from([0xff, 0x00, 0x13, 0x37]), expect: answer(400) },
      { name: 'malformed JSON', type: 'application/json', body: '{"a": [1, 2', expect: answer(400, 'invalid_json') },
      { name: 'JSON null (not an object)', type: 'application/json', body: 'null', expect: answer(400) },
      { name: 'over 4 MB', type: 'application/json', body: big, expect: answer(413, 'payload_too_large') },
      { name: 'UTF-8 sent as UTF-16', type: 'application/json; charset=utf-16', body: '{"a":1}', expect: answer(400) },
      { name: 'text/plain', type: 'text/plain', body: '{}', expect: either },
    ];
    const targets: { label: string; agent: () => Agent; url: string; method: RouteDef['method'] }[] = [];
    for (const r of writes()) targets.push({ label: key(r), agent: () => agentFor(r), url: concretePath(r.path), method: r.method });
    // Stripe's webhook reads raw bytes through its own parser, outside the table: the same encodings and size apply.
    targets.push({ label: 'post /webhooks/stripe', agent: () => t.http(), url: '/api/webhooks/stripe', method: 'post' });
    for (const target of targets) {
      for (const v of variants) {
        if (target.label === 'post /webhooks/stripe' && !/Content-Encoding|gzip|deflate/.test(v.name)) continue;
        let req = target.agent()[target.method](target.url);
        if (v.type) req = req.set('Content-Type', v.type);
        if (v.encoding) req = req.set('Content-Encoding', v.encoding);
        const res = await req.send(v.body);
        check('body charset / encoding / size / syntax', `${target.label} ${v.name}`, res, v.expect);
      }
    }
    expect(failuresOf('body charset / encoding / size / syntax')).toEqual([]);
  }, 300_000);

  it('when a multipart body is malformed (no or wrong boundary, truncated, 100k-character file name, NUL), then 400 on every upload route', async () => {
    const uploads = table().filter(isUpload);
    expect(uploads.map(key)).toEqual(expect.arrayContaining(['post /bookings/:id/attachments', 'post /usage/:id/attachments', 'post /optics/autocorrelation']));
    for (const r of uploads) {
      for (const v of multipartVariants()) {
        const res = await send(r, concretePath(r.path)).set('Content-Type', v.type).send(v.body);
        check('malformed multipart', `${key(r)} ${v.name}`, res, v.malformed ? answer(400, 'bad_upload') : refused);
      }
    }
    expect(failuresOf('malformed multipart')).toEqual([]);
  }, 300_000);
});
