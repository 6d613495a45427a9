/**
 * The bench's data, inserted with SQL (fast): 32 bench sources with the demo configurations and changeover model,
 * 200 organisations with one approved account and one trained user each, 20,000 past bookings over about six months
 * (5,000 of them, in one month, with confirmed session logs for the period close), and 300 bookings in the current
 * week on the demo source for the browser render. Names are invented for the bench.
 */
import { randomUUID } from 'node:crypto';
import pg from 'pg';
import { changeoverMinutes, defaultChangeoverModel, localDate, zonedToUtc, type SourceState } from '@femtoslot/shared';
import { hashPassword } from '../../apps/api/src/lib/auth/passwords';

export const BENCH_PASSWORD = 'bench horse battery staple';
export const INSTRUMENTS = 32;
export const ACCOUNTS = 200;
export const TOTAL_BOOKINGS = 20_000;
export const CLOSE_SESSIONS = 5_000;
export const RENDER_EVENTS = 300;
const HOUR = 3_600_000;
const DAY = 24 * HOUR;

export interface BenchInstrument { id: string; name: string; configs: Record<string, string> }
export interface BenchWorld {
  timeZone: string;
  instruments: BenchInstrument[];
  booker: { email: string; userId: string; organisationId: string; accountId: string };
  finance: { email: string };
  closeMonth: string;
  /** A week in the close month on the first bench source (about 40 bookings). */
  queryWeek: { from: string; to: string; instrumentId: string };
  renderWeek: { from: string; to: string; instrumentId: string };
  seededBookings: number;
}

/** The rotation of source states; every gap below is checked against the changeover engine. */
const states: SourceState[] = [
  { configurationKey: 'fundamental', nm: 800 }, { configurationKey: 'opa_signal', nm: 1310 }, { configurationKey: 'opa_idler', nm: 2050 },
  { configurationKey: 'dfg', nm: 4260 }, { configurationKey: 'shg', nm: 400 },
];

const monthOf = (d: Date, tz: string) => localDate(d, tz).slice(0, 7);
function shiftMonth(month: string, by: number): string {
  const [y, m] = month.split('-').map(Number) as [number, number];
  const t = y * 12 + (m - 1) + by;
  return `${Math.floor(t / 12)}-${String((t % 12) + 1).padStart(2, '0')}`;
}
const monthStart = (month: string, tz: string) => {
  const [year, m] = month.split('-').map(Number) as [number, number];
  return zonedToUtc({ year, month: m, day: 1, hour: 0, minute: 0 }, tz);
};

async function insertRows(c: pg.Client, table: string, columns: Record<string, string>, rows: Record<string, unknown>[]): Promise<void> {
  const names = Object.keys(columns);
  for (let i = 0; i < rows.length; i += 4000) {
    const chunk = rows.slice(i, i + 4000);
    const params = names.map((n) => chunk.map((r) => r[n] ?? null));
    const select = names.map((n, k) => `unnest($${k + 1}::${columns[n]}[])`).join(', ');
    await c.query(`INSERT INTO ${table} (${names.join(', ')}) SELECT ${select}`, params);
  }
}

