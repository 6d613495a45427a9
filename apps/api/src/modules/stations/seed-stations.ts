import { localDate, zonedToUtc } from '@femtoslot/shared';
import type { EntityManager } from 'typeorm';
import { insertStations } from './stations.service';

/**
 * Invented demo data: which outputs feed which bench, a few bookings that take a bench along, and one maintenance
 * window on the pump-probe station. The pump-probe station takes the fundamental, SHG and both OPA outputs; the
 * autocorrelator the fundamental and both OPA outputs (its doubling crystal does not reach 400 nm or the mid-IR);
 * neither takes DFG mid-IR.
 */
const feeds: Record<string, string[]> = {
  'Pump-probe station': ['fundamental', 'shg', 'opa_signal', 'opa_idler'],
  'Autocorrelator bench': ['fundamental', 'opa_signal', 'opa_idler'],
};

export async function seedStations(m: EntityManager, now: Date, timeZone: string): Promise<void> {
  const benches: { id: string; name: string }[] = await m.query(`SELECT id, name FROM instruments WHERE kind = 'bench'`);
  const configs: { id: string; key: string }[] = await m.query(
    `SELECT c.id, c.key FROM configurations c JOIN instruments i ON i.id = c.instrument_id WHERE i.name = 'Aurora line'`);
  const byName = new Map(benches.map((b) => [b.name, b.id]));
  for (const [name, keys] of Object.entries(feeds)) {
    const stationId = byName.get(name);
    if (!stationId) continue;
    await m.query(`INSERT INTO station_configurations (station_id, configuration_id) SELECT $1, unnest($2::uuid[])`,
      [stationId, configs.filter((c) => keys.includes(c.key)).map((c) => c.id)]);
  }
  const pumpProbe = byName.get('Pump-probe station');
  const autocorrelator = byName.get('Autocorrelator bench');
  if (!pumpProbe || !autocorrelator) return;
  // Pump-probe sessions take the station; sessions on the fundamental also take the autocorrelator for a pulse check.
  const bookings: { id: string; purpose: string; key: string }[] = await m.query(
    `SELECT b.id, b.purpose, c.key FROM timeline_blocks b JOIN configurations c ON c.id = b.configuration_id WHERE b.kind = 'booking' ORDER BY b.starts_at`);
  for (const b of bookings) {
    const stations = [
      ...(/pump-probe|gain recovery|reflectivity/i.test(b.purpose) && feeds['Pump-probe station']!.includes(b.key) ? [pumpProbe] : []),
      ...(b.key === 'fundamental' ? [autocorrelator] : []),
    ];
    await insertStations(m, b.id, stations);
  }
  // An evening realignment of the delay stage, after the day's sessions (they end at 17:30).
  const [y, mo, d] = localDate(new Date(now.getTime() + 86_400_000), timeZone).split('-').map(Number) as [number, number, number];
  await m.query(`INSERT INTO timeline_blocks (instrument_id, kind, status, starts_at, ends_at, reason) VALUES ($1, 'maintenance', 'scheduled', $2, $3, $4)`,
    [pumpProbe, zonedToUtc({ year: y, month: mo, day: d, hour: 18, minute: 0 }, timeZone), zonedToUtc({ year: y, month: mo, day: d, hour: 20, minute: 0 }, timeZone),
      'Delay-stage realignment on the pump-probe station']);
}
