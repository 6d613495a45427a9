import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { freePastSlot, pastSession } from '@femtoslot/api/src/test-support/past-session';
import type { TestApi } from '@femtoslot/api/src/test-support/test-api';
import { Account } from '@femtoslot/api/src/modules/accounts/account.entity';
import { Configuration } from '@femtoslot/api/src/modules/instruments/configuration.entity';
import { Instrument } from '@femtoslot/api/src/modules/instruments/instrument.entity';
import { User } from '@femtoslot/api/src/modules/users/user.entity';

/** Writes `contents` as artifacts/fixtures/`name` (for a browser to upload) and returns its path. */
export function fixtureFile(name: string, contents: string): string {
  const dir = path.join(process.env.ARTIFACTS_DIR ?? 'artifacts', 'fixtures');
  mkdirSync(dir, { recursive: true });
  const file = path.join(dir, name);
  writeFileSync(file, contents);
  return file;
}

/** A one-hour 800 nm session of the demo member on the Aurora line's fundamental, ended within the last hour or so. */
export async function memberPastFundamentalSession(t: TestApi) {
  const db = t.api.ctx.db;
  const member = await db.getRepository(User).findOneByOrFail({ email: 'member@harrowpoint.test' });
  const account = await db.getRepository(Account).findOneByOrFail({ organisationId: member.organisationId });
  const aurora = await db.getRepository(Instrument).findOneByOrFail({ name: 'Aurora line' });
  const fundamental = await db.getRepository(Configuration).findOneByOrFail({ instrumentId: aurora.id, key: 'fundamental' });
  const start = await freePastSlot(db, aurora.id, 1, new Date(Date.now() - 3_600_000));
  const session = await pastSession(t, { instrumentId: aurora.id, configuration: fundamental, accountId: account.id, userId: member.id, organisationId: member.organisationId, startsAt: start, hours: 1, nm: 800 });
  return { db, session };
}