export async function seedBenchWorld(databaseUrl: string, now = new Date()): Promise<BenchWorld> {
  const c = new pg.Client({ connectionString: databaseUrl });
  await c.connect();
  try {
    await c.query('BEGIN');
    const [{ time_zone: timeZone }] = (await c.query(`SELECT time_zone FROM facility_settings WHERE id = 1`)).rows;
    const [aurora] = (await c.query(`SELECT id FROM instruments WHERE name = 'Aurora line'`)).rows as { id: string }[];
    if (!aurora) throw new Error('the demo seed (Aurora line) is missing');
    const m = defaultChangeoverModel;
    await c.query(`INSERT INTO instruments (name, kind, description, pump_nm, retune_minutes_per_nm, warmup_after_maintenance_minutes, pulse_check_minutes, default_changeover_minutes)
      SELECT 'Bench source ' || lpad(g::text, 2, '0'), 'source', 'Invented for the benchmark', 800, $1, $2, $3, $4 FROM generate_series(1, $5) g`,
    [m.retuneMinutesPerNm, m.warmupAfterMaintenanceMinutes, m.pulseCheckMinutes, m.defaultBaseMinutes, INSTRUMENTS]);
    await c.query(`INSERT INTO configurations (instrument_id, key, name, output_kind, min_nm, max_nm, default_nm, rate_class, required_od_bands, retune_minutes_per_nm)
      SELECT i.id, a.key, a.name, a.output_kind, a.min_nm, a.max_nm, a.default_nm, a.rate_class, a.required_od_bands, a.retune_minutes_per_nm
      FROM instruments i CROSS JOIN configurations a WHERE i.name LIKE 'Bench source %' AND a.instrument_id = $1`, [aurora.id]);
    await c.query(`INSERT INTO changeover_pairs (instrument_id, from_configuration_id, to_configuration_id, base_minutes)
      SELECT i.id, fi.id, ti.id, p.base_minutes FROM changeover_pairs p
      JOIN configurations f ON f.id = p.from_configuration_id JOIN configurations t ON t.id = p.to_configuration_id
      CROSS JOIN instruments i JOIN configurations fi ON fi.instrument_id = i.id AND fi.key = f.key JOIN configurations ti ON ti.instrument_id = i.id AND ti.key = t.key
      WHERE p.instrument_id = $1 AND i.name LIKE 'Bench source %'`, [aurora.id]);
    const rows = (await c.query(`SELECT i.id, i.name, c.key, c.id AS cid FROM instruments i JOIN configurations c ON c.instrument_id = i.id WHERE i.name LIKE 'Bench source %' ORDER BY i.name`)).rows;
    const byId = new Map<string, BenchInstrument>();
    for (const r of rows) {
      const inst: BenchInstrument = byId.get(r.id) ?? { id: r.id, name: r.name, configs: {} };
      inst.configs[r.key] = r.cid;
      byId.set(r.id, inst);
    }
    const instruments = [...byId.values()];

    const hash = await hashPassword(BENCH_PASSWORD);
    const kinds = ['internal', 'internal', 'external_academic', 'external_academic', 'industry'] as const;
    const orgs = Array.from({ length: ACCOUNTS + 1 }, (_, i) => ({ id: randomUUID(), name: i === ACCOUNTS ? 'Bench booking group' : `Bench group ${String(i + 1).padStart(3, '0')}`, kind: i === ACCOUNTS ? 'internal' : kinds[i % kinds.length] }));
    await insertRows(c, 'organisations', { id: 'uuid', name: 'text', kind: 'text' }, orgs);
    const users = orgs.map((o, i) => ({ id: randomUUID(), organisation_id: o.id, email: `bench.user${i}@bench.example.test`, name: `Bench user ${i}`, role: o.kind === 'internal' ? 'member' : 'collaborator', password_hash: hash }));
    await insertRows(c, 'users', { id: 'uuid', organisation_id: 'uuid', email: 'text', name: 'text', role: 'text', password_hash: 'text' }, users);
    const courses = (await c.query<{ id: string }>(`SELECT id FROM training_courses WHERE required_for_all AND active`)).rows;
    await insertRows(c, 'training_records', { user_id: 'uuid', course_id: 'uuid', completed_on: 'date', expires_on: 'date' },
      users.flatMap((u) => courses.map((k) => ({ user_id: u.id, course_id: k.id, completed_on: '2024-01-01', expires_on: '2030-12-31' }))));
    const accounts = orgs.map((o, i) => o.kind === 'internal'
      ? { id: randomUUID(), organisation_id: o.id, kind: 'cost_centre', name: `Bench CC ${i}`, cost_centre_code: `BCC-${i}`, status: 'approved' }
      : { id: randomUUID(), organisation_id: o.id, kind: 'external', name: `Bench external ${i}`, billing_contact_email: `ap${i}@bench.example.test`, po_number: `BPO-${i}`, po_expires_on: '2030-12-31', status: 'approved' });
    await insertRows(c, 'accounts', { id: 'uuid', organisation_id: 'uuid', kind: 'text', name: 'text', cost_centre_code: 'text', billing_contact_email: 'text', po_number: 'text', po_expires_on: 'date', status: 'text' }, accounts);
    const financeEmail = 'bench.finance@bench.example.test';
    await c.query(`INSERT INTO users (organisation_id, email, name, role, password_hash) VALUES ($1, $2, 'Bench finance', 'finance', $3)`, [orgs[ACCOUNTS]!.id, financeEmail, hash]);

    // The close month: two months back, so the demo rate card (from three months back) prices it and the demo's closed month is not it.
    const closeMonth = shiftMonth(monthOf(now, timeZone), -2);
    const closeFrom = monthStart(closeMonth, timeZone);
    const closeTo = monthStart(shiftMonth(closeMonth, 1), timeZone);
    const dayUtc = (d: Date) => Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), d.getUTCDate());
    const closeDays: number[] = [];
    for (let t = dayUtc(closeFrom) + DAY; t + DAY <= closeTo.getTime() - DAY; t += DAY) closeDays.push(t);
    const otherDays: number[] = [];
    for (let t = dayUtc(now) - 2 * DAY; otherDays.length < 400 && t > closeFrom.getTime() - 300 * DAY; t -= DAY) {
      if (t >= dayUtc(closeFrom) && t < closeTo.getTime() + DAY) continue;
      otherDays.push(t);
    }
    // Close month: six 2-hour sessions a day (4-hour stride); elsewhere three 3-hour sessions a day (8-hour stride).
    type Slot = { start: number; end: number; close: boolean };
    const perInstrumentClose = closeDays.flatMap((d) => [0, 1, 2, 3, 4, 5].map((s): Slot => ({ start: d + s * 4 * HOUR, end: d + s * 4 * HOUR + 2 * HOUR, close: true })));
    const closeCount = Math.min(perInstrumentClose.length * INSTRUMENTS, TOTAL_BOOKINGS);
    const otherPerInstrument = Math.ceil((TOTAL_BOOKINGS - closeCount) / INSTRUMENTS);
    const others = otherDays.flatMap((d) => [0, 1, 2].map((s): Slot => ({ start: d + s * 8 * HOUR + HOUR, end: d + s * 8 * HOUR + 4 * HOUR, close: false }))).slice(0, otherPerInstrument);
    if (others.length < otherPerInstrument) throw new Error('not enough past days for the seed');
    const bookings: Record<string, unknown>[] = [];
    let closeSeen = 0;
    let otherLeft = TOTAL_BOOKINGS - closeCount;
    for (const [k, inst] of instruments.entries()) {
      const slots = [...perInstrumentClose, ...others.slice(0, Math.min(otherPerInstrument, Math.ceil(otherLeft / (INSTRUMENTS - k))))].sort((a, b) => a.start - b.start);
      otherLeft -= slots.length - perInstrumentClose.length;
      let prev: { state: SourceState; end: number } | null = null;
      for (const [j, s] of slots.entries()) {
        let state = states[(j + k) % states.length]!;
        if (prev && changeoverMinutes(prev.state, state, m).totalMinutes * 60_000 > s.start - prev.end) state = prev.state;
        if (prev && changeoverMinutes(prev.state, state, m).totalMinutes * 60_000 > s.start - prev.end) throw new Error('seed gap shorter than the changeover');
        const logged = s.close && closeSeen < CLOSE_SESSIONS;
        const a = s.close ? closeSeen++ % ACCOUNTS : (j * 7 + k) % ACCOUNTS;
        bookings.push({
          instrument_id: inst.id, kind: 'booking', status: 'completed', starts_at: new Date(s.start), ends_at: new Date(s.end), configuration_id: inst.configs[state.configurationKey],
          target_min_nm: state.nm, target_max_nm: state.nm, account_id: accounts[a]!.id, user_id: users[a]!.id, organisation_id: orgs[a]!.id,
          purpose: logged ? 'Bench session (close month)' : 'Bench session', created_by: users[a]!.id,
        });
        prev = { state, end: s.end };
      }
    }
    const cols = { instrument_id: 'uuid', kind: 'text', status: 'text', starts_at: 'timestamptz', ends_at: 'timestamptz', configuration_id: 'uuid', target_min_nm: 'numeric', target_max_nm: 'numeric', account_id: 'uuid', user_id: 'uuid', organisation_id: 'uuid', purpose: 'text', created_by: 'uuid' };
    await c.query(`SET CONSTRAINTS timeline_blocks_no_overlap IMMEDIATE`);
    await insertRows(c, 'timeline_blocks', cols, bookings);
    const [staff] = (await c.query(`SELECT id FROM users WHERE role = 'staff' ORDER BY email LIMIT 1`)).rows;
    await c.query(`INSERT INTO usage_logs (booking_id, status, actual_starts_at, actual_ends_at, notes, submitted_by, submitted_at, confirmed_by, confirmed_at)
      SELECT id, 'confirmed', starts_at + interval '5 minutes', ends_at, 'Bench log', user_id, ends_at, $1, ends_at + interval '1 hour'
      FROM timeline_blocks WHERE purpose = 'Bench session (close month)'`, [staff.id]);
    // About half of the first source's sessions take an end station along, so the week query aggregates real station rows.
    const [station] = (await c.query(`INSERT INTO instruments (name, kind, description) VALUES ('Bench-world station', 'bench', 'benchmark') RETURNING id`)).rows;
    await c.query(`INSERT INTO timeline_blocks (instrument_id, kind, status, starts_at, ends_at, parent_id)
      SELECT $1, 'station', b.status, b.starts_at, b.ends_at, b.id FROM timeline_blocks b
       WHERE b.instrument_id = $2 AND b.kind = 'booking' AND (extract(epoch FROM b.starts_at)::bigint / 3600) % 2 = 0`, [station.id, instruments[0]!.id]);

    const booker = { email: users[ACCOUNTS]!.email, userId: users[ACCOUNTS]!.id, organisationId: orgs[ACCOUNTS]!.id, accountId: accounts[ACCOUNTS]!.id };
    const renderWeek = await seedRenderWeek(c, aurora.id, timeZone, now, booker);
    await c.query('COMMIT');
    await c.query('ANALYZE');
    const firstMonday = closeDays.find((t) => new Date(t).getUTCDay() === 1)!;
    return {
      timeZone, instruments, booker, finance: { email: financeEmail }, closeMonth, renderWeek, seededBookings: bookings.length,
      queryWeek: { from: new Date(firstMonday).toISOString(), to: new Date(firstMonday + 7 * DAY).toISOString(), instrumentId: instruments[0]!.id },
    };
  } catch (err) {
    await c.query('ROLLBACK').catch(() => undefined);
    throw err;
  } finally {
    await c.end();
  }
}

