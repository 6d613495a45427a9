import type { SourceState, TimelineBlockInput } from '@femtoslot/shared';
import { parseChangeoverModel } from '@femtoslot/shared';
import type { EntityManager } from 'typeorm';
import { preparedQuery } from '../../db/prepared';
import { notFound } from '../../lib/errors/app-error';
import { ChangeoverPair } from '../instruments/changeover-pair.entity';
import { Configuration } from '../instruments/configuration.entity';
import { Instrument } from '../instruments/instrument.entity';
import { modelOf, type InstrumentTimeline, type ReferenceCache, type ReferenceData } from '../instruments/reference-data';
import { occupyingStatuses, TimelineBlock } from './timeline-block.entity';

export type { InstrumentTimeline } from '../instruments/reference-data';

/** The source state a booking leaves the laser in; a scanned range is represented by its midpoint. */
export function stateOf(block: Pick<TimelineBlock, 'configurationId' | 'targetMinNm' | 'targetMaxNm'>, configurations: Map<string, Configuration>): SourceState | null {
  const c = block.configurationId ? configurations.get(block.configurationId) : undefined;
  if (!c || block.targetMinNm === null || block.targetMaxNm === null) return null;
  return { configurationKey: c.key, nm: (block.targetMinNm + block.targetMaxNm) / 2 };
}

// Serialises every write to this instrument's timeline: two requests cannot both pass the gap check.
const LOCK_INSTRUMENT = `SELECT r.revision::text AS revision FROM instruments i CROSS JOIN reference_revision r WHERE i.id = $1 FOR UPDATE OF i`;

/**
 * The instrument's configurations and changeover model from the per-process reference cache. With `lock`, the row
 * lock on the instrument and the revision check are one statement.
 */
export async function timelineOf(reference: ReferenceCache, m: EntityManager, instrumentId: string, { lock = false } = {}): Promise<{ timeline: InstrumentTimeline; reference: ReferenceData }> {
  let revision: string | undefined;
  if (lock) {
    const rows: { revision: string }[] = await m.query(LOCK_INSTRUMENT, [instrumentId]);
    if (rows.length === 0) throw notFound('Instrument');
    revision = rows[0]!.revision;
  }
  const data = await reference.get(m, revision);
  const timeline = data.timelines.get(instrumentId);
  if (!timeline || !timeline.instrument.active) throw notFound('Instrument');
  return { timeline, reference: data };
}

const instrumentQueues = new Map<string, Promise<void>>();

/**
 * Runs `fn` after every earlier call for the same instrument in this process has finished. The row lock still
 * serialises across processes; this keeps a burst for one instrument (a slot everyone wants) queued in memory instead
 * of holding every pool connection while it waits on that lock, which starved other requests into 503s (soak test).
 */
export async function oneAtATimePerInstrument<T>(instrumentId: string, fn: () => Promise<T>): Promise<T> {
  const before = instrumentQueues.get(instrumentId) ?? Promise.resolve();
  let release!: () => void;
  const done = new Promise<void>((resolve) => { release = resolve; });
  const tail = before.then(() => done);
  instrumentQueues.set(instrumentId, tail);
  await before;
  try {
    return await fn();
  } finally {
    release();
    if (instrumentQueues.get(instrumentId) === tail) instrumentQueues.delete(instrumentId);
  }
}

/** The same, read straight from the tables (for batch work and checks that hold no reference cache); no lock. */
export async function loadInstrumentTimeline(m: EntityManager, instrumentId: string): Promise<InstrumentTimeline> {
  const instrument = await m.getRepository(Instrument).findOne({ where: { id: instrumentId, active: true } });
  if (!instrument) throw notFound('Instrument');
  const configs = await m.getRepository(Configuration).find({ where: { instrumentId } });
  const pairs = await m.getRepository(ChangeoverPair).find({ where: { instrumentId } });
  const model = modelOf(instrument, configs, pairs);
  return { instrument, configurations: new Map(configs.map((c) => [c.id, c])), model, parsedModel: parseChangeoverModel(model) };
}

