import { z } from 'zod';
import { localDate, zonedToUtc } from '../time/zoned-time';
import { parseEngineInput } from '../units/engine-error';
import { earliestFit, toIntervals, type TimeSlot } from './timeline-check';
import { alternativeSlotsInputSchema, type TimelineBlockInput, type TimelineCandidateInput } from './timeline-schemas';
import type { ChangeoverModelInput } from '../changeover/changeover-model';
import type { InstantInput } from './timeline-schemas';

const MINUTE = 60_000;
const DAY = 86_400_000;
const hhmm = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'Use HH:MM');

/** The facility's staffed hours, in its own zone; weekdays are ISO 8601 numbers (1 = Monday … 7 = Sunday). */
export const workingHoursSchema = z
  .object({ start: hhmm, end: hhmm, weekdays: z.array(z.number().int().min(1).max(7)).min(1) })
  .refine((w) => w.start < w.end, { message: 'Working hours must end after they start', path: ['end'] });
export type WorkingHours = z.infer<typeof workingHoursSchema>;

/** Default when a facility sets none: 08:00–18:00, Monday to Friday (common practice for a staffed laser lab). */
export const defaultWorkingHours: WorkingHours = { start: '08:00', end: '18:00', weekdays: [1, 2, 3, 4, 5] };

export interface OfferSlotsOptions {
  model: ChangeoverModelInput;
  horizonEnd: InstantInput;
  /** Least distance between the starts of two slots offered to one person (never less than the duration). */
  stepMinutes?: number;
  timeZone: string;
  workingHours?: WorkingHours;
}

function isoWeekday(date: string): number {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  return ((new Date(Date.UTC(y, m - 1, d)).getUTCDay() + 6) % 7) + 1;
}

function wallOn(date: string, time: string, timeZone: string): number {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  const [hour, minute] = time.split(':').map(Number) as [number, number];
  return zonedToUtc({ year: y, month: m, day: d, hour, minute }, timeZone).getTime();
}

/**
 * Candidate slots for a displaced booking, best first: slots of its length that fit the timeline (overlap and
 * changeover, warm-up after maintenance included) inside working hours, day by day up to the horizon, then any
 * other time. The caller runs its own checks on each and answers `next(true)` for a slot it keeps, `next(false)`
 * for one it drops; a kept slot pushes the next candidate at least a step (and the slot's length) later, and no
 * candidate overlaps a kept one.
 */
export function* offerSlots(blocks: TimelineBlockInput[], candidate: TimelineCandidateInput, options: OfferSlotsOptions): Generator<TimeSlot, void, boolean | undefined> {
  const input = parseEngineInput(alternativeSlotsInputSchema, { blocks, candidate, model: options.model, count: 1, horizonEnd: options.horizonEnd, stepMinutes: options.stepMinutes ?? 120 });
  const hours = workingHoursSchema.parse(options.workingHours ?? defaultWorkingHours);
  const intervals = toIntervals(input.blocks, input.candidate.id);
  const from = input.candidate.start.getTime();
  const duration = input.candidate.end.getTime() - from;
  const horizon = input.horizonEnd.getTime();
  const step = Math.max(input.stepMinutes * MINUTE, duration);
  const kept: TimeSlot[] = [];
  const clash = (start: number) => kept.some((k) => start < k.end.getTime() && start + duration > k.start.getTime());
  const fit = (at: number) => earliestFit(intervals, input.candidate.state, duration, at, horizon, input.model);

  // Inside working hours, one facility day at a time.
  for (let day = localDate(new Date(from), options.timeZone); wallOn(day, '00:00', options.timeZone) < horizon; ) {
    if (hours.weekdays.includes(isoWeekday(day))) {
      const close = wallOn(day, hours.end, options.timeZone);
      let cursor = Math.max(from, wallOn(day, hours.start, options.timeZone));
      for (let start = fit(cursor); start !== null && start + duration <= close; start = fit(cursor)) {
        if (clash(start)) {
          cursor = start + 15 * MINUTE;
          continue;
        }
        const slot = { start: new Date(start), end: new Date(start + duration) };
        const keep = yield slot;
        if (keep) kept.push(slot);
        cursor = start + (keep ? step : 15 * MINUTE);
      }
    }
    day = localDate(new Date(wallOn(day, '12:00', options.timeZone) + DAY), options.timeZone);
  }

  // Then any time, for lengths or weeks that working hours cannot hold.
  let cursor = from;
  for (let start = fit(cursor); start !== null; start = fit(cursor)) {
    const slot = { start: new Date(start), end: new Date(start + duration) };
    if (clash(start)) {
      cursor = start + 15 * MINUTE;
      continue;
    }
    const keep = yield slot;
    if (keep) kept.push(slot);
    cursor = start + (keep ? step : 15 * MINUTE);
  }
}
