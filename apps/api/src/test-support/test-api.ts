import { randomUUID } from 'node:crypto';
import net from 'node:net';
import type { Role } from '@femtoslot/shared';
import supertest from 'supertest';
import { loadEnv, type Env } from '../config/env';
import { startApi, type RunningApi } from '../index';
import { hashPassword } from '../lib/auth/passwords';
import { Organisation } from '../modules/organisations/organisation.entity';
import { User } from '../modules/users/user.entity';

function required(name: string): string {
  const v = process.env[name];
  if (!v) throw new Error(`${name} is not set: run the suites through \`npm test\`, which starts PostgreSQL and the mail capture`);
  return v;
}

export function testEnv(overrides: Record<string, string> = {}): Env {
  return loadEnv({
    NODE_ENV: 'test', HOST: '127.0.0.1', PORT: '0',
    DATABASE_URL: required('TEST_DATABASE_URL'), DATA_DIR: required('TEST_DATA_DIR'),
    SMTP_HOST: '127.0.0.1', SMTP_PORT: required('TEST_SMTP_PORT'),
    LOG_LEVEL: 'silent', OUTBOX_RETRY_DELAY_SECONDS: '1',
    ...overrides,
  });
}

export interface TestApi {
  api: RunningApi;
  http: () => ReturnType<typeof supertest>;
  /** A cookie-keeping client, signed in as the given user. */
  signIn(email: string, password?: string): Promise<ReturnType<typeof supertest.agent>>;
  close(): Promise<void>;
}

export async function startTestApi(overrides: Record<string, string> = {}, opts: Parameters<typeof startApi>[1] = {}): Promise<TestApi> {
  const api = await startApi(testEnv({ ...overrides, APP_URL: overrides.APP_URL ?? 'http://127.0.0.1:1' }), { pollingIntervalSeconds: 0.5, ...opts });
  return {
    api,
    http: () => supertest(api.url),
    async signIn(email, password = 'correct horse battery') {
      const agent = supertest.agent(api.url);
      const r = await agent.post('/api/auth/login').send({ email, password });
      if (r.status !== 200) throw new Error(`sign-in as ${email} failed: ${r.status} ${JSON.stringify(r.body)}`);
      return agent;
    },
    close: () => api.close(),
  };
}

export const uniqueTag = () => randomUUID().slice(0, 8);

/** Creates an organisation and one user per role asked for, each with the same known password. */
export async function makePeople(t: TestApi, roles: Role[], password = 'correct horse battery') {
  const tag = uniqueTag();
  const db = t.api.ctx.db;
  const org = await db.getRepository(Organisation).save({ name: `Test org ${tag}`, kind: 'internal' });
  const hash = await hashPassword(password);
  const users: Record<string, User> = {};
  for (const role of roles) {
    users[role] = await db.getRepository(User).save({ email: `${role}.${tag}@example.test`, name: `${role} ${tag}`, role, organisationId: org.id, passwordHash: hash, active: true });
  }
  return { org, users, tag, password };
}

export function freeLoopbackPort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.on('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}
