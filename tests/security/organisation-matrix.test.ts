import { roles, type Role } from '@femtoslot/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { routeTable } from '@femtoslot/api/src/server';
import type { RouteDef } from '@femtoslot/api/src/lib/auth/routes';
import { Account } from '@femtoslot/api/src/modules/accounts/account.entity';
import { giveLaserSafetyTraining } from '@femtoslot/api/src/test-support/training';
import { makeInstrument } from '@femtoslot/api/src/test-support/booking-fixture';
import { pastSession } from '@femtoslot/api/src/test-support/past-session';
import { makePeople, startTestApi, type TestApi } from '@femtoslot/api/src/test-support/test-api';

/**
 * The organisation dimension of the authorisation matrix: every organisation-scoped route with an `:id`, called by
 * each of the six roles of organisation A, with A's own record and with organisation B's. Generated from the router
 * table: a new such route that does not say what its id names fails the first test.
 */
type Owner = NonNullable<RouteDef['owner']>;
type Agent = Awaited<ReturnType<TestApi['signIn']>>;
const facilityWide = new Set<Role>(['staff', 'finance', 'admin']);

let t: TestApi;
let agents: Record<Role, Agent>;
const records: Record<'own' | 'other', Record<Owner, string>> = { own: {} as Record<Owner, string>, other: {} as Record<Owner, string> };
let otherMarker = '';

/** An organisation with every role, an approved account, a past session with a log and an attachment, and an invoice. */
async function organisationWithRecords(instrument: Awaited<ReturnType<typeof makeInstrument>>, hoursAgo: number, month: string) {
  const people = await makePeople(t, [...roles]);
  const db = t.api.ctx.db;
  const marker = `private-${people.tag}`;
  const account = await db.getRepository(Account).save({ organisationId: people.org.id, kind: 'cost_centre', name: `Account ${marker}`, costCentreCode: `CC-${people.tag}`, status: 'approved' } as Account);
  const pending = await db.getRepository(Account).save({ organisationId: people.org.id, kind: 'cost_centre', name: `Pending ${marker}`, costCentreCode: `CP-${people.tag}`, status: 'pending' } as Account);
  const member = people.users.member!;
  await giveLaserSafetyTraining(db, member.id);
  const start = new Date(Date.now() - hoursAgo * 3_600_000);
  start.setUTCMinutes(0, 0, 0);
  const booking = await pastSession(t, { instrumentId: instrument.instrument.id, configuration: instrument.configs.opa_signal, accountId: account.id, userId: member.id, organisationId: people.org.id, startsAt: start, hours: 2, nm: 1300 });
  await db.query(`UPDATE timeline_blocks SET purpose = $2 WHERE id = $1`, [booking.id, `Purpose ${marker}`]);
  const memberAgent = await t.signIn(member.email, people.password);
  const upload = await memberAgent.post(`/api/bookings/${booking.id}/attachments`).attach('file', Buffer.from(`delay_fs,signal\r\n0,1\r\n10,0.5\r\n`), { filename: `${marker}.csv`, contentType: 'text/csv' });
  expect(upload.status, JSON.stringify(upload.body)).toBe(201);
  const log = await memberAgent.post(`/api/bookings/${booking.id}/usage`).send({
    actualStartsAt: start.toISOString(), actualEndsAt: new Date(start.getTime() + 2 * 3_600_000).toISOString(), notes: `Notes ${marker}`,
    segments: [{ configurationId: instrument.configs.opa_signal.id, startsAt: start.toISOString(), endsAt: new Date(start.getTime() + 2 * 3_600_000).toISOString(), minNm: 1250, maxNm: 1350 }],
  });
  expect(log.status, JSON.stringify(log.body)).toBe(200);
  const [period] = await db.query(`INSERT INTO billing_periods (month, starts_at, ends_at, time_zone, status) VALUES ($1, $2, $3, 'UTC', 'closed') RETURNING id`,
    [month, `${month}-01T00:00:00Z`, `${month}-28T00:00:00Z`]);
  const [invoice] = await db.query(
    `INSERT INTO invoices (period_id, account_id, organisation_id, number, kind, status, currency, total_minor, lines) VALUES ($1, $2, $3, $4, 'internal', 'journal', 'USD', 12000, '[]') RETURNING id`,
    [period.id, account.id, people.org.id, `FS-TEST-${people.tag}`]);
  return { people, marker, ids: { booking: booking.id, usage_log: log.body.log.id as string, attachment: upload.body.attachment.id as string, invoice: invoice.id as string, account: pending.id } satisfies Record<Owner, string> };
}

beforeAll(async () => {
  t = await startTestApi();
  const instrument = await makeInstrument(t);
  const a = await organisationWithRecords(instrument, 30, '2001-01');
  const b = await organisationWithRecords(instrument, 60, '2001-02');
  records.own = a.ids;
  records.other = b.ids;
  otherMarker = b.marker;
  agents = {} as typeof agents;
  for (const role of roles) agents[role] = await t.signIn(a.people.users[role]!.email, a.people.password);
}, 120_000);
afterAll(async () => { await t?.close(); });

const scoped = () => routeTable(t.api.ctx).filter((r) => r.scope === 'organisation' && r.path.includes(':id'));
const url = (r: RouteDef, id: string) => `/api${r.path.replace(':id', id)}`;

describe('authorisation matrix: own and other organisation', () => {
  it('when the table is read, then every organisation-scoped route with an id says what the id names', () => {
    const routes = scoped();
    expect(routes.length).toBeGreaterThanOrEqual(10);
    for (const r of routes) expect(r.owner, `${r.method.toUpperCase()} ${r.path} has no owner`).toBeDefined();
  });

  it('when each role of one organisation calls each such route with another organisation’s record, then it is refused or redacted, and its own record is not refused to the owner, their PI or (to read) a colleague', async () => {
    const failures: string[] = [];
    for (const r of scoped()) {
      for (const role of roles) {
        const allowed = r.access === 'signed_in' || (r.access !== 'public' && r.access.includes(role));
        if (!allowed) continue; // the role guard is the other matrix's subject
        const other = await agents[role][r.method](url(r, records.other[r.owner!])).send({});
        const text = JSON.stringify(other.body ?? '') + (other.text ?? '');
        if (other.status >= 500) failures.push(`${r.method} ${r.path} as ${role}, other organisation → ${other.status}`);
        if (facilityWide.has(role)) {
          if (other.status === 403) failures.push(`${r.method} ${r.path} as ${role} (facility-wide), other organisation → 403`);
          continue;
        }
        // Busy/free may be shown (GET /bookings/:id), but nothing of the other organisation's own words or names.
        if (other.status < 300 && r.method !== 'get') failures.push(`${r.method} ${r.path} as ${role}, other organisation → ${other.status}`);
        if (other.status < 300 && text.includes(otherMarker)) failures.push(`${r.method} ${r.path} as ${role}, other organisation → ${other.status} with its details`);
        if (other.status >= 400 && other.status !== 403 && other.status !== 404 && r.method === 'get') failures.push(`${r.method} ${r.path} as ${role}, other organisation → ${other.status} (expected 403 or 404)`);
        // Writes on a record are for its owner (the member) and their PI; a colleague may still read it.
        if (r.method !== 'get' && role === 'collaborator') continue;
        const own = await agents[role][r.method](url(r, records.own[r.owner!])).send({});
        if (own.status === 403 || own.status >= 500) failures.push(`${r.method} ${r.path} as ${role}, own organisation → ${own.status} ${JSON.stringify(own.body)}`);
      }
    }
    expect(failures).toEqual([]);
  });
});
