import { changeoverFor, type ChangeoverModel, type SourceState } from '../changeover/changeover-model';
import type { TimelineBlock } from '../timeline/timeline-schemas';
import type { ParsedPlanDayInput } from './plan-schemas';

const MS_PER_MINUTE = 60_000;

export interface ProblemRequest {
  id: string;
  state: SourceState;
  duration: number;
  /** Window in minutes from dayStart, already clipped to the day. */
  earliest: number;
  latest: number;
  submittedAt: number;
}

/** A stretch between two fixed boundaries (day start, fixed blocks, day end). */
export interface Gap {
  leftTime: number;
  rightTime: number;
}

/**
 * The day as numbers: minutes from dayStart and flat changeover matrices, so that the
 * exact DP and the local search never touch Dates or the model in their inner loops.
 */
export interface PlanProblem {
  n: number;
  requests: ProblemRequest[];
  gaps: Gap[];
  fixed: TimelineBlock[];
  /** cReq[i*n+j]: request i → request j. */
  cReq: Float64Array;
  /** cLeft[g*n+j]: left boundary of gap g → request j. */
  cLeft: Float64Array;
  /** cRight[i*G+g]: request i → right boundary of gap g. */
  cRight: Float64Array;
  /** Changeover of gap g when nothing is placed in it (fixed → fixed). */
  emptyGapCost: Float64Array;
  /** Σ emptyGapCost[k] for k ≥ g. */
  emptySuffix: Float64Array;
  dayStartMs: number;
}

interface Boundary {
  time: number;
  kind: 'edge' | 'booking' | 'maintenance';
  state: SourceState | null;
}

function costInto(left: Boundary, to: SourceState, model: ChangeoverModel): number {
  if (left.kind === 'maintenance') return changeoverFor(null, to, model, true).totalMinutes;
  return changeoverFor(left.state, to, model, false).totalMinutes;
}

function costOutOf(from: SourceState, right: Boundary, model: ChangeoverModel): number {
  if (right.kind !== 'booking' || !right.state) return 0;
  return changeoverFor(from, right.state, model, false).totalMinutes;
}

export function buildProblem(input: ParsedPlanDayInput): PlanProblem {
  const dayStartMs = input.dayStart.getTime();
  const dayEndMs = input.dayEnd.getTime();
  const toMin = (ms: number) => (ms - dayStartMs) / MS_PER_MINUTE;
  const dayEnd = toMin(dayEndMs);
  const model = input.model;

  const fixed = input.fixedBlocks
    .filter((b) => b.end.getTime() >= dayStartMs && b.start.getTime() <= dayEndMs)
    .sort((a, b) => a.start.getTime() - b.start.getTime());
  const lefts: Boundary[] = [];
  const rights: Boundary[] = [];
  let left: Boundary = { time: 0, kind: 'edge', state: input.initialState ?? null };
  for (const block of fixed) {
    const asBoundary = (time: number): Boundary => ({ time, kind: block.kind, state: block.state ?? null });
    const start = toMin(block.start.getTime());
    const end = toMin(block.end.getTime());
    if (start >= left.time && end > 0) {
      lefts.push(left);
      rights.push(asBoundary(Math.min(start, dayEnd)));
    }
    if (end >= left.time) left = asBoundary(end);
  }
  lefts.push(left);
  rights.push({ time: dayEnd, kind: 'edge', state: null });

  const requests: ProblemRequest[] = input.requests.map((r) => ({
    id: r.id,
    state: r.state,
    duration: r.durationMinutes,
    earliest: Math.max(0, r.earliestStart ? toMin(r.earliestStart.getTime()) : 0),
    latest: Math.min(dayEnd, r.latestEnd ? toMin(r.latestEnd.getTime()) : dayEnd),
    submittedAt: r.submittedAt.getTime(),
  }));
  const n = requests.length;
  const G = lefts.length;
  const cReq = new Float64Array(n * n);
  const cLeft = new Float64Array(G * n);
  const cRight = new Float64Array(n * G);
  const emptyGapCost = new Float64Array(G);
  for (let i = 0; i < n; i += 1) {
    for (let j = 0; j < n; j += 1) {
      cReq[i * n + j] = i === j ? 0 : changeoverFor(requests[i].state, requests[j].state, model, false).totalMinutes;
    }
  }
  for (let g = 0; g < G; g += 1) {
    for (let j = 0; j < n; j += 1) {
      cLeft[g * n + j] = costInto(lefts[g], requests[j].state, model);
      cRight[j * G + g] = costOutOf(requests[j].state, rights[g], model);
    }
    const rightState = rights[g].kind === 'booking' ? rights[g].state : null;
    emptyGapCost[g] = rightState ? costInto(lefts[g], rightState, model) : 0;
  }
  const emptySuffix = new Float64Array(G + 1);
  for (let g = G - 1; g >= 0; g -= 1) emptySuffix[g] = emptySuffix[g + 1] + emptyGapCost[g];

  const gaps = lefts.map((l, g) => ({ leftTime: l.time, rightTime: rights[g].time }));
  return { n, requests, gaps, fixed, cReq, cLeft, cRight, emptyGapCost, emptySuffix, dayStartMs };
}

