import type { Response } from 'express';
import { QueryFailedError, type DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDataSource } from '../../../db/data-source';
import { errorHandler } from '../../../lib/errors/error-handler';
import { Account } from '../../accounts/account.entity';
import { Configuration } from '../../instruments/configuration.entity';
import { Instrument } from '../../instruments/instrument.entity';
import { Organisation } from '../../organisations/organisation.entity';
import { User } from '../../users/user.entity';
import { TimelineBlock } from '../timeline-block.entity';
import { uniqueTag } from '../../../test-support/test-api';

let a: DataSource;
let b: DataSource;
beforeAll(async () => {
  a = await createDataSource(process.env.TEST_DATABASE_URL!, 2).initialize();
  b = await createDataSource(process.env.TEST_DATABASE_URL!, 2).initialize();
});
afterAll(async () => { await a?.destroy(); await b?.destroy(); });

async function fixture() {
  const tag = uniqueTag();
  const org = await a.getRepository(Organisation).save({ name: `Org ${tag}`, kind: 'internal' });
  const user = await a.getRepository(User).save({ email: `u.${tag}@example.test`, name: 'U', role: 'member', organisationId: org.id, passwordHash: null, active: true });
  const account = await a.getRepository(Account).save({ organisationId: org.id, kind: 'cost_centre', name: 'CC', costCentreCode: `CC-${tag}`, status: 'approved' });
  const instrument = await a.getRepository(Instrument).save({ name: `Source ${tag}`, kind: 'source', retuneMinutesPerNm: 0, warmupAfterMaintenanceMinutes: 0, pulseCheckMinutes: 0, defaultChangeoverMinutes: 0 });
  const configuration = await a.getRepository(Configuration).save({
    instrumentId: instrument.id, key: 'fundamental', name: 'Fundamental', outputKind: 'fundamental', minNm: 780, maxNm: 820, defaultNm: 800, rateClass: 'standard', requiredOdBands: [{ minNm: 740, maxNm: 1100, od: 7 }], retuneMinutesPerNm: null,
  });
  const booking = (startsAt: string, endsAt: string, status: TimelineBlock['status'] = 'approved') => ({
    instrumentId: instrument.id, kind: 'booking' as const, status, startsAt: new Date(startsAt), endsAt: new Date(endsAt), configurationId: configuration.id,
    targetMinNm: 800, targetMaxNm: 800, accountId: account.id, userId: user.id, organisationId: org.id, purpose: 'test',
  });
  return { instrument, booking };
}

function statusOf(err: unknown): { status: number; body: { error: { code: string } } } {
  const out = { status: 0, body: { error: { code: '' } } };
  const res = { status(s: number) { out.status = s; return this; }, json(b: typeof out.body) { out.body = b; return this; } } as unknown as Response;
  errorHandler(err, { log: { error() {} } } as never, res, () => {});
  return out;
}

describe('one timeline per instrument, enforced by PostgreSQL', () => {
  it('when two overlapping bookings race on two connections, then exactly one commits and the other gets 409 overlap', async () => {
    const { booking } = await fixture();
    const attempt = (ds: DataSource, s: string, e: string) => ds.transaction(async (m) => {
      await m.getRepository(TimelineBlock).insert(booking(s, e));
      await new Promise((r) => setTimeout(r, 50)); // hold the transaction open so the two truly overlap in time
    });
    const results = await Promise.allSettled([
      attempt(a, '2031-05-05T13:00:00Z', '2031-05-05T16:00:00Z'),
      attempt(b, '2031-05-05T15:00:00Z', '2031-05-05T18:00:00Z'),
    ]);
    const won = results.filter((r) => r.status === 'fulfilled');
    const lost = results.filter((r): r is PromiseRejectedResult => r.status === 'rejected');
    expect(won).toHaveLength(1);
    expect(lost).toHaveLength(1);
    expect(lost[0]!.reason).toBeInstanceOf(QueryFailedError);
    expect((lost[0]!.reason as { driverError: { code: string } }).driverError.code).toBe('23P01');
    expect(statusOf(lost[0]!.reason)).toMatchObject({ status: 409, body: { error: { code: 'overlap' } } });
  });

  it('when maintenance overlaps an active booking, then it is refused; a cancelled booking does not block', async () => {
    const { instrument, booking } = await fixture();
    await a.getRepository(TimelineBlock).insert(booking('2031-06-01T13:00:00Z', '2031-06-01T16:00:00Z'));
    await a.getRepository(TimelineBlock).insert(booking('2031-06-02T13:00:00Z', '2031-06-02T16:00:00Z', 'cancelled'));
    const maintenance = (s: string, e: string) => a.getRepository(TimelineBlock).insert({
      instrumentId: instrument.id, kind: 'maintenance', status: 'scheduled', startsAt: new Date(s), endsAt: new Date(e), reason: 'pump service',
    });
    await expect(maintenance('2031-06-01T15:00:00Z', '2031-06-01T17:00:00Z')).rejects.toMatchObject({ driverError: { code: '23P01' } });
    await expect(maintenance('2031-06-02T12:00:00Z', '2031-06-02T17:00:00Z')).resolves.toBeDefined();
  });

  it('when two bookings only touch end to start, then both are allowed (half-open ranges)', async () => {
    const { booking } = await fixture();
    await a.getRepository(TimelineBlock).insert(booking('2031-07-01T13:00:00Z', '2031-07-01T14:00:00Z'));
    await expect(a.getRepository(TimelineBlock).insert(booking('2031-07-01T14:00:00Z', '2031-07-01T15:00:00Z'))).resolves.toBeDefined();
  });

  it('when a block ends before it starts, or a configuration range is inverted, then a CHECK refuses it (422)', async () => {
    const { booking, instrument } = await fixture();
    const bad = a.getRepository(TimelineBlock).insert(booking('2031-08-01T14:00:00Z', '2031-08-01T13:00:00Z'));
    await expect(bad).rejects.toMatchObject({ driverError: { code: '23514' } });
    const err = await a.getRepository(Configuration).insert({
      instrumentId: instrument.id, key: 'inverted', name: 'x', outputKind: 'shg', minNm: 410, maxNm: 390, defaultNm: 400, rateClass: 'standard', requiredOdBands: [{ minNm: 380, maxNm: 900, od: 6 }],
    }).catch((e) => e);
    expect(statusOf(err)).toMatchObject({ status: 422, body: { error: { code: 'rule_violation' } } });
  });
});
