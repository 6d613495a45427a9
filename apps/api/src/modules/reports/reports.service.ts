import { autocorrelationFactors, minutesNeededAfterBlock, type PulseShape, type TuningCoverageDto, type UtilisationReportDto, type UtilisationRowDto } from '@femtoslot/shared';
import type { SessionUser } from '../../lib/auth/session';
import type { AppContext } from '../../lib/context';
import { FacilitySettings } from '../facility/facility-settings.entity';
import { TimelineBlock } from '../bookings/timeline-block.entity';
import { engineKind, stateOf, timelineOf } from '../bookings/timeline.repository';

export interface ReportQuery {
  from: string;
  to: string;
  groupBy: 'week' | 'month';
  instrumentId?: string;
}

const hours = (n: unknown) => Math.round(Number(n ?? 0) * 100) / 100;

/**
 * Each block counts in the period (week from Monday, or month, in the facility's zone) in which it starts.
 * A pi sees their own group's booked and logged hours; staff and finance see everyone's.
 */
export function reportsService(ctx: AppContext) {
  async function scope(viewer: SessionUser) {
    const facility = await ctx.db.getRepository(FacilitySettings).findOneByOrFail({ id: 1 });
    return { tz: facility.timeZone, org: viewer.role === 'pi' ? viewer.organisationId : null, spec: facility.policies.pumpPulseSpecFs ?? null };
  }

  async function utilisation(viewer: SessionUser, q: ReportQuery): Promise<UtilisationReportDto> {
    const { tz, org } = await scope(viewer);
    const params = [q.from, q.to, tz, q.groupBy, q.instrumentId ?? null, org];
    const period = `to_char(date_trunc($4, b.starts_at AT TIME ZONE $3), 'YYYY-MM-DD')`;
    const base = `b.starts_at >= $1 AND b.starts_at < $2 AND ($5::uuid IS NULL OR b.instrument_id = $5)`;
    // Same placeholders as the period queries, without the zone and grouping, for the totals.
    const totalsBase = `b.starts_at >= $1 AND b.starts_at < $2 AND ($3::uuid IS NULL OR b.instrument_id = $3) AND ($4::uuid IS NULL OR b.organisation_id = $4)`;
    const totalsParams = [q.from, q.to, q.instrumentId ?? null, org];
    const booked: { period: string; instrument_id: string; name: string; h: string }[] = await ctx.db.query(`
      SELECT ${period} AS period, b.instrument_id, i.name, SUM(EXTRACT(EPOCH FROM (b.ends_at - b.starts_at)) / 3600) AS h
      FROM timeline_blocks b JOIN instruments i ON i.id = b.instrument_id
      WHERE ${base} AND b.kind = 'booking' AND b.status IN ('approved','completed') AND ($6::uuid IS NULL OR b.organisation_id = $6)
      GROUP BY 1, 2, 3`, params);
    const logged: { period: string; instrument_id: string; name: string; h: string }[] = await ctx.db.query(`
      SELECT ${period} AS period, b.instrument_id, i.name, SUM(EXTRACT(EPOCH FROM (u.actual_ends_at - u.actual_starts_at)) / 3600) AS h
      FROM usage_logs u JOIN timeline_blocks b ON b.id = u.booking_id JOIN instruments i ON i.id = b.instrument_id
      WHERE ${base} AND ($6::uuid IS NULL OR b.organisation_id = $6)
      GROUP BY 1, 2, 3`, params);
    const maintenance: { period: string; instrument_id: string; name: string; h: string }[] = await ctx.db.query(`
      SELECT ${period} AS period, b.instrument_id, i.name, SUM(EXTRACT(EPOCH FROM (b.ends_at - b.starts_at)) / 3600) AS h
      FROM timeline_blocks b JOIN instruments i ON i.id = b.instrument_id
      WHERE ${base} AND b.kind = 'maintenance' AND b.status = 'scheduled'
      GROUP BY 1, 2, 3`, params.slice(0, 5));
    const changeover = await changeoverHours(q, tz);

    const rows = new Map<string, UtilisationRowDto>();
    const row = (period: string, instrumentId: string, name: string) => {
      const key = `${period}|${instrumentId}`;
      let r = rows.get(key);
      if (!r) rows.set(key, (r = { period, instrumentId, instrumentName: name, bookedHours: 0, loggedHours: 0, maintenanceHours: 0, changeoverHours: 0 }));
      return r;
    };
    for (const r of booked) row(r.period, r.instrument_id, r.name).bookedHours = hours(r.h);
    for (const r of logged) row(r.period, r.instrument_id, r.name).loggedHours = hours(r.h);
    for (const r of maintenance) row(r.period, r.instrument_id, r.name).maintenanceHours = hours(r.h);
    if (!org) for (const c of changeover) row(c.period, c.instrumentId, c.name).changeoverHours = hours(c.minutes / 60);

    const byConfiguration: { key: string; label: string; h: string }[] = await ctx.db.query(`
      SELECT c.key, c.name AS label, SUM(EXTRACT(EPOCH FROM (s.ends_at - s.starts_at)) / 3600) AS h
      FROM usage_segments s JOIN usage_logs u ON u.id = s.usage_log_id JOIN timeline_blocks b ON b.id = u.booking_id JOIN configurations c ON c.id = s.configuration_id
      WHERE ${totalsBase}
      GROUP BY 1, 2 ORDER BY 3 DESC`, totalsParams);
    const byOrganisation: { key: string; label: string; h: string }[] = await ctx.db.query(`
      SELECT o.id AS key, o.name AS label, SUM(EXTRACT(EPOCH FROM (u.actual_ends_at - u.actual_starts_at)) / 3600) AS h
      FROM usage_logs u JOIN timeline_blocks b ON b.id = u.booking_id JOIN organisations o ON o.id = b.organisation_id
      WHERE ${totalsBase}
      GROUP BY 1, 2 ORDER BY 3 DESC`, totalsParams);
    return {
      rows: [...rows.values()].sort((a, b) => a.period.localeCompare(b.period) || a.instrumentName.localeCompare(b.instrumentName)),
      byConfiguration: byConfiguration.map((r) => ({ key: r.key, label: r.label, loggedHours: hours(r.h) })),
      byOrganisation: byOrganisation.map((r) => ({ key: r.key, label: r.label, loggedHours: hours(r.h) })),
    };
  }

  /** Changeover the engine needs between consecutive blocks, counted in the period of the later block. */
  async function changeoverHours(q: ReportQuery, tz: string) {
    const blocks = await ctx.db.getRepository(TimelineBlock).createQueryBuilder('b')
      .where(`b.starts_at >= :from AND b.starts_at < :to AND b.status IN ('approved','completed','scheduled')`, { from: q.from, to: q.to })
      .andWhere(q.instrumentId ? 'b.instrument_id = :i' : 'true', { i: q.instrumentId })
      .orderBy('b.instrument_id').addOrderBy('b.starts_at').getMany();
    const periods: { period: string; starts: string }[] = blocks.length
      ? await ctx.db.query(`SELECT id AS starts, to_char(date_trunc($2, starts_at AT TIME ZONE $3), 'YYYY-MM-DD') AS period FROM timeline_blocks WHERE id = ANY($1)`, [blocks.map((b) => b.id), q.groupBy, tz])
      : [];
    const periodOf = new Map(periods.map((p) => [p.starts, p.period]));
    const out: { period: string; instrumentId: string; name: string; minutes: number }[] = [];
    const byInstrument = new Map<string, TimelineBlock[]>();
    for (const b of blocks) byInstrument.set(b.instrumentId, [...(byInstrument.get(b.instrumentId) ?? []), b]);
    for (const [instrumentId, list] of byInstrument) {
      const { timeline: t } = await timelineOf(ctx.reference, ctx.db.manager, instrumentId);
      const model = t.parsedModel;
      const sums = new Map<string, number>();
      for (let i = 1; i < list.length; i++) {
        const next = list[i]!;
        const prev = list[i - 1]!;
        const state = next.kind === 'booking' ? stateOf(next, t.configurations) : null;
        if (!state) continue;
        const minutes = minutesNeededAfterBlock({ kind: engineKind(prev.kind), state: stateOf(prev, t.configurations) }, state, model);
        const p = periodOf.get(next.id)!;
        sums.set(p, (sums.get(p) ?? 0) + minutes);
      }
      for (const [period, minutes] of sums) out.push({ period, instrumentId, name: t.instrument.name, minutes });
    }
    return out;
  }

  async function tuningCoverage(viewer: SessionUser, q: Omit<ReportQuery, 'groupBy'>): Promise<TuningCoverageDto> {
    const { org, spec } = await scope(viewer);
    const rows: { key: string; name: string; kind: string; starts_at: Date; min_nm: string; max_nm: string; pulse: string | null; shape: PulseShape | null }[] = await ctx.db.query(`
      SELECT c.key, c.name, c.output_kind AS kind, s.starts_at, s.min_nm, s.max_nm, s.pulse_fwhm_fs AS pulse, s.pulse_shape AS shape
      FROM usage_segments s JOIN usage_logs u ON u.id = s.usage_log_id JOIN timeline_blocks b ON b.id = u.booking_id JOIN configurations c ON c.id = s.configuration_id
      WHERE s.starts_at >= $1 AND s.starts_at < $2 AND ($3::uuid IS NULL OR b.instrument_id = $3) AND ($4::uuid IS NULL OR b.organisation_id = $4)
      ORDER BY s.starts_at`, [q.from, q.to, q.instrumentId ?? null, org]);
    return {
      segments: rows.map((r) => ({ configurationKey: r.key, configurationName: r.name, startsAt: new Date(r.starts_at).toISOString(), minNm: Number(r.min_nm), maxNm: Number(r.max_nm) })),
      // The pump is the fundamental output: its measured pulse durations over time.
      // Each point keeps its assumed shape, and the shape-free quantity actually measured (the AC FWHM), so that
      // Gaussian and sech² readings are never compared as if alike.
      pulseTrend: rows.filter((r) => r.kind === 'fundamental' && r.pulse !== null).map((r) => ({
        startsAt: new Date(r.starts_at).toISOString(), pulseFwhmFs: Number(r.pulse), configurationKey: r.key, pulseShape: r.shape,
        autocorrelationFwhmFs: r.shape ? Number(r.pulse) * autocorrelationFactors[r.shape] : null,
      })),
      pumpPulseSpecFs: spec,
    };
  }

  return { utilisation, tuningCoverage };
}
