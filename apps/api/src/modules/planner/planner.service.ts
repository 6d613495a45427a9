import { checkTimeline, planDay, zonedToUtc, type DayPlan, type FacilityPolicies } from '@femtoslot/shared';
import { In } from 'typeorm';
import type { SessionUser } from '../../lib/auth/session';
import type { AppContext } from '../../lib/context';
import { AppError } from '../../lib/errors/app-error';
import { recordAudit } from '../audit/audit.service';
import { FacilitySettings } from '../facility/facility-settings.entity';
import { queueBookingMail } from '../bookings/booking-mail';
import { auditSnapshot, toBookingDto } from '../bookings/booking.dto';
import { loadLookups } from '../bookings/lookups';
import { TimelineBlock } from '../bookings/timeline-block.entity';
import { occupyingBlocks, stateOf, timelineOf, toEngineBlocks } from '../bookings/timeline.repository';

export interface AdHocRequest {
  id: string;
  durationMinutes: number;
  configurationId: string;
  nm: number;
  earliestStart?: string;
  latestEnd?: string;
  submittedAt?: string;
}

const planDto = (plan: DayPlan) => ({
  provenOptimal: plan.provenOptimal,
  method: plan.method,
  changeoverMinutes: plan.changeoverMinutes,
  savedMinutes: plan.savedMinutes,
  currentChangeoverMinutes: plan.currentChangeoverMinutes,
  firstComeChangeoverMinutes: plan.firstCome.changeoverMinutes,
  firstComePlacedCount: plan.firstCome.placedCount,
  order: plan.order.map((o) => ({ bookingId: o.id, startsAt: o.start.toISOString(), endsAt: o.end.toISOString(), changeoverBeforeMinutes: o.changeoverBeforeMinutes })),
  unplaced: plan.unplaced.map((u) => ({ bookingId: u.id, reason: u.reason, message: u.message })),
});

