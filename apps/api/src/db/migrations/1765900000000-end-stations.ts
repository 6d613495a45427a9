import type { MigrationInterface, QueryRunner } from 'typeorm';

const BOOKING_STATUSES = `'requested','approved','declined','completed','cancelled','displaced'`;

/**
 * End stations (benches) booked with a source booking. Each station a booking includes is a `timeline_blocks` row of
 * kind 'station' on the bench, linked to its booking by `parent_id`, so the one exclusion constraint
 * (`timeline_blocks_no_overlap`) keeps the bench's timeline free of overlaps — with other bookings' stations and with
 * maintenance windows on the bench — whoever writes. Triggers keep a station row in step with its booking: it always
 * carries the booking's status and interval, in the writer's own transaction, whichever code path changed the booking.
 */
export class EndStations1765900000000 implements MigrationInterface {
  name = 'EndStations1765900000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE timeline_blocks ADD COLUMN parent_id uuid REFERENCES timeline_blocks(id) ON DELETE CASCADE`);
    await q.query(`ALTER TABLE timeline_blocks DROP CONSTRAINT timeline_blocks_kind_check,
      ADD CONSTRAINT timeline_blocks_kind_check CHECK (kind IN ('booking','maintenance','station'))`);
    await q.query(`ALTER TABLE timeline_blocks DROP CONSTRAINT timeline_blocks_status, ADD CONSTRAINT timeline_blocks_status CHECK (
      (kind IN ('booking','station') AND status IN (${BOOKING_STATUSES})) OR (kind = 'maintenance' AND status IN ('scheduled','cancelled')))`);
    await q.query(`ALTER TABLE timeline_blocks ADD CONSTRAINT timeline_blocks_station_parent CHECK ((kind = 'station') = (parent_id IS NOT NULL))`);
    // One row per station and booking; also the index the booking → stations lookups use.
    await q.query(`CREATE UNIQUE INDEX timeline_blocks_station_once ON timeline_blocks (parent_id, instrument_id) WHERE parent_id IS NOT NULL`);

    // Which configurations can feed which station: data, editable by staff.
    await q.query(`CREATE TABLE station_configurations (
      station_id uuid NOT NULL REFERENCES instruments(id) ON DELETE CASCADE,
      configuration_id uuid NOT NULL REFERENCES configurations(id) ON DELETE CASCADE,
      PRIMARY KEY (station_id, configuration_id)
    )`);

    // A station row always carries its booking's status and interval, and only a bench can be a station.
    await q.query(`CREATE FUNCTION timeline_station_follows_booking() RETURNS trigger LANGUAGE plpgsql AS $$
      DECLARE p record; station_kind text;
      BEGIN
        SELECT kind, status, starts_at, ends_at, instrument_id INTO p FROM timeline_blocks WHERE id = NEW.parent_id;
        IF NOT FOUND OR p.kind <> 'booking' THEN
          RAISE EXCEPTION 'A station block must belong to a booking' USING ERRCODE = '23514', CONSTRAINT = 'timeline_blocks_station_parent';
        END IF;
        SELECT kind INTO station_kind FROM instruments WHERE id = NEW.instrument_id;
        IF station_kind IS DISTINCT FROM 'bench' OR NEW.instrument_id = p.instrument_id THEN
          RAISE EXCEPTION 'Only a bench can be booked as an end station' USING ERRCODE = '23514', CONSTRAINT = 'timeline_blocks_station_parent';
        END IF;
        NEW.status := p.status;
        NEW.starts_at := p.starts_at;
        NEW.ends_at := p.ends_at;
        RETURN NEW;
      END $$`);
    await q.query(`CREATE TRIGGER timeline_blocks_station_follows BEFORE INSERT OR UPDATE ON timeline_blocks
      FOR EACH ROW WHEN (NEW.kind = 'station') EXECUTE FUNCTION timeline_station_follows_booking()`);

    // Approve, decline, cancel, displace, complete, move, day plans: every change to a booking reaches its stations.
    await q.query(`CREATE FUNCTION timeline_booking_carries_stations() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        UPDATE timeline_blocks SET status = NEW.status, starts_at = NEW.starts_at, ends_at = NEW.ends_at, updated_at = now()
         WHERE parent_id = NEW.id;
        RETURN NULL;
      END $$`);
    await q.query(`CREATE TRIGGER timeline_blocks_stations_follow AFTER UPDATE OF status, starts_at, ends_at ON timeline_blocks
      FOR EACH ROW WHEN (NEW.kind = 'booking' AND (OLD.status, OLD.starts_at, OLD.ends_at) IS DISTINCT FROM (NEW.status, NEW.starts_at, NEW.ends_at))
      EXECUTE FUNCTION timeline_booking_carries_stations()`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TRIGGER IF EXISTS timeline_blocks_stations_follow ON timeline_blocks`);
    await q.query(`DROP TRIGGER IF EXISTS timeline_blocks_station_follows ON timeline_blocks`);
    await q.query(`DROP FUNCTION IF EXISTS timeline_booking_carries_stations()`);
    await q.query(`DROP FUNCTION IF EXISTS timeline_station_follows_booking()`);
    await q.query(`DROP TABLE IF EXISTS station_configurations`);
    await q.query(`DELETE FROM timeline_blocks WHERE kind = 'station'`);
    await q.query(`DROP INDEX IF EXISTS timeline_blocks_station_once`);
    await q.query(`ALTER TABLE timeline_blocks DROP CONSTRAINT timeline_blocks_station_parent`);
    await q.query(`ALTER TABLE timeline_blocks DROP CONSTRAINT timeline_blocks_status, ADD CONSTRAINT timeline_blocks_status CHECK (
      (kind = 'booking' AND status IN (${BOOKING_STATUSES})) OR (kind = 'maintenance' AND status IN ('scheduled','cancelled')))`);
    await q.query(`ALTER TABLE timeline_blocks DROP CONSTRAINT timeline_blocks_kind_check,
      ADD CONSTRAINT timeline_blocks_kind_check CHECK (kind IN ('booking','maintenance'))`);
    await q.query(`ALTER TABLE timeline_blocks DROP COLUMN parent_id`);
  }
}
