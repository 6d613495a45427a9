import { cancellationFeePercent, minutesNeededAfterBlock, type CalendarDto, type ChangeoverBandDto, type CreateBooking, type MoveBookingInput } from '@femtoslot/shared';
import { In, IsNull, MoreThan, type EntityManager } from 'typeorm';
import type { SessionUser } from '../../lib/auth/session';
import type { AppContext } from '../../lib/context';
import type { OutboxJob } from '../../lib/mail/outbox';
import { AppError, forbidden, notFound } from '../../lib/errors/app-error';
import { recordAudit } from '../audit/audit.service';
import { AuditEvent } from '../audit/audit-event.entity';
import { User } from '../users/user.entity';
import { queueBookingMail } from './booking-mail';
import { USAGE_REMINDER_QUEUE } from '../usage/usage.service';
import { auditSnapshot, canSeeDetail, facilityWideRoles, toBookingDto, toMaintenanceDto } from './booking.dto';
import { evaluateBooking, throwFirst } from './booking-evaluation';
import { loadLookups, lookupsOf } from './lookups';
import { TimelineBlock } from './timeline-block.entity';
import { engineKind, insertBooking, occupyingBlocksNamed, oneAtATimePerInstrument, stateOf } from './timeline.repository';
import { insertStations, stationIdsOf } from '../stations/stations.service';

const REMINDER_QUEUE = 'booking-reminder';