export function plannerService(ctx: AppContext) {
  async function dayBounds(date: string) {
    const facility = await ctx.db.getRepository(FacilitySettings).findOneByOrFail({ id: 1 });
    const [y, mo, d] = date.split('-').map(Number) as [number, number, number];
    const next = new Date(Date.UTC(y, mo - 1, d + 1));
    return {
      dayStart: zonedToUtc({ year: y, month: mo, day: d, hour: 0, minute: 0 }, facility.timeZone),
      dayEnd: zonedToUtc({ year: next.getUTCFullYear(), month: next.getUTCMonth() + 1, day: next.getUTCDate(), hour: 0, minute: 0 }, facility.timeZone),
    };
  }

  /** Plans hypothetical requests around the day's fixed blocks (maintenance and existing bookings). */
  async function planAdHoc(input: { instrumentId: string; date: string; requests: AdHocRequest[] }) {
    const { dayStart, dayEnd } = await dayBounds(input.date);
    const { timeline: t } = await timelineOf(ctx.reference, ctx.db.manager, input.instrumentId);
    const fixed = toEngineBlocks(await occupyingBlocks(ctx.db.manager, dayStart, dayEnd, input.instrumentId), t.configurations);
    const requests = input.requests.map((r) => {
      const c = t.configurations.get(r.configurationId);
      if (!c) throw new AppError('out_of_range', `Configuration ${r.configurationId} does not belong to this instrument`, 422);
      return { id: r.id, durationMinutes: r.durationMinutes, state: { configurationKey: c.key, nm: r.nm }, earliestStart: r.earliestStart, latestEnd: r.latestEnd, submittedAt: r.submittedAt ?? dayStart.toISOString() };
    });
    return planDto(planDay({ dayStart, dayEnd, fixedBlocks: fixed, requests, model: t.model }));
  }

  /** The day's own bookings as flexible requests (each may shift by flexMinutes), maintenance fixed. */
  async function propose(input: { instrumentId: string; date: string; flexMinutes: number }) {
    const { dayStart, dayEnd } = await dayBounds(input.date);
    const { timeline: t } = await timelineOf(ctx.reference, ctx.db.manager, input.instrumentId);
    const blocks = await occupyingBlocks(ctx.db.manager, dayStart, dayEnd, input.instrumentId);
    const now = Date.now();
    const movable = blocks.filter((b) => b.kind === 'booking' && (b.status === 'approved' || b.status === 'requested') && b.startsAt.getTime() > now && b.startsAt >= dayStart && b.endsAt <= dayEnd);
    const fixed = blocks.filter((b) => !movable.includes(b));
    const flex = input.flexMinutes * 60_000;
    const requests = movable.map((b) => ({
      id: b.id, durationMinutes: (b.endsAt.getTime() - b.startsAt.getTime()) / 60_000, state: stateOf(b, t.configurations)!,
      earliestStart: new Date(Math.max(b.startsAt.getTime() - flex, dayStart.getTime(), now)), latestEnd: new Date(Math.min(b.endsAt.getTime() + flex, dayEnd.getTime())),
      currentStart: b.startsAt,
      submittedAt: b.createdAt,
    }));
    const plan = planDay({ dayStart, dayEnd, fixedBlocks: toEngineBlocks(fixed, t.configurations), requests, model: t.model });
    return { ...planDto(plan), current: movable.map((b) => ({ bookingId: b.id, startsAt: b.startsAt.toISOString(), endsAt: b.endsAt.toISOString() })) };
  }

  /**
   * A plan may only move a booking within the day it plans (facility zone), not into the past and not beyond the
   * booking horizon: the same limits a new request meets, so a plan cannot put a booking where nobody could book it.
   */
  function refuseMove(b: TimelineBlock, startsAt: Date, endsAt: Date, day: { dayStart: Date; dayEnd: Date }, date: string, policies: FacilityPolicies, now: number) {
    const refuse = (rule: string, message: string) => new AppError('rule_violation', message, 422, { rule, bookingId: b.id });
    if (startsAt.getTime() < now) return refuse('past', 'A plan cannot move a booking to a start in the past');
    if (startsAt.getTime() > now + policies.horizonDays * 86_400_000) return refuse('horizon', `A plan cannot move a booking more than ${policies.horizonDays} days ahead (the booking horizon)`);
    const startsWithin = (d: Date) => d >= day.dayStart && d < day.dayEnd;
    if (!startsWithin(startsAt) || endsAt > day.dayEnd || !startsWithin(b.startsAt)) return refuse('date', `A plan for ${date} can only move bookings of that day within that day (facility time zone)`);
    return null;
  }

  /** Moves the bookings as planned in one transaction; the overlap constraint is checked at commit, the changeover here. */
  async function apply(actor: SessionUser, input: { instrumentId: string; date: string; order: { bookingId: string; startsAt: string; endsAt: string }[] }, requestId?: string) {
    return ctx.db.transaction(async (m) => {
      const { timeline: t, reference } = await timelineOf(ctx.reference, m, input.instrumentId, { lock: true });
      const day = await dayBounds(input.date);
      const now = Date.now();
      await m.query('SET CONSTRAINTS timeline_blocks_no_overlap DEFERRED');
      const rows = await m.getRepository(TimelineBlock).find({ where: { id: In(input.order.map((o) => o.bookingId)), instrumentId: input.instrumentId, kind: 'booking' } });
      if (rows.length !== input.order.length) throw new AppError('not_found', 'Some bookings in the plan do not exist on this instrument', 404);
      const moved: TimelineBlock[] = [];
      for (const o of input.order) {
        const b = rows.find((r) => r.id === o.bookingId)!;
        if (b.status !== 'approved' && b.status !== 'requested') throw new AppError('invalid_state', `Booking ${b.id} is ${b.status} and cannot be moved`, 409);
        const startsAt = new Date(o.startsAt);
        const endsAt = new Date(o.endsAt);
        if (endsAt.getTime() - startsAt.getTime() !== b.endsAt.getTime() - b.startsAt.getTime()) throw new AppError('rule_violation', 'A plan may move bookings but not change their length', 422);
        if (startsAt.getTime() === b.startsAt.getTime()) continue;
        const refused = refuseMove(b, startsAt, endsAt, day, input.date, reference.facility.policies, now);
        if (refused) throw refused;
        const before = auditSnapshot(b);
        Object.assign(b, { startsAt, endsAt, sequence: b.sequence + 1 });
        await m.getRepository(TimelineBlock).save(b);
        await recordAudit(m, { actorUserId: actor.id, action: 'booking.moved', entityType: 'booking', entityId: b.id, before, after: { ...auditSnapshot(b), note: 'day plan' }, requestId });
        moved.push(b);
      }
      const all = toEngineBlocks(await occupyingBlocks(m, new Date(day.dayStart.getTime() - 86_400_000), new Date(day.dayEnd.getTime() + 86_400_000), input.instrumentId), t.configurations);
      for (const b of rows) {
        const c = checkTimeline(all, { id: b.id, start: b.startsAt, end: b.endsAt, state: stateOf(b, t.configurations)! }, { model: t.model });
        if (!c.ok) throw new AppError(c.overlaps.length ? 'overlap' : 'changeover_gap', 'The plan no longer fits the timeline (it changed since the proposal); run the planner again', 409, { bookingId: b.id, before: c.before, after: c.after });
      }
      await m.query('SET CONSTRAINTS timeline_blocks_no_overlap IMMEDIATE');
      for (const b of moved) await queueBookingMail(ctx, m, 'moved', b);
      const look = await loadLookups(m, rows);
      return rows.map((b) => toBookingDto(b, actor, look));
    });
  }

  return { planAdHoc, propose, apply };
}
