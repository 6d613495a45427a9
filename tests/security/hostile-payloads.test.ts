import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { routeTable } from '@femtoslot/api/src/server';
import { makePeople, startTestApi, type TestApi } from '@femtoslot/api/src/test-support/test-api';
import { concretePath } from '../support/routes';

let t: TestApi;
let staff: Awaited<ReturnType<TestApi['signIn']>>;
let member: Awaited<ReturnType<TestApi['signIn']>>;
beforeAll(async () => {
  t = await startTestApi({ LOGIN_RATE_LIMIT: '10000' });
  const { users } = await makePeople(t, ['staff', 'member']);
  staff = await t.signIn(users.staff!.email);
  member = await t.signIn(users.member!.email);
});
afterAll(async () => { await t?.close(); });

const nasty = fc.constantFrom(
  "'; DROP TABLE users; --", '" OR 1=1 --', '<script>alert(1)</script>', '<img src=x onerror=alert(1)>', '../../../../etc/passwd',
  '\u0000', '\uFFFF\uD800', '${7*7}', '{{7*7}}', 'NaN', '-1e308', '2026-02-30T25:61:00Z', '00000000-0000-4000-8000-000000000000',
);
const leaf = fc.oneof(fc.string({ maxLength: 50 }), nasty, fc.integer(), fc.double(), fc.boolean(), fc.constant(null), fc.string({ minLength: 20_000, maxLength: 30_000 }));
const deep = fc.integer({ min: 50, max: 400 }).map((n) => { let v: unknown = 'x'; for (let i = 0; i < n; i++) v = { a: v }; return v; });
const withProto = fc.dictionary(fc.constantFrom('__proto__', 'constructor', 'prototype', 'email', 'startsAt', 'segments', 'role'), leaf, { maxKeys: 5 });
const payload = fc.oneof(fc.anything({ maxDepth: 3 }), fc.dictionary(fc.string({ maxLength: 12 }), leaf, { maxKeys: 8 }), deep, withProto, fc.array(leaf, { maxLength: 5 }));


describe('hostile payloads against every write route (fast-check)', () => {
  it('when wrong types, huge strings, deep nesting, injection strings or __proto__ keys are posted, then no 5xx and every 4xx has the error shape', async () => {
    const writes = routeTable(t.api.ctx).filter((r) => r.method !== 'get' && r.path !== '/auth/logout');
    expect(writes.length).toBeGreaterThan(20);
    const failures: string[] = [];
    let tried = 0;
    let serverErrors = 0;
    for (const r of writes) {
      await fc.assert(fc.asyncProperty(payload, fc.boolean(), async (body, asStaff) => {
        const agent = asStaff ? staff : member;
        const raw = JSON.stringify(body) ?? 'null';
        const res = await agent[r.method](concretePath(r.path)).set('Content-Type', 'application/json').send(raw);
        tried++;
        if (res.status >= 500) serverErrors++;
        if (res.status >= 500 || (res.status >= 400 && !(res.body?.error?.code && typeof res.body.error.message === 'string'))) {
          failures.push(`${r.method} ${r.path} → ${res.status} ${JSON.stringify(res.body).slice(0, 200)} for ${raw.slice(0, 120)}`);
        }
        return true;
      }), { numRuns: 12, seed: 20261201 });
    }
    console.log(`[hostile] fast-check payloads (wrong types, huge and deep bodies, injection strings, __proto__ keys): ${tried} requests, ${serverErrors} 5xx, ${failures.length} failures`);
    expect(failures).toEqual([]);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });
});
