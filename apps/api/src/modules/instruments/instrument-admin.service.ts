import {
  configurationValuesSchema, DEFAULT_PUMP_NM, formatNm, isEngineError, requiredOdGaps,
  type ChangeoverPairsInput, type ConfigurationInput, type ConfigurationUpdateInput, type InstrumentAdminDto, type InstrumentInput, type InstrumentUpdateInput,
} from '@femtoslot/shared';
import { instrumentInputSchema } from '@femtoslot/shared';
import type { EntityManager } from 'typeorm';
import type { SessionUser } from '../../lib/auth/session';
import type { AppContext } from '../../lib/context';
import { AppError, notFound } from '../../lib/errors/app-error';
import { recordAudit } from '../audit/audit.service';
import { affectedBookings, type InstrumentState } from './affected-bookings';
import { ChangeoverPair } from './changeover-pair.entity';
import { Configuration } from './configuration.entity';
import { Instrument } from './instrument.entity';

const plain = <T extends object>(row: T) => ({ ...row }) as Record<string, unknown>;

/** Every wavelength the configuration can put on the table needs a required OD: refuse a band list with holes. */
function checkBandsCoverTable(c: Pick<Configuration, 'outputKind' | 'minNm' | 'maxNm' | 'requiredOdBands' | 'name'>, pumpNm: number | null) {
  let gaps: { minNm: number; maxNm: number }[];
  try {
    gaps = requiredOdGaps({ outputKind: c.outputKind, minNm: c.minNm, maxNm: c.maxNm, pumpNm: pumpNm ?? DEFAULT_PUMP_NM }, c.requiredOdBands);
  } catch (error) {
    if (!isEngineError(error)) throw error;
    throw new AppError('out_of_range', `${c.name}'s tuning range cannot be generated: ${error.message}`, 422);
  }
  if (gaps.length) {
    const text = gaps.map((g) => (g.minNm === g.maxNm ? `${formatNm(g.minNm)} nm` : `${formatNm(g.minNm)}–${formatNm(g.maxNm)} nm`)).join(', ');
    throw new AppError('od_bands_incomplete', `No required OD is set for ${text}, which ${c.name} can put on the table; the laser-safety officer sets one for every wavelength`, 422, { uncoveredNm: gaps });
  }
}

