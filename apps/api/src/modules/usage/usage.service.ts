import { checkTargetFeasibility, type UsageLogInput } from '@femtoslot/shared';
import { In, LessThanOrEqual, MoreThan, type EntityManager } from 'typeorm';
import type { SessionUser } from '../../lib/auth/session';
import type { AppContext } from '../../lib/context';
import { AppError, forbidden, notFound } from '../../lib/errors/app-error';
import { layout } from '../../lib/mail/templates';
import { recordAudit } from '../audit/audit.service';
import { Attachment } from '../attachments/attachment.entity';
import { facilityWideRoles, toBookingDto } from '../bookings/booking.dto';
import { loadLookups } from '../bookings/lookups';
import { TimelineBlock } from '../bookings/timeline-block.entity';
import { FacilitySettings } from '../facility/facility-settings.entity';
import { Configuration } from '../instruments/configuration.entity';
import { Instrument } from '../instruments/instrument.entity';
import { User } from '../users/user.entity';
import { toUsageLogDto } from './usage.dto';
import { UsageLog } from './usage-log.entity';
import { UsageSegment } from './usage-segment.entity';
import { logLockedError } from './log-lock';
import { assertInsideWindow, isOutsideGrace, usageWindow, verifiedPulses } from './session-bounds';

export const USAGE_REMINDER_QUEUE = 'usage-reminder';

