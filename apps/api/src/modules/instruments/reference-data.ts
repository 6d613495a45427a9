import { parseChangeoverModel, type ChangeoverModel } from '@femtoslot/shared';
import type { DataSource, EntityManager } from 'typeorm';
import { FacilitySettings } from '../facility/facility-settings.entity';
import { Organisation } from '../organisations/organisation.entity';
import { EyewearItem } from '../safety/eyewear-item.entity';
import { ChangeoverPair } from './changeover-pair.entity';
import { Configuration } from './configuration.entity';
import { Instrument } from './instrument.entity';

export interface InstrumentTimeline {
  instrument: Instrument;
  configurations: Map<string, Configuration>;
  model: ChangeoverModel;
  /** The model through the engine's schema once, so a week of neighbours does not re-parse it per pair. */
  parsedModel: ChangeoverModel;
}

/** Everything staff or admins edit rarely and nearly every request reads, as of one revision. */
export interface ReferenceData {
  revision: string;
  facility: FacilitySettings;
  organisations: Map<string, Organisation>;
  /** Every instrument, active or not, with its configurations and changeover model. */
  timelines: Map<string, InstrumentTimeline>;
  configurations: Map<string, Configuration>;
  activeEyewear: EyewearItem[];
}

/** The changeover model of one instrument, assembled from its rows (editable by staff) into the engine's shape. */
export function modelOf(instrument: Instrument, configs: Configuration[], pairs: ChangeoverPair[]): ChangeoverModel {
  const byId = new Map(configs.map((c) => [c.id, c]));
  const byConfiguration: Record<string, number> = {};
  for (const c of configs) if (c.retuneMinutesPerNm !== null) byConfiguration[c.key] = c.retuneMinutesPerNm;
  return {
    pairs: pairs.flatMap((p) => {
      const from = byId.get(p.fromConfigurationId);
      const to = byId.get(p.toConfigurationId);
      return from && to ? [{ from: from.key, to: to.key, baseMinutes: p.baseMinutes }] : [];
    }),
    retuneMinutesPerNm: instrument.retuneMinutesPerNm,
    retuneMinutesPerNmByConfiguration: byConfiguration,
    warmupAfterMaintenanceMinutes: instrument.warmupAfterMaintenanceMinutes,
    pulseCheckMinutes: instrument.pulseCheckMinutes,
    defaultBaseMinutes: instrument.defaultChangeoverMinutes,
  };
}

async function load(m: EntityManager, revision: string): Promise<ReferenceData> {
  // One connection, in sequence: a request holds one pool connection, not six.
  const facility = await m.getRepository(FacilitySettings).findOneByOrFail({ id: 1 });
  const organisations = await m.getRepository(Organisation).find();
  const instruments = await m.getRepository(Instrument).find();
  const configs = await m.getRepository(Configuration).find();
  const pairs = await m.getRepository(ChangeoverPair).find();
  const activeEyewear = await m.getRepository(EyewearItem).findBy({ active: true });
  const timelines = new Map<string, InstrumentTimeline>();
  for (const instrument of instruments) {
    const own = configs.filter((c) => c.instrumentId === instrument.id);
    const model = modelOf(instrument, own, pairs.filter((p) => p.instrumentId === instrument.id));
    timelines.set(instrument.id, { instrument, configurations: new Map(own.map((c) => [c.id, c])), model, parsedModel: parseChangeoverModel(model) });
  }
  return {
    revision, facility, timelines, activeEyewear,
    organisations: new Map(organisations.map((o) => [o.id, o])),
    configurations: new Map(configs.map((c) => [c.id, c])),
  };
}

/**
 * A per-process copy of the reference data, checked against `reference_revision` (bumped by triggers) on every use:
 * one cheap read instead of six, and a change by any process, script or migration is seen by the next request.
 * Callers treat what they get as read-only.
 */
export class ReferenceCache {
  private current: ReferenceData | null = null;
  private loading: { revision: string; promise: Promise<ReferenceData> } | null = null;

  constructor(private readonly db: DataSource) {}

  static async revisionOf(m: EntityManager): Promise<string> {
    const rows: { revision: string }[] = await m.query('SELECT revision::text AS revision FROM reference_revision WHERE id = 1');
    return rows[0]?.revision ?? '0';
  }

  /** The data as of `revision` (read now when not given), loaded through the caller's manager when it changed. */
  async get(m: EntityManager = this.db.manager, revision?: string): Promise<ReferenceData> {
    const r = revision ?? (await ReferenceCache.revisionOf(m));
    if (this.current?.revision === r) return this.current;
    const joined = this.loading?.revision === r;
    if (!joined) {
      const promise = load(m, r);
      this.loading = { revision: r, promise };
      promise.then((data) => {
        // Revisions only grow; an older load finishing late never replaces a newer copy.
        if (!this.current || BigInt(data.revision) >= BigInt(this.current.revision)) this.current = data;
      }, () => undefined).finally(() => { if (this.loading?.promise === promise) this.loading = null; });
    }
    const shared = this.loading!.promise;
    if (!joined) return shared;
    // Another request's load failed with its transaction: load again on this one's rather than fail it too.
    return shared.catch(() => load(m, r));
  }
}