/** What the calendar's DTOs read: the week query leaves out the bookkeeping columns (fewer timestamps to parse). */
const CALENDAR_COLUMN_NAMES = ['id', 'instrument_id', 'kind', 'status', 'starts_at', 'ends_at', 'configuration_id', 'target_min_nm', 'target_max_nm',
  'account_id', 'user_id', 'organisation_id', 'purpose', 'reason', 'decline_reason', 'cancellation_fee_percent', 'alternatives', 'rebooked_as'];
const BLOCK_COLUMN_NAMES = [...CALENDAR_COLUMN_NAMES, 'created_by', 'displaced_by', 'decided_by', 'decided_at', 'cancelled_by', 'cancelled_at',
  'sequence', 'created_at', 'updated_at', 'parent_id'];
/** The block's columns for a raw select; numeric wavelengths as float8 so they arrive as numbers. */
const blockColumns = (alias: string, names = BLOCK_COLUMN_NAMES) => names
  .map((c) => (c.startsWith('target_') ? `${alias}.${c}::float8 AS ${c}` : `${alias}.${c}`)).join(', ');

type BlockRow = Record<string, unknown>;

/** A row of `SELECT ${blockColumns(…)}` as the entity, without TypeORM's hydration (hot read paths). */
function blockOf(r: BlockRow): TimelineBlock {
  return Object.assign(new TimelineBlock(), {
    id: r.id, instrumentId: r.instrument_id, kind: r.kind, status: r.status, startsAt: r.starts_at, endsAt: r.ends_at,
    configurationId: r.configuration_id, targetMinNm: r.target_min_nm, targetMaxNm: r.target_max_nm, accountId: r.account_id,
    userId: r.user_id, organisationId: r.organisation_id, purpose: r.purpose, reason: r.reason, declineReason: r.decline_reason,
    cancellationFeePercent: r.cancellation_fee_percent, createdBy: r.created_by, alternatives: r.alternatives, rebookedAs: r.rebooked_as,
    displacedBy: r.displaced_by, decidedBy: r.decided_by, decidedAt: r.decided_at, cancelledBy: r.cancelled_by, cancelledAt: r.cancelled_at,
    sequence: r.sequence, createdAt: r.created_at, updatedAt: r.updated_at, parentId: r.parent_id ?? null,
    ...(r.station_ids ? { stationIds: r.station_ids } : {}),
  } as Partial<TimelineBlock>);
}

/**
 * Raw: every row on the instrument's timeline (a bench's station rows included). Named (the calendar): bookings and
 * maintenance with each booking's end stations aggregated in, station rows left out; for a bench, the bookings that
 * include it stand in for its station rows.
 */
async function selectBlocks(m: EntityManager, from: Date, to: Date, instrumentId: string | undefined, withNames: boolean): Promise<BlockRow[]> {
  const names = withNames
    ? `, u.name AS user_name, a.name AS account_name,
       ARRAY(SELECT s.instrument_id::text FROM timeline_blocks s WHERE s.parent_id = b.id ORDER BY s.instrument_id) AS station_ids`
    : '';
  const joins = withNames ? 'LEFT JOIN users u ON u.id = b.user_id LEFT JOIN accounts a ON a.id = b.account_id' : '';
  const onInstrument = !instrumentId ? '' : withNames
    ? `AND (b.instrument_id = $4 OR b.id IN (SELECT s.parent_id FROM timeline_blocks s
         WHERE s.instrument_id = $4 AND s.kind = 'station' AND s.starts_at < $2 AND s.ends_at > $1 AND s.status = ANY($3::text[])))`
    : 'AND b.instrument_id = $4';
  return preparedQuery(m, `blocks${withNames ? '-named' : ''}${instrumentId ? '-instrument' : ''}`,
    `SELECT ${blockColumns('b', withNames ? CALENDAR_COLUMN_NAMES : BLOCK_COLUMN_NAMES)}${names} FROM timeline_blocks b ${joins}
      WHERE b.starts_at < $2 AND b.ends_at > $1 AND b.status = ANY($3::text[]) ${withNames ? "AND b.kind <> 'station'" : ''} ${onInstrument}
      ORDER BY b.starts_at, b.id`,
    instrumentId ? [from, to, [...occupyingStatuses], instrumentId] : [from, to, [...occupyingStatuses]],
  );
}

