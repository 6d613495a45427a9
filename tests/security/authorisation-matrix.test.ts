import { roles, type Role } from '@femtoslot/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { routeTable } from '@femtoslot/api/src/server';
import { makePeople, startTestApi, type TestApi } from '@femtoslot/api/src/test-support/test-api';
import { concretePath } from '../support/routes';

let t: TestApi;
let agents: Record<Role, Awaited<ReturnType<TestApi['signIn']>>>;
beforeAll(async () => {
  t = await startTestApi();
  const { users } = await makePeople(t, [...roles]);
  agents = {} as typeof agents;
  for (const role of roles) agents[role] = await t.signIn(users[role]!.email);
});
afterAll(async () => { await t?.close(); });


describe('authorisation matrix, generated from the router table', () => {
  it('when the table is read, then every route states who may call it', () => {
    const table = routeTable(t.api.ctx);
    expect(table.length).toBeGreaterThan(30);
    for (const r of table) {
      const ok = r.access === 'public' || r.access === 'signed_in' || (Array.isArray(r.access) && r.access.length > 0 && r.access.every((x) => (roles as readonly string[]).includes(x)));
      expect(ok, `${r.method.toUpperCase()} ${r.path} has no valid access rule`).toBe(true);
    }
  });

  it('when each role calls each route, then the guard answers 401 signed out, 403 for a role it excludes, and lets allowed roles through', async () => {
    const failures: string[] = [];
    for (const r of routeTable(t.api.ctx)) {
      const url = concretePath(r.path);
      const anonymous = await t.http()[r.method](url).send({});
      if (r.access !== 'public' && anonymous.status !== 401) failures.push(`${r.method} ${r.path} signed out → ${anonymous.status}`);
      if (r.access === 'public') continue;
      for (const role of roles) {
        const res = await agents[role][r.method](url).send({});
        const allowed = r.access === 'signed_in' || r.access.includes(role);
        if (!allowed && !(res.status === 403 && res.body?.error?.code === 'forbidden')) failures.push(`${r.method} ${r.path} as ${role} → ${res.status} (expected 403)`);
        if (allowed && res.status === 403 && res.body?.error?.code === 'forbidden' && !r.scope) failures.push(`${r.method} ${r.path} as ${role} → 403 although allowed`);
        if (res.status >= 500) failures.push(`${r.method} ${r.path} as ${role} → ${res.status}`);
        if (res.status >= 400 && !(res.body?.error?.code && res.body?.error?.message) && !res.headers['content-type']?.includes('text/csv')) failures.push(`${r.method} ${r.path} as ${role} → ${res.status} without the error shape`);
      }
    }
    expect(failures).toEqual([]);
  });
});