/** 300 half-hour bookings in the current facility-local week (Monday first) on the demo source, which the calendar opens on. */
async function seedRenderWeek(c: pg.Client, instrumentId: string, timeZone: string, now: Date, booker: BenchWorld['booker']) {
  const today = localDate(now, timeZone);
  const noon = new Date(`${today}T12:00:00Z`);
  const monday = new Date(noon.getTime() - ((noon.getUTCDay() + 6) % 7) * DAY);
  const wall = (d: Date) => ({ year: d.getUTCFullYear(), month: d.getUTCMonth() + 1, day: d.getUTCDate(), hour: 0, minute: 0 });
  const from = zonedToUtc(wall(monday), timeZone);
  const to = zonedToUtc(wall(new Date(monday.getTime() + 7 * DAY)), timeZone);
  // The demo's own blocks in that week step aside (cancelled), so the week holds exactly the bench's 300.
  await c.query(`UPDATE timeline_blocks SET status = 'cancelled' WHERE instrument_id = $1 AND starts_at < $3 AND ends_at > $2`, [instrumentId, from, to]);
  const [cfg] = (await c.query(`SELECT id FROM configurations WHERE instrument_id = $1 AND key = 'fundamental'`, [instrumentId])).rows;
  const perDay = Math.ceil(RENDER_EVENTS / 7);
  const rows: Record<string, unknown>[] = [];
  for (let i = 0; i < RENDER_EVENTS; i++) {
    const day = Math.floor(i / perDay);
    const dayStart = zonedToUtc(wall(new Date(monday.getTime() + day * DAY)), timeZone).getTime();
    const start = dayStart + (3 + (i % perDay) * 33) * 60_000;
    rows.push({ instrument_id: instrumentId, kind: 'booking', status: start < now.getTime() ? 'completed' : 'approved', starts_at: new Date(start), ends_at: new Date(start + 30 * 60_000), configuration_id: cfg.id,
      target_min_nm: 800, target_max_nm: 800, account_id: booker.accountId, user_id: booker.userId, organisation_id: booker.organisationId, purpose: 'Bench render week', created_by: booker.userId });
  }
  await insertRows(c, 'timeline_blocks', { instrument_id: 'uuid', kind: 'text', status: 'text', starts_at: 'timestamptz', ends_at: 'timestamptz', configuration_id: 'uuid', target_min_nm: 'numeric', target_max_nm: 'numeric', account_id: 'uuid', user_id: 'uuid', organisation_id: 'uuid', purpose: 'text', created_by: 'uuid' }, rows);
  return { from: from.toISOString(), to: to.toISOString(), instrumentId };
}