/** Blocks that occupy instruments and overlap [from, to), oldest first; one instrument or all. */
export async function occupyingBlocks(m: EntityManager, from: Date, to: Date, instrumentId?: string): Promise<TimelineBlock[]> {
  return (await selectBlocks(m, from, to, instrumentId, false)).map(blockOf);
}

/**
 * The calendar's week query: the blocks with the owner's and the account's names joined in, in one statement, and
 * only the columns the calendar's DTOs read (the rest of each entity is left undefined).
 */
export async function occupyingBlocksNamed(m: EntityManager, from: Date, to: Date, instrumentId?: string) {
  const rows = await selectBlocks(m, from, to, instrumentId, true);
  const users = new Map<string, string>();
  const accounts = new Map<string, string>();
  for (const r of rows) {
    if (r.user_id && r.user_name) users.set(r.user_id as string, r.user_name as string);
    if (r.account_id && r.account_name) accounts.set(r.account_id as string, r.account_name as string);
  }
  return { blocks: rows.map(blockOf), users, accounts };
}

export interface NewBooking {
  instrumentId: string; status: 'requested' | 'approved'; startsAt: Date; endsAt: Date; configurationId: string; targetMinNm: number; targetMaxNm: number;
  accountId: string; userId: string; organisationId: string; purpose: string; createdBy: string; decidedBy: string | null; decidedAt: Date | null;
}

/** The booking row, returned as the entity; an overlap fails here on the exclusion constraint (23P01 → 409). */
export async function insertBooking(m: EntityManager, v: NewBooking): Promise<TimelineBlock> {
  const rows: BlockRow[] = await m.query(
    `INSERT INTO timeline_blocks (instrument_id, kind, status, starts_at, ends_at, configuration_id, target_min_nm, target_max_nm, account_id, user_id,
       organisation_id, purpose, created_by, decided_by, decided_at)
     VALUES ($1, 'booking', $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12, $13, $14) RETURNING ${blockColumns('timeline_blocks')}`,
    [v.instrumentId, v.status, v.startsAt, v.endsAt, v.configurationId, v.targetMinNm, v.targetMaxNm, v.accountId, v.userId, v.organisationId,
      v.purpose, v.createdBy, v.decidedBy, v.decidedAt],
  );
  return blockOf(rows[0]!);
}

/** The engine knows bookings and maintenance: a station row holds its bench like a booking that leaves no source state behind. */
export const engineKind = (kind: TimelineBlock['kind']): 'booking' | 'maintenance' => (kind === 'maintenance' ? 'maintenance' : 'booking');

export function toEngineBlocks(blocks: TimelineBlock[], configurations: Map<string, Configuration>): TimelineBlockInput[] {
  return blocks.map((b) => ({ id: b.id, kind: engineKind(b.kind), start: b.startsAt, end: b.endsAt, state: b.kind === 'booking' ? stateOf(b, configurations) : null }));
}

/**
 * Requested and approved bookings that use the instrument in [from, to), locked for update, oldest first: on a source,
 * its own bookings; on a bench, the bookings that include it as an end station.
 */
export async function activeBookingsUsing(m: EntityManager, instrumentId: string, from: Date, to: Date): Promise<TimelineBlock[]> {
  return m.getRepository(TimelineBlock).createQueryBuilder('b')
    .where(`b.kind = 'booking' AND b.status IN ('requested', 'approved') AND b.starts_at < :to AND b.ends_at > :from`, { from, to })
    .andWhere(`(b.instrument_id = :instrumentId OR b.id IN (SELECT s.parent_id FROM timeline_blocks s WHERE s.kind = 'station' AND s.instrument_id = :instrumentId))`, { instrumentId })
    .orderBy('b.starts_at', 'ASC').setLock('pessimistic_write').getMany();
}