export interface Placement {
  index: number;
  gap: number;
  start: number;
  end: number;
  changeoverBefore: number;
}

export interface Evaluation {
  placed: number;
  cost: number;
}

// Scratch buffers reused across calls: the local search decodes thousands of sequences per plan.
let scratchStack = new Int32Array(64);
let scratchStarts = new Float64Array(64);
let scratchEnds = new Float64Array(64);

function ensureScratch(size: number): void {
  if (scratchStack.length >= size) return;
  scratchStack = new Int32Array(size);
  scratchStarts = new Float64Array(size);
  scratchEnds = new Float64Array(size);
}

/**
 * Decodes a sequence of request indices, where a value ≥ n closes the current gap and opens the
 * next. Each request goes at its earliest start after its predecessor; one that does not fit is
 * skipped, and trailing requests that leave no room for the changeover into the gap's right
 * boundary are dropped. Earliest start is optimal for a fixed order within a gap: an earlier end
 * never delays the next start, and costs depend only on who follows whom.
 */
export function decodeSequence(problem: PlanProblem, sequence: ArrayLike<number>, out?: Placement[]): Evaluation {
  const { n, requests, gaps, cReq, cLeft, cRight, emptyGapCost } = problem;
  const G = gaps.length;
  ensureScratch(n + 1);
  const stack = scratchStack;
  const starts = scratchStarts;
  const ends = scratchEnds;
  let gap = 0;
  let placed = 0;
  let cost = 0;
  let top = 0;
  const length = sequence.length;
  for (let k = 0; k <= length; k += 1) {
    const j = k < length ? sequence[k] : n;
    if (j < n) {
      const r = requests[j];
      const readyAt = top === 0 ? gaps[gap].leftTime + cLeft[gap * n + j] : ends[top - 1] + cReq[stack[top - 1] * n + j];
      const start = readyAt > r.earliest ? readyAt : r.earliest;
      const end = start + r.duration;
      if (end > r.latest || end > gaps[gap].rightTime) continue;
      stack[top] = j;
      starts[top] = start;
      ends[top] = end;
      top += 1;
      continue;
    }
    if (k < length && gap >= G - 1) continue;
    const rightTime = gaps[gap].rightTime;
    while (top > 0 && ends[top - 1] + cRight[stack[top - 1] * G + gap] > rightTime) top -= 1;
    if (top === 0) cost += emptyGapCost[gap];
    else {
      let previous = -1;
      for (let t = 0; t < top; t += 1) {
        const i = stack[t];
        const before = previous < 0 ? cLeft[gap * n + i] : cReq[previous * n + i];
        cost += before;
        if (out) out.push({ index: i, gap, start: starts[t], end: ends[t], changeoverBefore: before });
        previous = i;
      }
      cost += cRight[previous * G + gap];
      placed += top;
      top = 0;
    }
    if (k < length) gap += 1;
  }
  for (let g = gap + 1; g < G; g += 1) cost += emptyGapCost[g];
  return { placed, cost };
}

export function isBetter(a: Evaluation, b: Evaluation): boolean {
  return a.placed > b.placed || (a.placed === b.placed && a.cost < b.cost - 1e-9);
}

/** Whether a request fits the day on its own, with every fixed block and changeover respected. */
export function fitsAlone(problem: PlanProblem, index: number): boolean {
  for (let g = 0; g < problem.gaps.length; g += 1) {
    const sequence: number[] = [];
    for (let k = 0; k < g; k += 1) sequence.push(problem.n + k);
    sequence.push(index);
    if (decodeSequence(problem, sequence).placed === 1) return true;
  }
  return false;
}