export function usageService(ctx: AppContext) {
  const db = ctx.db;

  /** DTOs for many logs in four queries, whatever their number (the sessions list shows up to 300). */
  async function dtosFor(m: EntityManager, logs: UsageLog[]) {
    if (logs.length === 0) return [];
    const segments = await m.getRepository(UsageSegment).findBy({ usageLogId: In(logs.map((l) => l.id)) });
    const attachmentIds = [...new Set([...logs.flatMap((l) => l.attachmentIds), ...segments.map((s) => s.traceAttachmentId).filter((x): x is string => !!x)])];
    const attachments = attachmentIds.length ? await m.getRepository(Attachment).find({ where: { id: In(attachmentIds) }, order: { createdAt: 'ASC' } }) : [];
    const configs = new Map((await m.getRepository(Configuration).findBy({ id: In([...new Set(segments.map((s) => s.configurationId))]) })).map((c) => [c.id, c.key]));
    const userIds = [...new Set(logs.flatMap((l) => [l.submittedBy, l.confirmedBy, l.billedBy]).filter((x): x is string => !!x))];
    const users = new Map((await m.getRepository(User).findBy({ id: In(userIds) })).map((u) => [u.id, u.name]));
    return logs.map((log) => {
      const own = segments.filter((s) => s.usageLogId === log.id);
      const ids = new Set([...log.attachmentIds, ...own.map((s) => s.traceAttachmentId).filter((x): x is string => !!x)]);
      return toUsageLogDto(log, own, attachments.filter((a) => ids.has(a.id)), (id) => configs.get(id) ?? 'unknown', (id) => users.get(id) ?? 'unknown');
    });
  }

  const dtoFor = async (m: EntityManager, log: UsageLog) => (await dtosFor(m, [log]))[0]!;

  function assertMayLog(viewer: SessionUser, b: TimelineBlock) {
    if (b.organisationId !== viewer.organisationId && viewer.role !== 'staff') throw forbidden('Only the booking’s organisation and facility staff can log this session');
  }

  async function get(viewer: SessionUser, bookingId: string) {
    const b = await db.getRepository(TimelineBlock).findOneBy({ id: bookingId, kind: 'booking' });
    if (!b) throw notFound('Booking');
    if (b.organisationId !== viewer.organisationId && !facilityWideRoles.has(viewer.role)) throw forbidden('This session belongs to another organisation');
    const log = await db.getRepository(UsageLog).findOneBy({ bookingId });
    const facility = await db.getRepository(FacilitySettings).findOneByOrFail({ id: 1 });
    const look = await loadLookups(db.manager, [b]);
    return { booking: toBookingDto(b, viewer, look), log: log ? await dtoFor(db.manager, log) : null, graceMinutes: facility.policies.usageGraceMinutes ?? 30, window: usageWindow(b, facility) };
  }

  /** Checks every rule of a session log; the segment overlap is also a PostgreSQL exclusion constraint. */
  async function validate(m: EntityManager, b: TimelineBlock, facility: FacilitySettings, input: UsageLogInput) {
    const start = new Date(input.actualStartsAt).getTime();
    const end = new Date(input.actualEndsAt).getTime();
    assertInsideWindow(b, facility, start, end);
    const instrument = await m.getRepository(Instrument).findOneByOrFail({ id: b.instrumentId });
    const configs = new Map((await m.getRepository(Configuration).findBy({ instrumentId: b.instrumentId })).map((c) => [c.id, c]));
    const sorted = [...input.segments].sort((x, y) => Date.parse(x.startsAt) - Date.parse(y.startsAt));
    sorted.forEach((s, i) => {
      const c = configs.get(s.configurationId);
      if (!c) throw new AppError('out_of_range', `Segment ${i + 1} names a configuration that is not on ${instrument.name}`, 422, { segment: i });
      const f = checkTargetFeasibility({ minNm: s.minNm, maxNm: s.maxNm }, { outputKind: c.outputKind, minNm: c.minNm, maxNm: c.maxNm, pumpNm: instrument.pumpNm ?? undefined, name: c.name });
      if (!f.feasible) throw new AppError('out_of_range', `Segment ${i + 1}: ${f.reasons[0]!.message}`, 422, { segment: i, minNm: c.minNm, maxNm: c.maxNm });
      if (Date.parse(s.startsAt) < start || Date.parse(s.endsAt) > end) {
        throw new AppError('segment_outside_session', `Segment ${i + 1} runs outside the session's actual start and end`, 422, { segment: i });
      }
      const prev = sorted[i - 1];
      if (prev && Date.parse(s.startsAt) < Date.parse(prev.endsAt)) throw new AppError('segments_overlap', `Segments overlap in time (${i} and ${i + 1}); each moment of the session belongs to one segment`, 422, { segment: i });
    });
    const referenced = [...(input.attachmentIds ?? []), ...input.segments.map((s) => s.traceAttachmentId).filter((x): x is string => !!x)];
    if (referenced.length) {
      const found = await m.getRepository(Attachment).countBy({ id: In([...new Set(referenced)]), bookingId: b.id });
      if (found !== new Set(referenced).size) throw new AppError('rule_violation', 'Attachments must be uploaded to this booking first', 422);
    }
    return { start, end, pulses: await verifiedPulses(ctx, m, b.id, input.segments) };
  }

  async function save(viewer: SessionUser, bookingId: string, input: UsageLogInput, requestId?: string) {
    return db.transaction(async (m) => {
      const b = await m.getRepository(TimelineBlock).findOne({ where: { id: bookingId, kind: 'booking' }, lock: { mode: 'pessimistic_write' } });
      if (!b) throw notFound('Booking');
      assertMayLog(viewer, b);
      if (!['approved', 'completed'].includes(b.status)) throw new AppError('rule_violation', `A ${b.status} booking has no session to log`, 422);
      if (b.startsAt.getTime() > Date.now()) throw new AppError('rule_violation', 'This session has not started yet', 422);
      const existing = await m.getRepository(UsageLog).findOneBy({ bookingId });
      if (existing?.status === 'billed') throw await logLockedError(m, existing);
      const facility = await m.getRepository(FacilitySettings).findOneByOrFail({ id: 1 });
      const { start, end, pulses } = await validate(m, b, facility, input);
      const outsideGrace = isOutsideGrace(b, facility, start, end);
      const before = existing ? await dtoFor(m, existing) : null;
      const log = await m.getRepository(UsageLog).save({
        ...(existing ?? {}), bookingId, status: 'submitted', actualStartsAt: new Date(start), actualEndsAt: new Date(end), outsideGrace, notes: input.notes ?? '',
        attachmentIds: input.attachmentIds ?? existing?.attachmentIds ?? [], submittedBy: viewer.id, submittedAt: new Date(), confirmedBy: null, confirmedAt: null,
      } as UsageLog);
      await m.getRepository(UsageSegment).delete({ usageLogId: log.id });
      for (const [i, s] of input.segments.entries()) {
        await m.getRepository(UsageSegment).insert({
          usageLogId: log.id, configurationId: s.configurationId, startsAt: new Date(s.startsAt), endsAt: new Date(s.endsAt), minNm: s.minNm, maxNm: s.maxNm,
          averagePowerMw: s.averagePowerMw ?? null, pulseFwhmFs: pulses[i] ?? null, pulseShape: s.pulseShape ?? null, spectralFwhmNm: s.spectralFwhmNm ?? null, traceAttachmentId: s.traceAttachmentId ?? null, notes: s.notes ?? '',
        });
      }
      if (b.status === 'approved') await m.getRepository(TimelineBlock).update({ id: b.id }, { status: 'completed' });
      const after = await dtoFor(m, log);
      await recordAudit(m, { actorUserId: viewer.id, action: existing ? 'usage.updated' : 'usage.submitted', entityType: 'usage_log', entityId: log.id, before: before as unknown as Record<string, unknown>, after: after as unknown as Record<string, unknown>, requestId });
      return after;
    });
  }

  async function confirm(viewer: SessionUser, id: string, input: { actualStartsAt?: string; actualEndsAt?: string; note?: string }, requestId?: string) {
    return db.transaction(async (m) => {
      const log = await m.getRepository(UsageLog).findOne({ where: { id }, lock: { mode: 'pessimistic_write' } });
      if (!log) throw notFound('Session log');
      if (log.status === 'billed') throw await logLockedError(m, log);
      const before = await dtoFor(m, log);
      const start = input.actualStartsAt ? new Date(input.actualStartsAt) : log.actualStartsAt;
      const end = input.actualEndsAt ? new Date(input.actualEndsAt) : log.actualEndsAt;
      if (end <= start) throw new AppError('rule_violation', 'The session must end after it starts', 422);
      const b = await m.getRepository(TimelineBlock).findOneByOrFail({ id: log.bookingId });
      const facility = await m.getRepository(FacilitySettings).findOneByOrFail({ id: 1 });
      assertInsideWindow(b, facility, start.getTime(), end.getTime());
      const outside = await m.getRepository(UsageSegment).count({ where: [{ usageLogId: id, startsAt: LessThanOrEqual(new Date(start.getTime() - 1)) }, { usageLogId: id, endsAt: MoreThan(end) }] });
      if (outside > 0) throw new AppError('segment_outside_session', 'Adjusted times would leave logged segments outside the session; adjust the segments first', 422);
      Object.assign(log, { actualStartsAt: start, actualEndsAt: end, outsideGrace: isOutsideGrace(b, facility, start.getTime(), end.getTime()), status: 'confirmed', confirmedBy: viewer.id, confirmedAt: new Date(), notes: input.note ? `${log.notes}${log.notes ? '\n' : ''}Staff: ${input.note}` : log.notes });
      await m.getRepository(UsageLog).save(log);
      const after = await dtoFor(m, log);
      await recordAudit(m, { actorUserId: viewer.id, action: 'usage.confirmed', entityType: 'usage_log', entityId: id, before: before as unknown as Record<string, unknown>, after: after as unknown as Record<string, unknown>, requestId });
      return after;
    });
  }

  async function sessions(viewer: SessionUser, scope: 'mine' | 'to_confirm') {
    const since = new Date(Date.now() - 60 * 86_400_000);
    const all = viewer.role === 'staff' || viewer.role === 'admin';
    const qb = db.getRepository(TimelineBlock).createQueryBuilder('b')
      .where(`b.kind = 'booking' AND b.status IN ('approved','completed') AND b.starts_at <= now() AND b.starts_at >= :since`, { since })
      .orderBy('b.starts_at', 'DESC').limit(300);
    if (!all) qb.andWhere('b.organisation_id = :org', { org: viewer.organisationId });
    if (scope === 'to_confirm') qb.andWhere(`EXISTS (SELECT 1 FROM usage_logs u WHERE u.booking_id = b.id AND u.status = 'submitted')`);
    const blocks = await qb.getMany();
    const logs = blocks.length ? await db.getRepository(UsageLog).findBy({ bookingId: In(blocks.map((b) => b.id)) }) : [];
    const dtos = await dtosFor(db.manager, logs);
    const byBooking = new Map(logs.map((l, i) => [l.bookingId, dtos[i]!]));
    const look = await loadLookups(db.manager, blocks);
    return blocks.map((b) => ({ booking: toBookingDto(b, viewer, look), log: byBooking.get(b.id) ?? null }));
  }

  /** Two hours after a session ends without a log, its owner is reminded (queued when the booking is approved). */
  async function remind(data: { bookingId: string }) {
    await db.transaction(async (m) => {
      const b = await m.getRepository(TimelineBlock).findOneBy({ id: data.bookingId });
      if (!b || !['approved', 'completed'].includes(b.status) || b.endsAt.getTime() > Date.now()) return;
      if (await m.getRepository(UsageLog).existsBy({ bookingId: b.id })) return;
      const user = await m.getRepository(User).findOneByOrFail({ id: b.userId! });
      const url = `${ctx.env.APP_URL}/sessions`;
      const lines = [`Hello ${user.name},`, `Your beam time that ended at ${b.endsAt.toISOString().slice(0, 16).replace('T', ' ')} UTC has no session log yet.`, 'Please log what you tuned and measured: billing follows the confirmed log.'];
      await ctx.outbox.enqueue(m, user.email, { template: 'usage_reminder', subject: 'Please log your session', text: `${lines.join('\n\n')}\n\n${url}\n`, html: layout('Please log your session', lines, { label: 'Open the session log', url }) });
    });
  }

  return { get, save, confirm, sessions, remind };
}

export async function startUsageJobs(ctx: AppContext): Promise<void> {
  const s = usageService(ctx);
  await ctx.outbox.work<{ bookingId: string }>(USAGE_REMINDER_QUEUE, (d) => s.remind(d));
}
