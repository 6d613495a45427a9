import { checkTimeline, parseChangeoverModel, type AffectedBookingDto } from '@femtoslot/shared';
import type { EntityManager } from 'typeorm';
import { checkOptics } from '../bookings/optics-check';
import type { TimelineBlock } from '../bookings/timeline-block.entity';
import { occupyingBlocks, stateOf, toEngineBlocks } from '../bookings/timeline.repository';
import type { EyewearItem } from '../safety/eyewear-item.entity';
import type { ChangeoverPair } from './changeover-pair.entity';
import type { Configuration } from './configuration.entity';
import type { Instrument } from './instrument.entity';
import { modelOf } from './reference-data';

/** An instrument's rows as they are, or as a change would leave them. */
export interface InstrumentState {
  instrument: Instrument;
  configurations: Configuration[];
  pairs: ChangeoverPair[];
}

type Problem = AffectedBookingDto['problems'][number];
const DAY = 86_400_000;

/**
 * What the booking rules say of one future booking under a state: the same checks a request passes (tuning range
 * and OPA ranges, eyewear at the required ODs, overlap and changeover gaps against its neighbours).
 */
function problemsUnder(state: InstrumentState, blocks: TimelineBlock[], booking: TimelineBlock, eyewear: EyewearItem[]): Problem[] {
  const configurations = new Map(state.configurations.map((c) => [c.id, c]));
  const problems: Problem[] = [];
  if (!state.instrument.active) problems.push({ code: 'instrument_inactive', message: `${state.instrument.name} would be inactive` });
  const c = booking.configurationId ? configurations.get(booking.configurationId) : undefined;
  if (!c || booking.targetMinNm === null || booking.targetMaxNm === null) return problems;
  if (!c.active) problems.push({ code: 'configuration_inactive', message: `${c.name} would be inactive` });
  const target = booking.targetMinNm === booking.targetMaxNm ? { targetNm: booking.targetMinNm } : { minNm: booking.targetMinNm, maxNm: booking.targetMaxNm };
  const { feasibility, coverage } = checkOptics(c, state.instrument, state.configurations, target, eyewear);
  for (const r of feasibility.reasons) problems.push({ code: 'out_of_range', message: r.message });
  if (coverage && coverage.covering.length === 0) {
    problems.push({ code: 'no_eyewear', message: 'No eyewear on the list would be rated at the required OD for every wavelength on the table' });
  }
  const model = parseChangeoverModel(modelOf(state.instrument, state.configurations, state.pairs));
  const own = stateOf(booking, configurations)!;
  const check = checkTimeline(toEngineBlocks(blocks, configurations), { id: booking.id, start: booking.startsAt, end: booking.endsAt, state: own }, { model });
  if (check.overlaps.length) problems.push({ code: 'overlap', message: 'It would overlap another block' });
  // A short gap is listed once, on the booking that comes after it (the one the changeover leads into).
  if (check.before && check.before.shortfallMinutes > 0) {
    problems.push({ code: 'changeover_gap', message: `The changeover into it would need ${check.before.neededMinutes} min; ${Math.round(check.before.availableMinutes)} min are free` });
  }
  return problems;
}

/** Future bookings (from now to the booking horizon) that break a rule under `proposed`, marked new when `current` did not. */
export async function affectedBookings(m: EntityManager, current: InstrumentState, proposed: InstrumentState, eyewear: EyewearItem[], horizonDays: number): Promise<AffectedBookingDto[]> {
  const now = Date.now();
  const blocks = await occupyingBlocks(m, new Date(now - DAY), new Date(now + (horizonDays + 2) * DAY), current.instrument.id);
  const names = new Map(proposed.configurations.map((c) => [c.id, c.name]));
  const affected: AffectedBookingDto[] = [];
  for (const b of blocks) {
    if (b.kind !== 'booking' || b.startsAt.getTime() < now || (b.status !== 'requested' && b.status !== 'approved')) continue;
    const after = problemsUnder(proposed, blocks, b, eyewear);
    if (after.length === 0) continue;
    const before = new Set(problemsUnder(current, blocks, b, eyewear).map((p) => p.message));
    affected.push({
      bookingId: b.id, startsAt: b.startsAt.toISOString(), endsAt: b.endsAt.toISOString(), status: b.status,
      configurationName: names.get(b.configurationId ?? '') ?? '', targetMinNm: b.targetMinNm ?? 0, targetMaxNm: b.targetMaxNm ?? 0,
      problems: after, newlyAffected: after.some((p) => !before.has(p.message)),
    });
  }
  return affected;
}
