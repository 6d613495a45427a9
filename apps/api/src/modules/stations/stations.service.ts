import type { StationDto } from '@femtoslot/shared';
import type { EntityManager } from 'typeorm';
import { AppError, notFound } from '../../lib/errors/app-error';
import type { Problem } from '../bookings/booking-evaluation';
import { occupyingStatuses } from '../bookings/timeline-block.entity';

/**
 * End stations: benches a source booking includes. A booking's stations are `timeline_blocks` rows of kind 'station'
 * on the bench (parent_id = the booking); triggers keep their status and interval equal to the booking's, and the
 * timeline's exclusion constraint keeps each bench free of overlaps. Which configuration can feed which station is the
 * `station_configurations` list.
 */

/** Every active bench with the configurations that can feed it, in one statement. */
export async function listStations(m: EntityManager): Promise<StationDto[]> {
  const rows: { id: string; name: string; description: string; configuration_ids: string[] }[] = await m.query(
    `SELECT i.id, i.name, i.description,
            ARRAY(SELECT sc.configuration_id::text FROM station_configurations sc WHERE sc.station_id = i.id ORDER BY sc.configuration_id) AS configuration_ids
       FROM instruments i WHERE i.kind = 'bench' AND i.active ORDER BY i.name`);
  return rows.map((r) => ({ id: r.id, name: r.name, description: r.description, configurationIds: r.configuration_ids }));
}

/** Replaces the list of configurations that can feed a station (staff). Existing bookings keep their stations. */
export async function setStationConfigurations(m: EntityManager, stationId: string, configurationIds: string[]): Promise<StationDto> {
  const station: { kind: string }[] = await m.query(`SELECT kind FROM instruments WHERE id = $1 AND active FOR UPDATE`, [stationId]);
  if (station.length === 0 || station[0]!.kind !== 'bench') throw notFound('Station');
  const known: { n: number }[] = await m.query(`SELECT count(*)::int AS n FROM configurations WHERE id = ANY($1::uuid[])`, [configurationIds]);
  if (known[0]!.n !== configurationIds.length) throw new AppError('validation_failed', 'Some of those configurations do not exist', 422);
  await m.query(`DELETE FROM station_configurations WHERE station_id = $1`, [stationId]);
  await m.query(`INSERT INTO station_configurations (station_id, configuration_id) SELECT $1, unnest($2::uuid[])`, [stationId, configurationIds]);
  return (await listStations(m)).find((s) => s.id === stationId)!;
}

export interface StationRequest {
  stationIds: string[];
  configurationId: string;
  startsAt: Date;
  endsAt: Date;
  /** The booking being moved: its own station rows do not count as busy. */
  excludeBookingId?: string;
  /** Where the source and the stations are both free, for the message. */
  earliestStart?: Date | null;
}

/**
 * Whether each asked-for station exists, can be fed by the configuration and is free for the interval, in one
 * statement. The bench is not locked: two bookings on different sources may both pass here, and the exclusion
 * constraint then refuses the second insert (409).
 */
export async function stationProblems(m: EntityManager, req: StationRequest): Promise<Problem[]> {
  if (req.stationIds.length === 0) return [];
  const rows: { id: string; name: string | null; kind: string | null; active: boolean | null; compatible: boolean; overlaps: string[] }[] = await m.query(
    `SELECT r.id::text AS id, i.name, i.kind, i.active,
            EXISTS (SELECT 1 FROM station_configurations sc WHERE sc.station_id = r.id AND sc.configuration_id = $2) AS compatible,
            ARRAY(SELECT b.id::text FROM timeline_blocks b
                   WHERE b.instrument_id = r.id AND b.status = ANY($5::text[]) AND b.starts_at < $4 AND b.ends_at > $3
                     AND ($6::uuid IS NULL OR b.parent_id IS DISTINCT FROM $6::uuid)) AS overlaps
       FROM unnest($1::uuid[]) WITH ORDINALITY AS r(id, n) LEFT JOIN instruments i ON i.id = r.id
      ORDER BY r.n`,
    [req.stationIds, req.configurationId, req.startsAt, req.endsAt, [...occupyingStatuses], req.excludeBookingId ?? null]);
  const problems: Problem[] = [];
  for (const r of rows) {
    if (r.kind !== 'bench' || !r.active) {
      problems.push({ code: 'station_incompatible', message: 'That is not an end station that can be booked', status: 422, details: { stationId: r.id, reason: 'not_a_station' } });
    } else if (!r.compatible) {
      problems.push({ code: 'station_incompatible', message: `The ${r.name} cannot be fed by that configuration; choose another configuration or leave the station out`, status: 422, details: { stationId: r.id, reason: 'configuration' } });
    } else if (r.overlaps.length > 0) {
      const suggestion = req.earliestStart ? ` The earliest start that works is ${req.earliestStart.toISOString().replace(':00.000Z', 'Z')}.` : '';
      problems.push({ code: 'station_busy', message: `The ${r.name} is booked or under maintenance at that time.${suggestion}`, status: 409,
        details: { stationId: r.id, overlaps: r.overlaps, earliestStart: req.earliestStart?.toISOString() ?? null } });
    }
  }
  return problems;
}