export function instrumentAdminService(ctx: AppContext) {
  async function stateOf(m: EntityManager, instrumentId: string, lock = false): Promise<InstrumentState> {
    if (lock) await m.query('SELECT id FROM instruments WHERE id = $1 FOR UPDATE', [instrumentId]);
    const instrument = await m.getRepository(Instrument).findOneBy({ id: instrumentId });
    if (!instrument) throw notFound('Instrument');
    const configurations = await m.getRepository(Configuration).find({ where: { instrumentId }, order: { minNm: 'ASC' } });
    const pairs = await m.getRepository(ChangeoverPair).find({ where: { instrumentId } });
    return { instrument, configurations, pairs };
  }

  async function preview(m: EntityManager, current: InstrumentState, proposed: InstrumentState) {
    const reference = await ctx.reference.get(m);
    return affectedBookings(m, current, proposed, reference.activeEyewear, reference.facility.policies.horizonDays);
  }

  function toDto(s: InstrumentState): InstrumentAdminDto {
    const { createdAt: _c, ...instrument } = s.instrument;
    return {
      ...instrument,
      configurations: s.configurations.map((c) => ({ ...c })),
      changeoverPairs: s.pairs.map((p) => ({ fromConfigurationId: p.fromConfigurationId, toConfigurationId: p.toConfigurationId, baseMinutes: p.baseMinutes })),
    };
  }

  async function list(): Promise<InstrumentAdminDto[]> {
    const instruments = await ctx.db.getRepository(Instrument).find({ order: { kind: 'DESC', name: 'ASC' } });
    return Promise.all(instruments.map(async (i) => toDto(await stateOf(ctx.db.manager, i.id))));
  }

  function proposeInstrument(current: InstrumentState, input: InstrumentUpdateInput): InstrumentState {
    const instrument = Object.assign(new Instrument(), current.instrument, input);
    for (const c of current.configurations) if (c.active) checkBandsCoverTable(c, instrument.pumpNm);
    return { ...current, instrument };
  }

  function proposeConfiguration(current: InstrumentState, id: string, input: ConfigurationUpdateInput): InstrumentState {
    const row = current.configurations.find((c) => c.id === id);
    if (!row) throw notFound('Configuration');
    const values = configurationValuesSchema.parse({ ...row, ...input });
    const next = Object.assign(new Configuration(), row, values);
    checkBandsCoverTable(next, current.instrument.pumpNm);
    return { ...current, configurations: current.configurations.map((c) => (c.id === id ? next : c)) };
  }

  function proposePairs(current: InstrumentState, input: ChangeoverPairsInput): InstrumentState {
    const ids = new Set(current.configurations.map((c) => c.id));
    const stranger = input.pairs.find((p) => !ids.has(p.fromConfigurationId) || !ids.has(p.toConfigurationId));
    if (stranger) throw new AppError('rule_violation', 'A changeover pair names a configuration of another instrument', 422);
    const pairs = input.pairs.map((p) => Object.assign(new ChangeoverPair(), { instrumentId: current.instrument.id, ...p }));
    return { ...current, pairs };
  }

  const configurationOwner = async (m: EntityManager, id: string) => {
    const row = await m.getRepository(Configuration).findOneBy({ id });
    if (!row) throw notFound('Configuration');
    return row.instrumentId;
  };

  return {
    list,
    async createInstrument(actor: SessionUser, input: InstrumentInput, requestId?: string) {
      const values = instrumentInputSchema.parse(input);
      return ctx.db.transaction(async (m) => {
        const row = await m.getRepository(Instrument).save(m.getRepository(Instrument).create(values));
        await recordAudit(m, { actorUserId: actor.id, action: 'instrument.created', entityType: 'instrument', entityId: row.id, after: plain(values), requestId });
        return toDto(await stateOf(m, row.id));
      });
    },
    async previewInstrument(id: string, input: InstrumentUpdateInput) {
      return ctx.db.transaction(async (m) => {
        const current = await stateOf(m, id);
        return preview(m, current, proposeInstrument(current, input));
      });
    },
    async updateInstrument(actor: SessionUser, id: string, input: InstrumentUpdateInput, requestId?: string) {
      return ctx.db.transaction(async (m) => {
        const current = await stateOf(m, id, true);
        const next = proposeInstrument(current, input);
        await m.getRepository(Instrument).save(next.instrument);
        await recordAudit(m, { actorUserId: actor.id, action: 'instrument.updated', entityType: 'instrument', entityId: id, before: plain(current.instrument), after: plain(next.instrument), requestId });
        return toDto(await stateOf(m, id));
      });
    },
    async createConfiguration(actor: SessionUser, input: ConfigurationInput & { instrumentId: string }, requestId?: string) {
      return ctx.db.transaction(async (m) => {
        const current = await stateOf(m, input.instrumentId, true);
        const values = configurationValuesSchema.parse(input);
        checkBandsCoverTable(values, current.instrument.pumpNm);
        const row = await m.getRepository(Configuration).save(m.getRepository(Configuration).create({ ...values, instrumentId: input.instrumentId }));
        await recordAudit(m, { actorUserId: actor.id, action: 'configuration.created', entityType: 'configuration', entityId: row.id, after: plain(row), requestId });
        return toDto(await stateOf(m, input.instrumentId));
      });
    },
    async previewConfiguration(id: string, input: ConfigurationUpdateInput) {
      return ctx.db.transaction(async (m) => {
        const current = await stateOf(m, await configurationOwner(m, id));
        return preview(m, current, proposeConfiguration(current, id, input));
      });
    },
    async updateConfiguration(actor: SessionUser, id: string, input: ConfigurationUpdateInput, requestId?: string) {
      return ctx.db.transaction(async (m) => {
        const current = await stateOf(m, await configurationOwner(m, id), true);
        const next = proposeConfiguration(current, id, input);
        const before = current.configurations.find((c) => c.id === id)!;
        const after = next.configurations.find((c) => c.id === id)!;
        await m.getRepository(Configuration).save(after);
        await recordAudit(m, { actorUserId: actor.id, action: 'configuration.updated', entityType: 'configuration', entityId: id, before: plain(before), after: plain(after), requestId });
        return { configuration: after, instrument: toDto(await stateOf(m, current.instrument.id)) };
      });
    },
    async previewPairs(instrumentId: string, input: ChangeoverPairsInput) {
      return ctx.db.transaction(async (m) => {
        const current = await stateOf(m, instrumentId);
        return preview(m, current, proposePairs(current, input));
      });
    },
    async replacePairs(actor: SessionUser, instrumentId: string, input: ChangeoverPairsInput, requestId?: string) {
      return ctx.db.transaction(async (m) => {
        const current = await stateOf(m, instrumentId, true);
        const next = proposePairs(current, input);
        await m.getRepository(ChangeoverPair).delete({ instrumentId });
        if (next.pairs.length) await m.getRepository(ChangeoverPair).insert(next.pairs);
        const matrix = (s: InstrumentState) => ({ pairs: s.pairs.map((p) => ({ from: p.fromConfigurationId, to: p.toConfigurationId, baseMinutes: p.baseMinutes })) });
        await recordAudit(m, { actorUserId: actor.id, action: 'changeover_model.updated', entityType: 'instrument', entityId: instrumentId, before: matrix(current), after: matrix(next), requestId });
        return toDto(await stateOf(m, instrumentId));
      });
    },
  };
}