export function bookingsService(ctx: AppContext) {
  const db = ctx.db;

  async function sessionUserOf(m: EntityManager, userId: string): Promise<SessionUser> {
    const u = await m.getRepository(User).findOneByOrFail({ id: userId });
    return { id: u.id, role: u.role, organisationId: u.organisationId, email: u.email, name: u.name };
  }

  /** Two hours after the end the owner is reminded to log the session (if no log exists by then); 24 h before, of the session. */
  function reminderJobs(b: TimelineBlock): OutboxJob[] {
    if (b.status !== 'approved') return [];
    const jobs: OutboxJob[] = [{ queue: USAGE_REMINDER_QUEUE, data: { bookingId: b.id }, startAfter: new Date(b.endsAt.getTime() + 2 * 3_600_000) }];
    const at = new Date(b.startsAt.getTime() - 24 * 3_600_000);
    if (at.getTime() >= Date.now()) jobs.push({ queue: REMINDER_QUEUE, data: { bookingId: b.id, startsAt: b.startsAt.toISOString() }, startAfter: at });
    return jobs;
  }

  async function scheduleReminder(m: EntityManager, b: TimelineBlock): Promise<void> {
    await ctx.outbox.sendJobs(m, reminderJobs(b));
  }

  async function loadForUpdate(m: EntityManager, id: string): Promise<TimelineBlock> {
    const b = await m.getRepository(TimelineBlock).findOne({ where: { id, kind: 'booking' }, lock: { mode: 'pessimistic_write' } });
    if (!b) throw notFound('Booking');
    return b;
  }

  async function dtoOf(m: EntityManager, b: TimelineBlock, viewer: SessionUser) {
    return toBookingDto(b, viewer, await loadLookups(m, [b]));
  }

  /** Two statements with the session read: the blocks with their names, and (when it changed) the reference data. */
  async function calendar(viewer: SessionUser, q: { from: string; to: string; instrumentId?: string }, referenceRevision?: string): Promise<CalendarDto> {
    const { blocks, users, accounts } = await occupyingBlocksNamed(db.manager, new Date(q.from), new Date(q.to), q.instrumentId);
    const reference = await ctx.reference.get(db.manager, referenceRevision);
    const look = lookupsOf(reference, users, accounts);
    const changeovers: ChangeoverBandDto[] = [];
    const byInstrument = new Map<string, TimelineBlock[]>();
    for (const b of blocks) {
      // Viewing a bench, the bookings that include it are not its neighbours on the source: no changeover bands.
      if (q.instrumentId && b.instrumentId !== q.instrumentId) continue;
      const list = byInstrument.get(b.instrumentId);
      if (list) list.push(b); else byInstrument.set(b.instrumentId, [b]);
    }
    const before = new Map<string, number>();
    for (const [instrumentId, list] of byInstrument) {
      const t = reference.timelines.get(instrumentId);
      if (!t) continue;
      for (let i = 1; i < list.length; i++) {
        const prev = list[i - 1]!;
        const next = list[i]!;
        const nextState = next.kind === 'booking' ? stateOf(next, t.configurations) : null;
        if (!nextState) continue;
        const minutes = minutesNeededAfterBlock({ kind: engineKind(prev.kind), state: stateOf(prev, t.configurations) }, nextState, t.parsedModel);
        before.set(next.id, minutes);
        if (minutes <= 0) continue;
        changeovers.push({
          instrumentId, afterId: prev.id, beforeId: next.id, startsAt: prev.endsAt.toISOString(),
          endsAt: new Date(prev.endsAt.getTime() + minutes * 60_000).toISOString(), minutes,
          availableMinutes: Math.round((next.startsAt.getTime() - prev.endsAt.getTime()) / 60_000),
        });
      }
    }
    return {
      bookings: blocks.filter((b) => b.kind === 'booking').map((b) => toBookingDto(b, viewer, look, before.get(b.id) ?? null)),
      maintenance: blocks.filter((b) => b.kind === 'maintenance').map(toMaintenanceDto),
      changeovers,
    };
  }

  async function check(actor: SessionUser, input: CreateBooking) {
    const e = await evaluateBooking(db.manager, ctx.reference, { ...input, startsAt: new Date(input.startsAt), endsAt: new Date(input.endsAt), owner: actor }, { lock: false });
    return e.dto;
  }

  async function create(actor: SessionUser, input: CreateBooking, requestId?: string) {
    return oneAtATimePerInstrument(input.instrumentId, () => db.transaction(async (m) => {
      const e = await evaluateBooking(m, ctx.reference, { ...input, startsAt: new Date(input.startsAt), endsAt: new Date(input.endsAt), owner: actor }, { lock: true });
      throwFirst(e.problems);
      let rebookOf: TimelineBlock | null = null;
      if (input.rebookOf) {
        rebookOf = await loadForUpdate(m, input.rebookOf);
        if (rebookOf.organisationId !== actor.organisationId || rebookOf.status !== 'displaced' || rebookOf.rebookedAs) {
          throw new AppError('rule_violation', 'Only a displaced booking of your organisation that is not yet rebooked can be rebooked', 422);
        }
      }
      const t = input.target;
      const targetMinNm = 'targetNm' in t ? t.targetNm : t.minNm;
      const targetMaxNm = 'targetNm' in t ? t.targetNm : t.maxNm;
      // An approved booking displaced by maintenance and rebooked into one of the slots offered for it, unchanged
      // otherwise, keeps its approval: staff already reviewed that session, and the facility moved it.
      const keepsApproval = !!rebookOf?.decidedBy && rebookOf.configurationId === input.configurationId && rebookOf.accountId === input.accountId
        && rebookOf.targetMinNm === targetMinNm && rebookOf.targetMaxNm === targetMaxNm
        && rebookOf.alternatives.some((a) => Date.parse(a.startsAt) === Date.parse(input.startsAt) && Date.parse(a.endsAt) === Date.parse(input.endsAt));
      const status = keepsApproval ? 'approved' : e.status;
      const saved = await insertBooking(m, {
        instrumentId: input.instrumentId, status, startsAt: new Date(input.startsAt), endsAt: new Date(input.endsAt),
        configurationId: input.configurationId, targetMinNm, targetMaxNm,
        accountId: input.accountId, userId: actor.id, organisationId: actor.organisationId, purpose: input.purpose, createdBy: actor.id,
        decidedBy: keepsApproval ? rebookOf!.decidedBy : e.status === 'approved' ? actor.id : null,
        decidedAt: keepsApproval ? rebookOf!.decidedAt : e.status === 'approved' ? new Date() : null,
      });
      saved.stationIds = await insertStations(m, saved.id, input.stationIds ?? []);
      if (rebookOf) await m.getRepository(TimelineBlock).update({ id: rebookOf.id }, { rebookedAs: saved.id });
      await recordAudit(m, { actorUserId: actor.id, action: `booking.${status}`, entityType: 'booking', entityId: saved.id, after: { ...auditSnapshot(saved), stationIds: saved.stationIds, ...(keepsApproval ? { rebookOf: rebookOf!.id, note: 'approval kept: rebooked into an offered slot' } : {}) }, requestId });
      await queueBookingMail(ctx, m, status === 'approved' ? 'approved' : 'received', saved, { recipient: actor, reference: e.reference, jobs: reminderJobs(saved) });
      // Every name the answer shows is already at hand: no lookups.
      const look = lookupsOf(e.reference, new Map([[actor.id, actor.name]]), new Map(e.account ? [[e.account.id, e.account.name]] : []));
      return {
        booking: toBookingDto(saved, actor, look),
        changeover: { beforeMinutes: e.check?.before?.neededMinutes ?? 0, afterMinutes: e.check?.after?.neededMinutes ?? 0 },
        derived: e.dto.derived,
        onTable: e.dto.onTable,
      };
    }));
  }

  async function get(viewer: SessionUser, id: string) {
    const b = await db.getRepository(TimelineBlock).findOne({ where: { id, kind: 'booking' } });
    if (!b) throw notFound('Booking');
    const booking = await dtoOf(db.manager, b, viewer);
    if (viewer.role !== 'staff' && viewer.role !== 'admin') return { booking };
    const events = await db.getRepository(AuditEvent).find({ where: { entityType: 'booking', entityId: id }, order: { createdAt: 'ASC', id: 'ASC' } });
    const actors = await db.getRepository(User).findBy({ id: In(events.map((e) => e.actorUserId).filter((x): x is string => !!x)) });
    const name = new Map(actors.map((a) => [a.id, a.name]));
    return { booking, audit: events.map((e) => ({ action: e.action, actorName: e.actorUserId ? name.get(e.actorUserId) ?? 'unknown' : 'system', createdAt: e.createdAt.toISOString(), before: e.before, after: e.after })) };
  }

  async function decide(actor: SessionUser, id: string, decision: 'approved' | 'declined', reason: string | null, requestId?: string) {
    return db.transaction(async (m) => {
      const b = await loadForUpdate(m, id);
      if (b.status !== 'requested') throw new AppError('invalid_state', `Only a request awaiting approval can be ${decision}; this booking is ${b.status}`, 409);
      const before = auditSnapshot(b);
      Object.assign(b, { status: decision, decidedBy: actor.id, decidedAt: new Date(), declineReason: decision === 'declined' ? reason : null, sequence: b.sequence + 1 });
      await m.getRepository(TimelineBlock).save(b);
      await recordAudit(m, { actorUserId: actor.id, action: `booking.${decision}`, entityType: 'booking', entityId: id, before, after: auditSnapshot(b), requestId });
      await queueBookingMail(ctx, m, decision, b, { reason, jobs: reminderJobs(b) });
      return dtoOf(m, b, actor);
    });
  }

  async function cancel(actor: SessionUser, id: string, reason: string | null, requestId?: string) {
    return db.transaction(async (m) => {
      const b = await loadForUpdate(m, id);
      const mayCancel = actor.role === 'staff' || b.userId === actor.id || (actor.role === 'pi' && b.organisationId === actor.organisationId);
      if (!canSeeDetail(actor, b) || !mayCancel) throw forbidden('Only the booking’s owner, their PI or facility staff can cancel it');
      if (b.status !== 'requested' && b.status !== 'approved') throw new AppError('invalid_state', `A ${b.status} booking cannot be cancelled`, 409);
      const { facility } = await ctx.reference.get(m);
      const now = new Date();
      // A request staff never approved costs nothing to withdraw.
      const fee = b.status === 'requested' ? 0 : cancellationFeePercent(b.startsAt, now, facility.policies);
      const before = auditSnapshot(b);
      Object.assign(b, { status: 'cancelled', cancelledBy: actor.id, cancelledAt: now, cancellationFeePercent: fee, declineReason: reason, sequence: b.sequence + 1 });
      await m.getRepository(TimelineBlock).save(b);
      await recordAudit(m, { actorUserId: actor.id, action: 'booking.cancelled', entityType: 'booking', entityId: id, before, after: auditSnapshot(b), requestId });
      await queueBookingMail(ctx, m, 'cancelled', b, { feePercent: fee });
      return dtoOf(m, b, actor);
    });
  }

  async function move(actor: SessionUser, id: string, input: MoveBookingInput, requestId?: string) {
    return db.transaction(async (m) => {
      const b = await loadForUpdate(m, id);
      if (b.status !== 'requested' && b.status !== 'approved') throw new AppError('invalid_state', `A ${b.status} booking cannot be moved`, 409);
      const owner = await sessionUserOf(m, b.userId!);
      const e = await evaluateBooking(m, ctx.reference, {
        instrumentId: b.instrumentId, configurationId: b.configurationId!, startsAt: new Date(input.startsAt), endsAt: new Date(input.endsAt),
        target: { minNm: b.targetMinNm!, maxNm: b.targetMaxNm! }, accountId: b.accountId!, owner, excludeId: b.id,
        stationIds: (await stationIdsOf(m, [b.id])).get(b.id),
      }, { lock: true });
      // Staff may move inside the lead time; the physics, safety and timeline rules still hold.
      throwFirst(e.problems.filter((p) => !(p.code === 'rule_violation' && (p.details as { rule?: string })?.rule === 'lead_time')));
      const before = auditSnapshot(b);
      Object.assign(b, { startsAt: new Date(input.startsAt), endsAt: new Date(input.endsAt), sequence: b.sequence + 1 });
      await m.getRepository(TimelineBlock).save(b);
      await recordAudit(m, { actorUserId: actor.id, action: 'booking.moved', entityType: 'booking', entityId: id, before, after: { ...auditSnapshot(b), note: input.note ?? null }, requestId });
      await queueBookingMail(ctx, m, 'moved', b, { recipient: owner, jobs: reminderJobs(b) });
      return dtoOf(m, b, actor);
    });
  }

  async function needsRebooking(viewer: SessionUser) {
    const where = { kind: 'booking' as const, status: 'displaced' as const, rebookedAs: IsNull(), ...(facilityWideRoles.has(viewer.role) ? {} : { organisationId: viewer.organisationId }) };
    const rows = await db.getRepository(TimelineBlock).find({ where, order: { startsAt: 'ASC' } });
    const look = await loadLookups(db.manager, rows);
    return rows.map((b) => toBookingDto(b, viewer, look));
  }

  async function pending(viewer: SessionUser) {
    const rows = await db.getRepository(TimelineBlock).find({ where: { kind: 'booking', status: 'requested', startsAt: MoreThan(new Date()) }, order: { startsAt: 'ASC' } });
    const look = await loadLookups(db.manager, rows);
    return rows.map((b) => toBookingDto(b, viewer, look));
  }

  async function sendReminder(data: { bookingId: string; startsAt: string }) {
    await db.transaction(async (m) => {
      const b = await m.getRepository(TimelineBlock).findOneBy({ id: data.bookingId });
      // A booking moved or cancelled since the job was queued has its own (or no) reminder.
      if (!b || b.status !== 'approved' || b.startsAt.toISOString() !== data.startsAt) return;
      await queueBookingMail(ctx, m, 'reminder', b);
    });
  }

  return { calendar, check, create, get, decide, cancel, move, needsRebooking, pending, sendReminder, scheduleReminder };
}

export async function startBookingJobs(ctx: AppContext): Promise<void> {
  const service = bookingsService(ctx);
  await ctx.outbox.work<{ bookingId: string; startsAt: string }>(REMINDER_QUEUE, (d) => service.sendReminder(d));
}