/** The booking's station rows; the trigger copies the booking's status and interval into them. */
export async function insertStations(m: EntityManager, bookingId: string, stationIds: string[]): Promise<string[]> {
  if (stationIds.length === 0) return [];
  await m.query(
    `INSERT INTO timeline_blocks (instrument_id, kind, status, starts_at, ends_at, parent_id)
     SELECT s, 'station', b.status, b.starts_at, b.ends_at, b.id FROM timeline_blocks b CROSS JOIN unnest($2::uuid[]) AS s WHERE b.id = $1`,
    [bookingId, stationIds]);
  return [...stationIds].sort();
}

/** Each booking's stations, in one statement whatever the number of bookings. */
export async function stationIdsOf(m: EntityManager, bookingIds: string[]): Promise<Map<string, string[]>> {
  const out = new Map<string, string[]>();
  if (bookingIds.length === 0) return out;
  const rows: { parent_id: string; station_ids: string[] }[] = await m.query(
    `SELECT parent_id, array_agg(instrument_id::text ORDER BY instrument_id) AS station_ids
       FROM timeline_blocks WHERE parent_id = ANY($1::uuid[]) GROUP BY parent_id`, [bookingIds]);
  for (const r of rows) out.set(r.parent_id, r.station_ids);
  return out;
}

/**
 * Slots that also leave the booking's stations free: a maintenance window on a bench is not on the source's timeline,
 * so alternatives found on the source are checked against the benches too (its own station rows are left out).
 */
export async function slotsWithStationsFree<T extends { start: Date; end: Date }>(m: EntityManager, bookingId: string, stationIds: string[], slots: T[]): Promise<T[]> {
  if (stationIds.length === 0 || slots.length === 0) return slots;
  const from = new Date(Math.min(...slots.map((s) => s.start.getTime())));
  const to = new Date(Math.max(...slots.map((s) => s.end.getTime())));
  const busy: { starts_at: Date; ends_at: Date }[] = await m.query(
    `SELECT starts_at, ends_at FROM timeline_blocks
      WHERE instrument_id = ANY($1::uuid[]) AND status = ANY($2::text[]) AND starts_at < $4 AND ends_at > $3 AND parent_id IS DISTINCT FROM $5::uuid`,
    [stationIds, [...occupyingStatuses], from, to, bookingId]);
  return slots.filter((s) => !busy.some((b) => b.starts_at < s.end && b.ends_at > s.start));
}

/**
 * The earliest start ≥ the source's own earliest where the stations are free too: past each station block in the way,
 * the source's timeline is asked again (`onSource`) from the end of that block. Null when nothing fits in the horizon.
 */
export async function earliestWithStationsFree(m: EntityManager, stationIds: string[], excludeBookingId: string | undefined, sourceEarliest: Date | null,
  durationMs: number, horizonEnd: Date, onSource: (from: Date) => Date | null): Promise<Date | null> {
  if (!sourceEarliest) return null;
  const busy: { starts_at: Date; ends_at: Date }[] = await m.query(
    `SELECT starts_at, ends_at FROM timeline_blocks
      WHERE instrument_id = ANY($1::uuid[]) AND status = ANY($2::text[]) AND ends_at > $3 AND starts_at < $4 AND ($5::uuid IS NULL OR parent_id IS DISTINCT FROM $5::uuid)
      ORDER BY starts_at`,
    [stationIds, [...occupyingStatuses], sourceEarliest, new Date(horizonEnd.getTime() + durationMs), excludeBookingId ?? null]);
  let start: Date | null = sourceEarliest;
  for (let i = 0; start && i <= busy.length; i++) {
    const from: Date = start;
    const clash = busy.find((b) => b.starts_at.getTime() < from.getTime() + durationMs && b.ends_at > from);
    if (!clash) return start;
    start = onSource(clash.ends_at);
  }
  return null;
}
