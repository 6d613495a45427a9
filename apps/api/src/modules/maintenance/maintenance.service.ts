import { randomUUID } from 'node:crypto';
import type { MaintenanceInput } from '@femtoslot/shared';
import { In, Not, type EntityManager } from 'typeorm';
import type { SessionUser } from '../../lib/auth/session';
import type { AppContext } from '../../lib/context';
import { AppError, notFound } from '../../lib/errors/app-error';
import { recordAudit } from '../audit/audit.service';
import { queueBookingMail } from '../bookings/booking-mail';
import { auditSnapshot, toBookingDto, toMaintenanceDto } from '../bookings/booking.dto';
import { loadLookups } from '../bookings/lookups';
import { TimelineBlock } from '../bookings/timeline-block.entity';
import { activeBookingsUsing, timelineOf } from '../bookings/timeline.repository';
import { findOffers, warmupConflictAfter, type WarmupConflict } from './maintenance-offers';

export function maintenanceService(ctx: AppContext) {
  /**
   * Marks every active booking whose own interval overlaps the window as displaced, in the caller's transaction. A
   * booking that only starts inside the warm-up after the window is not displaced: see warmupConflictAfter.
   */
  async function displaceUnder(m: EntityManager, actor: SessionUser, window: { id: string; instrumentId: string; startsAt: Date; endsAt: Date; reason: string }, requestId?: string) {
    const { timeline } = await timelineOf(ctx.reference, m, window.instrumentId, { lock: true });
    // Bookings on this instrument, and bookings elsewhere that take this bench along as an end station.
    const victims = await activeBookingsUsing(m, window.instrumentId, window.startsAt, window.endsAt);
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

  async function offerAlternatives(m: EntityManager, victims: TimelineBlock[], reason: string) {
    // A window on a bench displaces bookings of the source(s) feeding it: alternatives are found on each booking's own source.
    const offers = new Map<string, { startsAt: string; endsAt: string }[]>();
    for (const instrumentId of new Set(victims.map((v) => v.instrumentId))) {
      for (const [id, o] of await findOffers(ctx, m, victims.filter((v) => v.instrumentId === instrumentId), instrumentId)) offers.set(id, o);
    }
    for (const v of victims) {
      v.alternatives = offers.get(v.id) ?? [];
      await m.getRepository(TimelineBlock).update({ id: v.id }, { alternatives: v.alternatives });
      await queueBookingMail(ctx, m, 'displaced', v, { reason });
    }
  }

  /** Flags (audit + answer) the booking after the window whose warm-up the window now cuts short. */
  async function flagWarmup(m: EntityManager, actor: SessionUser, window: { id: string; instrumentId: string; endsAt: Date }, requestId?: string): Promise<WarmupConflict[]> {
    const found = await warmupConflictAfter(m, ctx, window);
    if (!found) return [];
    await recordAudit(m, { actorUserId: actor.id, action: 'booking.warmup_conflict', entityType: 'booking', entityId: found.block.id, after: { ...found.conflict, maintenanceId: window.id }, requestId });
    return [found.conflict];
  }

  async function create(actor: SessionUser, input: MaintenanceInput, requestId?: string) {
    return ctx.db.transaction(async (m) => {
      const window = { id: randomUUID(), instrumentId: input.instrumentId, startsAt: new Date(input.startsAt), endsAt: new Date(input.endsAt), reason: input.reason };
      const { victims } = await displaceUnder(m, actor, window, requestId);
      const saved = await m.getRepository(TimelineBlock).save(m.getRepository(TimelineBlock).create({ ...window, kind: 'maintenance', status: 'scheduled', createdBy: actor.id }));
      await linkVictims(m, victims, saved.id);
      await recordAudit(m, { actorUserId: actor.id, action: 'maintenance.scheduled', entityType: 'maintenance', entityId: saved.id, after: auditSnapshot(saved), requestId });
      await offerAlternatives(m, victims, input.reason);
      const warmupConflicts = await flagWarmup(m, actor, saved, requestId);
      const look = await loadLookups(m, victims);
      return { maintenance: toMaintenanceDto(saved), displaced: victims.map((v) => toBookingDto(v, actor, look)), warmupConflicts };
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
      await offerAlternatives(m, victims, next.reason);
      const warmupConflicts = await flagWarmup(m, actor, w, requestId);
      const look = await loadLookups(m, victims);
      return { maintenance: toMaintenanceDto(w), displaced: victims.map((v) => toBookingDto(v, actor, look)), warmupConflicts };
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
