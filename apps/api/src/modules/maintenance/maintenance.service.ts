import { randomUUID } from 'node:crypto';
import { findAlternativeSlots, type MaintenanceInput } from '@femtoslot/shared';
import { In, Not, type EntityManager } from 'typeorm';
import type { SessionUser } from '../../lib/auth/session';
import type { AppContext } from '../../lib/context';
import { AppError, notFound } from '../../lib/errors/app-error';
import { recordAudit } from '../audit/audit.service';
import { queueBookingMail } from '../bookings/booking-mail';
import { auditSnapshot, toBookingDto, toMaintenanceDto } from '../bookings/booking.dto';
import { loadLookups } from '../bookings/lookups';
import { TimelineBlock } from '../bookings/timeline-block.entity';
import { activeBookingsUsing, occupyingBlocks, stateOf, timelineOf, toEngineBlocks } from '../bookings/timeline.repository';
import { slotsWithStationsFree, stationIdsOf } from '../stations/stations.service';

const DAY = 86_400_000;

export function maintenanceService(ctx: AppContext) {
  /**
   * Marks every active booking the window covers — or that starts inside the warm-up after it — as displaced, in the
   * caller's transaction, and offers each owner three free slots of the same length and configuration.
   */
  async function displaceUnder(m: EntityManager, actor: SessionUser, window: { id: string; instrumentId: string; startsAt: Date; endsAt: Date; reason: string }, requestId?: string) {
    const { timeline } = await timelineOf(ctx.reference, m, window.instrumentId, { lock: true });
    const warmupEnd = new Date(window.endsAt.getTime() + timeline.model.warmupAfterMaintenanceMinutes * 60_000);
    const victims = await activeBookingsUsing(m, window.instrumentId, window.startsAt, warmupEnd);
    for (const v of victims) {
      const before = auditSnapshot(v);
      // displaced_by is linked once the window row exists (see linkVictims): the window is inserted after its victims step aside.
      await m.getRepository(TimelineBlock).update({ id: v.id }, { status: 'displaced', cancellationFeePercent: 0, sequence: v.sequence + 1 });
      Object.assign(v, { status: 'displaced', displacedBy: window.id, cancellationFeePercent: 0, sequence: v.sequence + 1 });
      await recordAudit(m, { actorUserId: actor.id, action: 'booking.displaced', entityType: 'booking', entityId: v.id, before, after: { ...auditSnapshot(v), maintenanceId: window.id }, requestId });
    }
    return { victims, timeline };
  }

  async function linkVictims(m: EntityManager, victims: TimelineBlock[], windowId: string) {
    if (victims.length) await m.getRepository(TimelineBlock).update({ id: In(victims.map((v) => v.id)) }, { displacedBy: windowId });
  }

  async function offerAlternatives(m: EntityManager, victims: TimelineBlock[], _windowInstrumentId: string, reason: string) {
    if (victims.length === 0) return;
    // A window on a bench displaces bookings of the source(s) feeding it: alternatives are found on each booking's own source.
    for (const instrumentId of new Set(victims.map((v) => v.instrumentId))) await offerAlternativesOn(m, victims.filter((v) => v.instrumentId === instrumentId), instrumentId, reason);
  }

  async function offerAlternativesOn(m: EntityManager, victims: TimelineBlock[], instrumentId: string, reason: string) {
    const { timeline, reference: { facility } } = await timelineOf(ctx.reference, m, instrumentId);
    const now = Date.now();
    const horizonEnd = new Date(now + facility.policies.horizonDays * DAY);
    const blocks = toEngineBlocks(await occupyingBlocks(m, new Date(now - DAY), new Date(horizonEnd.getTime() + DAY), instrumentId), timeline.configurations);
    const stations = await stationIdsOf(m, victims.map((v) => v.id));
    for (const v of victims) {
      const state = stateOf(v, timeline.configurations);
      const duration = v.endsAt.getTime() - v.startsAt.getTime();
      // Start looking from the original slot (or from now plus the external lead time, if that is later).
      const from = Math.max(v.startsAt.getTime(), now + facility.policies.externalLeadHours * 3_600_000);
      const own = stations.get(v.id) ?? [];
      // With end stations, more candidates on the source, then those that leave the stations free too.
      const found = state ? findAlternativeSlots(blocks, { start: new Date(from), end: new Date(from + duration), state }, { model: timeline.model, count: own.length ? 12 : 3, horizonEnd, stepMinutes: 120 }) : [];
      const slots = (await slotsWithStationsFree(m, v.id, own, found)).slice(0, 3);
      v.alternatives = slots.map((s) => ({ startsAt: s.start.toISOString(), endsAt: s.end.toISOString() }));
      await m.getRepository(TimelineBlock).update({ id: v.id }, { alternatives: v.alternatives });
      await queueBookingMail(ctx, m, 'displaced', v, { reason });
    }
  }

  async function create(actor: SessionUser, input: MaintenanceInput, requestId?: string) {
    return ctx.db.transaction(async (m) => {
      const window = { id: randomUUID(), instrumentId: input.instrumentId, startsAt: new Date(input.startsAt), endsAt: new Date(input.endsAt), reason: input.reason };
      const { victims } = await displaceUnder(m, actor, window, requestId);
      const saved = await m.getRepository(TimelineBlock).save(m.getRepository(TimelineBlock).create({ ...window, kind: 'maintenance', status: 'scheduled', createdBy: actor.id }));
      await linkVictims(m, victims, saved.id);
      await recordAudit(m, { actorUserId: actor.id, action: 'maintenance.scheduled', entityType: 'maintenance', entityId: saved.id, after: auditSnapshot(saved), requestId });
      await offerAlternatives(m, victims, window.instrumentId, input.reason);
      const look = await loadLookups(m, victims);
      return { maintenance: toMaintenanceDto(saved), displaced: victims.map((v) => toBookingDto(v, actor, look)) };
    });
  }

  async function update(actor: SessionUser, id: string, input: { startsAt: string; endsAt: string; reason?: string }, requestId?: string) {
    return ctx.db.transaction(async (m) => {
      const w = await m.getRepository(TimelineBlock).findOne({ where: { id, kind: 'maintenance', status: Not('cancelled') }, lock: { mode: 'pessimistic_write' } });
      if (!w) throw notFound('Maintenance window');
      const before = auditSnapshot(w);
      const next = { id, instrumentId: w.instrumentId, startsAt: new Date(input.startsAt), endsAt: new Date(input.endsAt), reason: input.reason ?? w.reason ?? '' };
      const { victims } = await displaceUnder(m, actor, next, requestId);
      Object.assign(w, { startsAt: next.startsAt, endsAt: next.endsAt, reason: next.reason });
      await m.getRepository(TimelineBlock).save(w);
      await linkVictims(m, victims, id);
      await recordAudit(m, { actorUserId: actor.id, action: 'maintenance.updated', entityType: 'maintenance', entityId: id, before, after: auditSnapshot(w), requestId });
      await offerAlternatives(m, victims, w.instrumentId, next.reason);
      const look = await loadLookups(m, victims);
      return { maintenance: toMaintenanceDto(w), displaced: victims.map((v) => toBookingDto(v, actor, look)) };
    });
  }

  async function remove(actor: SessionUser, id: string, requestId?: string) {
    await ctx.db.transaction(async (m) => {
      const w = await m.getRepository(TimelineBlock).findOne({ where: { id, kind: 'maintenance' }, lock: { mode: 'pessimistic_write' } });
      if (!w) throw notFound('Maintenance window');
      if (w.status === 'cancelled') throw new AppError('invalid_state', 'That maintenance window is already cancelled', 409);
      const before = auditSnapshot(w);
      await m.getRepository(TimelineBlock).update({ id }, { status: 'cancelled' });
      await recordAudit(m, { actorUserId: actor.id, action: 'maintenance.cancelled', entityType: 'maintenance', entityId: id, before, after: { ...before, status: 'cancelled' }, requestId });
    });
  }

  return { create, update, remove };
}
