import { minutesNeededAfterBlock, offerSlots, type TimelineBlockInput } from '@femtoslot/shared';
import type { EntityManager } from 'typeorm';
import type { AppContext } from '../../lib/context';
import { evaluateBooking } from '../bookings/booking-evaluation';
import { TimelineBlock } from '../bookings/timeline-block.entity';
import { occupyingBlocks, stateOf, timelineOf, toEngineBlocks } from '../bookings/timeline.repository';
import { stationIdsOf } from '../stations/stations.service';
import { User } from '../users/user.entity';

const DAY = 86_400_000;
const OFFERS_PER_BOOKING = 3;
/** Candidates run through the full booking check per displaced booking before giving up on more offers. */
const CHECKS_PER_BOOKING = 40;
/** Problems that depend on the slot; the others (account, eyewear…) would refuse any slot alike. */
const slotProblems = new Set(['rule_violation', 'overlap', 'changeover_gap', 'training_required', 'station_busy']);

/**
 * Offers each displaced booking up to three slots of its length and configuration. Every slot passes the same check a
 * new request meets (lead time, horizon, training on that date, overlap, changeover and warm-up), slots inside the
 * facility's working hours come first, and no time is offered twice in one displacement: each kept offer is held on
 * the timeline (with its changeover) while the next person's offers are found, so all of them can be taken at once.
 */
export async function findOffers(ctx: AppContext, m: EntityManager, victims: TimelineBlock[], instrumentId: string): Promise<Map<string, { startsAt: string; endsAt: string }[]>> {
  const offers = new Map<string, { startsAt: string; endsAt: string }[]>();
  if (victims.length === 0) return offers;
  const { timeline, reference: { facility } } = await timelineOf(ctx.reference, m, instrumentId);
  const policies = facility.policies;
  const now = Date.now();
  const horizonEnd = new Date(now + policies.horizonDays * DAY);
  const blocks = toEngineBlocks(await occupyingBlocks(m, new Date(now - DAY), new Date(horizonEnd.getTime() + DAY), instrumentId), timeline.configurations);
  const held: TimelineBlockInput[] = [];
  const stations = await stationIdsOf(m, victims.map((v) => v.id));
  const owners = new Map((await m.getRepository(User).findBy(victims.flatMap((v) => (v.userId ? [{ id: v.userId }] : [])))).map((u) => [u.id, u]));
  for (const v of victims) {
    const state = stateOf(v, timeline.configurations);
    const owner = v.userId ? owners.get(v.userId) : undefined;
    const kept: { startsAt: string; endsAt: string }[] = [];
    offers.set(v.id, kept);
    if (!state || !owner || !v.configurationId || !v.accountId || v.targetMinNm === null || v.targetMaxNm === null) continue;
    const duration = v.endsAt.getTime() - v.startsAt.getTime();
    const from = Math.max(v.startsAt.getTime(), now + policies.externalLeadHours * 3_600_000);
    const target = v.targetMinNm === v.targetMaxNm ? { targetNm: v.targetMinNm } : { minNm: v.targetMinNm, maxNm: v.targetMaxNm };
    const candidates = offerSlots([...blocks, ...held], { start: new Date(from), end: new Date(from + duration), state }, {
      model: timeline.model, horizonEnd, stepMinutes: 120, timeZone: facility.timeZone, workingHours: policies.workingHours,
    });
    let next = candidates.next();
    for (let checks = 0; !next.done && kept.length < OFFERS_PER_BOOKING && checks < CHECKS_PER_BOOKING; checks += 1) {
      const slot = next.value;
      const e = await evaluateBooking(m, ctx.reference, {
        instrumentId, configurationId: v.configurationId, stationIds: stations.get(v.id), startsAt: slot.start, endsAt: slot.end, target, accountId: v.accountId,
        owner: { id: owner.id, role: owner.role, organisationId: owner.organisationId, email: owner.email, name: owner.name },
      }, { lock: false });
      const passes = !e.problems.some((p) => slotProblems.has(p.code));
      if (passes) {
        kept.push({ startsAt: slot.start.toISOString(), endsAt: slot.end.toISOString() });
        held.push({ id: `offer:${v.id}:${kept.length}`, kind: 'booking', start: slot.start, end: slot.end, state });
      }
      next = candidates.next(passes);
    }
  }
  return offers;
}

export interface WarmupConflict {
  bookingId: string;
  neededMinutes: number;
  availableMinutes: number;
}

/**
 * The rule: a window displaces only bookings whose own interval overlaps it. The first booking after the window
 * whose start leaves less than the warm-up (and pulse check) is not displaced but flagged to staff, who decide
 * whether to shorten the window, move the booking or let the user know.
 */
export async function warmupConflictAfter(m: EntityManager, ctx: AppContext, window: { instrumentId: string; endsAt: Date }): Promise<{ block: TimelineBlock; conflict: WarmupConflict } | null> {
  const { timeline } = await timelineOf(ctx.reference, m, window.instrumentId);
  const next = (await occupyingBlocks(m, window.endsAt, new Date(window.endsAt.getTime() + DAY), window.instrumentId))
    .filter((b) => b.startsAt >= window.endsAt)
    .sort((a, b) => a.startsAt.getTime() - b.startsAt.getTime())[0];
  if (!next || next.kind !== 'booking') return null;
  const state = stateOf(next, timeline.configurations);
  if (!state) return null;
  const neededMinutes = minutesNeededAfterBlock({ kind: 'maintenance', state: null }, state, timeline.model);
  const availableMinutes = (next.startsAt.getTime() - window.endsAt.getTime()) / 60_000;
  return availableMinutes < neededMinutes ? { block: next, conflict: { bookingId: next.id, neededMinutes, availableMinutes } } : null;
}
