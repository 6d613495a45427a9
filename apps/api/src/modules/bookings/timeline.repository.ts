import type { ChangeoverModel, SourceState, TimelineBlockInput } from '@femtoslot/shared';
import { In, LessThan, MoreThan, type EntityManager } from 'typeorm';
import { notFound } from '../../lib/errors/app-error';
import { ChangeoverPair } from '../instruments/changeover-pair.entity';
import { Configuration } from '../instruments/configuration.entity';
import { Instrument } from '../instruments/instrument.entity';
import { occupyingStatuses, TimelineBlock } from './timeline-block.entity';

export interface InstrumentTimeline {
  instrument: Instrument;
  configurations: Map<string, Configuration>;
  model: ChangeoverModel;
}

/** The source state a booking leaves the laser in; a scanned range is represented by its midpoint. */
export function stateOf(block: Pick<TimelineBlock, 'configurationId' | 'targetMinNm' | 'targetMaxNm'>, configurations: Map<string, Configuration>): SourceState | null {
  const c = block.configurationId ? configurations.get(block.configurationId) : undefined;
  if (!c || block.targetMinNm === null || block.targetMaxNm === null) return null;
  return { configurationKey: c.key, nm: (block.targetMinNm + block.targetMaxNm) / 2 };
}

/** The changeover model of one instrument, assembled from its rows (editable by staff) into the engine's shape. */
export async function loadInstrumentTimeline(m: EntityManager, instrumentId: string, { lock = false } = {}): Promise<InstrumentTimeline> {
  if (lock) {
    // Serialises every write to this instrument's timeline: two requests cannot both pass the gap check.
    await m.query('SELECT id FROM instruments WHERE id = $1 FOR UPDATE', [instrumentId]);
  }
  const instrument = await m.getRepository(Instrument).findOne({ where: { id: instrumentId, active: true } });
  if (!instrument) throw notFound('Instrument');
  const configs = await m.getRepository(Configuration).find({ where: { instrumentId } });
  const configurations = new Map(configs.map((c) => [c.id, c]));
  const pairs = await m.getRepository(ChangeoverPair).find({ where: { instrumentId } });
  const byConfiguration: Record<string, number> = {};
  for (const c of configs) if (c.retuneMinutesPerNm !== null) byConfiguration[c.key] = c.retuneMinutesPerNm;
  const model: ChangeoverModel = {
    pairs: pairs.flatMap((p) => {
      const from = configurations.get(p.fromConfigurationId);
      const to = configurations.get(p.toConfigurationId);
      return from && to ? [{ from: from.key, to: to.key, baseMinutes: p.baseMinutes }] : [];
    }),
    retuneMinutesPerNm: instrument.retuneMinutesPerNm,
    retuneMinutesPerNmByConfiguration: byConfiguration,
    warmupAfterMaintenanceMinutes: instrument.warmupAfterMaintenanceMinutes,
    pulseCheckMinutes: instrument.pulseCheckMinutes,
    defaultBaseMinutes: instrument.defaultChangeoverMinutes,
  };
  return { instrument, configurations, model };
}

export async function activeBlocksBetween(m: EntityManager, instrumentId: string, from: Date, to: Date): Promise<TimelineBlock[]> {
  return m.getRepository(TimelineBlock).find({
    where: { instrumentId, status: In([...occupyingStatuses]), startsAt: LessThan(to), endsAt: MoreThan(from) },
    order: { startsAt: 'ASC' },
  });
}

export function toEngineBlocks(blocks: TimelineBlock[], configurations: Map<string, Configuration>): TimelineBlockInput[] {
  return blocks.map((b) => ({ id: b.id, kind: b.kind, start: b.startsAt, end: b.endsAt, state: b.kind === 'booking' ? stateOf(b, configurations) : null }));
}
