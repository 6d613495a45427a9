import { changeoverFor, type ChangeoverModel, type ChangeoverModelInput, type SourceState } from '../changeover/changeover-model';
import { EngineError, parseEngineInput } from '../units/engine-error';
import {
  alternativeSlotsInputSchema,
  timelineCheckInputSchema,
  type InstantInput,
  type TimelineBlock,
  type TimelineBlockInput,
  type TimelineCandidateInput,
} from './timeline-schemas';

const MS_PER_MINUTE = 60_000;

export interface NeighbourCheck {
  neighbourId: string;
  neededMinutes: number;
  availableMinutes: number;
  shortfallMinutes: number;
}

export interface TimelineCheck {
  overlaps: string[];
  before: NeighbourCheck | null;
  after: NeighbourCheck | null;
  ok: boolean;
  /** Earliest start ≥ the requested one where the same duration fits; null if none before the horizon. */
  earliestStart: Date | null;
}

export interface TimeSlot {
  start: Date;
  end: Date;
}

export interface Interval {
  id: string;
  kind: TimelineBlock['kind'];
  start: number;
  end: number;
  state: SourceState | null;
}

/** Changeover into the candidate; after maintenance the state is unknown and the warm-up applies. */
export function minutesNeededAfterBlock(block: Pick<Interval, 'kind' | 'state'>, next: SourceState, model: ChangeoverModel): number {
  if (block.kind === 'maintenance') return changeoverFor(null, next, model, true).totalMinutes;
  return changeoverFor(block.state, next, model, false).totalMinutes;
}

/** Changeover out of the candidate; maintenance and state-less bookings ask for none. */
export function minutesNeededBeforeBlock(previous: SourceState, block: Pick<Interval, 'kind' | 'state'>, model: ChangeoverModel): number {
  if (block.kind === 'maintenance' || !block.state) return 0;
  return changeoverFor(previous, block.state, model, false).totalMinutes;
}

export function toIntervals(blocks: TimelineBlock[], excludeId: string | undefined): Interval[] {
  return blocks
    .filter((b) => b.id !== excludeId)
    .map((b) => {
      if (!(b.end.getTime() > b.start.getTime())) {
        throw new EngineError('invalid_interval', `Block ${b.id} must end after it starts`, { id: b.id });
      }
      return { id: b.id, kind: b.kind, start: b.start.getTime(), end: b.end.getTime(), state: b.state ?? null };
    })
    .sort((a, b) => a.start - b.start || a.end - b.end);
}

function neighbourCheck(id: string, neededMinutes: number, gapMs: number): NeighbourCheck {
  const availableMinutes = gapMs / MS_PER_MINUTE;
  return { neighbourId: id, neededMinutes, availableMinutes, shortfallMinutes: Math.max(0, neededMinutes - availableMinutes) };
}

/**
 * Earliest start ≥ fromMs in the sorted intervals. Each gap has a fixed left neighbour (the block
 * ending last so far) and right neighbour, so the first gap that fits gives the answer exactly.
 */
export function earliestFit(
  intervals: Interval[],
  state: SourceState,
  durationMs: number,
  fromMs: number,
  horizonMs: number,
  model: ChangeoverModel,
): number | null {
  let left: Interval | null = null;
  for (let i = 0; i <= intervals.length; i += 1) {
    const right = intervals[i] ?? null;
    const neededBefore = left ? minutesNeededAfterBlock(left, state, model) * MS_PER_MINUTE : 0;
    const start = Math.max(fromMs, left ? left.end + neededBefore : fromMs);
    const end = start + durationMs;
    if (end > horizonMs) return null;
    const neededAfter = right ? minutesNeededBeforeBlock(state, right, model) * MS_PER_MINUTE : 0;
    if (!right || end + neededAfter <= right.start) return start;
    if (!left || right.end > left.end) left = right;
  }
  return null;
}

function checkParsed(
  intervals: Interval[],
  candidate: { start: number; end: number; state: SourceState },
  horizonMs: number,
  model: ChangeoverModel,
): TimelineCheck {
  const overlaps = intervals.filter((b) => b.start < candidate.end && b.end > candidate.start).map((b) => b.id);
  let previous: Interval | null = null;
  let next: Interval | null = null;
  for (const b of intervals) {
    if (b.end <= candidate.start && (!previous || b.end > previous.end)) previous = b;
    if (b.start >= candidate.end && (!next || b.start < next.start)) next = b;
  }
  const before = previous
    ? neighbourCheck(previous.id, minutesNeededAfterBlock(previous, candidate.state, model), candidate.start - previous.end)
    : null;
  const after = next
    ? neighbourCheck(next.id, minutesNeededBeforeBlock(candidate.state, next, model), next.start - candidate.end)
    : null;
  const ok = overlaps.length === 0 && (before?.shortfallMinutes ?? 0) === 0 && (after?.shortfallMinutes ?? 0) === 0;
  const earliest = earliestFit(intervals, candidate.state, candidate.end - candidate.start, candidate.start, horizonMs, model);
  return { overlaps, before, after, ok, earliestStart: earliest === null ? null : new Date(earliest) };
}

function parseCandidate(candidate: { start: Date; end: Date }): { start: number; end: number } {
  const start = candidate.start.getTime();
  const end = candidate.end.getTime();
  if (!(end > start)) throw new EngineError('invalid_interval', 'The booking must end after it starts', {});
  return { start, end };
}

/** Overlaps and changeover against both neighbours for a candidate booking on one instrument. */
export function checkTimeline(
  blocks: TimelineBlockInput[],
  candidate: TimelineCandidateInput,
  options: { model: ChangeoverModelInput; horizonEnd?: InstantInput },
): TimelineCheck {
  const input = parseEngineInput(timelineCheckInputSchema, { blocks, candidate, ...options });
  const times = parseCandidate(input.candidate);
  const horizonMs = input.horizonEnd ? input.horizonEnd.getTime() : Number.MAX_SAFE_INTEGER;
  const intervals = toIntervals(input.blocks, input.candidate.id);
  return checkParsed(intervals, { ...times, state: input.candidate.state }, horizonMs, input.model);
}

/** Up to `count` slots of the candidate's duration, each the earliest fit at least stepMinutes after the last. */
export function findAlternativeSlots(
  blocks: TimelineBlockInput[],
  candidate: TimelineCandidateInput,
  options: { model: ChangeoverModelInput; count: number; horizonEnd: InstantInput; stepMinutes?: number },
): TimeSlot[] {
  const input = parseEngineInput(alternativeSlotsInputSchema, { blocks, candidate, ...options });
  const times = parseCandidate(input.candidate);
  const intervals = toIntervals(input.blocks, input.candidate.id);
  const durationMs = times.end - times.start;
  const slots: TimeSlot[] = [];
  let from = times.start;
  while (slots.length < input.count) {
    const start = earliestFit(intervals, input.candidate.state, durationMs, from, input.horizonEnd.getTime(), input.model);
    if (start === null) break;
    slots.push({ start: new Date(start), end: new Date(start + durationMs) });
    from = start + input.stepMinutes * MS_PER_MINUTE;
  }
  return slots;
}
