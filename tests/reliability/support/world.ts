import type { DataSource } from 'typeorm';
import { createDataSource } from '@femtoslot/api/src/db/data-source';
import { seedDemo } from '@femtoslot/api/src/db/seed/seed';
import { scratchDatabase } from '@femtoslot/api/src/test-support/scratch-database';
import type { TestApi } from '@femtoslot/api/src/test-support/test-api';
import { signIn, type Session } from './api-process';

export const sessionOf = (agent: unknown) => agent as Session;

export interface ScratchWorld {
  url: string;
  db: DataSource;
  /**
   * What the shared fixtures (makeInstrument, makeBooker, makePeople) need: the database, and sign-in at `base`.
   * Its signIn hands back a Session (cookie usable on every process), where the fixtures type a supertest agent.
   */
  fixtureApi(base: string): TestApi;
  close(): Promise<void>;
}

/**
 * A database of its own (every API process on it works the same pg-boss queues, so no other test file may share it),
 * optionally with the demo seed (facility policies and the eyewear list that bookings are checked against).
 */
export async function scratchWorld({ seed }: { seed: boolean }): Promise<ScratchWorld> {
  const scratch = await scratchDatabase();
  const db = createDataSource(scratch.url, 4);
  await db.initialize();
  if (seed) await seedDemo(db);
  return {
    url: scratch.url,
    db,
    fixtureApi: (base) => ({
      api: { ctx: { db } },
      signIn: (email: string, password?: string) => signIn(base, email, password),
      close: async () => undefined,
    }) as unknown as TestApi,
    close: async () => { await db.destroy().catch(() => undefined); await scratch.drop(); },
  };
}
