import type { ChangeoverModel, SourceState } from '../changeover/changeover-model';
import { earliestFit } from '../timeline/timeline-check';
import { decodeSequence, type Evaluation, type PlanProblem } from './plan-problem';

interface Interval {
  id: string;
  kind: 'booking' | 'maintenance';
  start: number;
  end: number;
  state: SourceState | null;
}

/**
 * The plan a shared calendar would give: in order of submission each request takes the earliest
 * slot that still fits its window, with changeover on both sides. Costed like any other plan.
 */
export function firstComeEvaluation(problem: PlanProblem, model: ChangeoverModel, initialState: SourceState | null): Evaluation {
  const minute = 60_000;
  const base = problem.dayStartMs;
  const intervals: Interval[] = problem.fixed.map((b) => ({
    id: b.id,
    kind: b.kind,
    start: b.start.getTime(),
    end: b.end.getTime(),
    state: b.state ?? null,
  }));
  if (initialState) intervals.push({ id: '\u0000initial', kind: 'booking', start: base, end: base, state: initialState });
  const order = problem.requests.map((r, i) => ({ r, i })).sort((a, b) => a.r.submittedAt - b.r.submittedAt || a.i - b.i);
  const placed: Array<{ index: number; start: number }> = [];
  for (const { r, i } of order) {
    intervals.sort((a, b) => a.start - b.start || a.end - b.end);
    const start = earliestFit(intervals, r.state, r.duration * minute, base + r.earliest * minute, base + r.latest * minute, model);
    if (start === null) continue;
    intervals.push({ id: r.id, kind: 'booking', start, end: start + r.duration * minute, state: r.state });
    placed.push({ index: i, start: (start - base) / minute });
  }
  placed.sort((a, b) => a.start - b.start);
  const sequence: number[] = [];
  let gap = 0;
  for (const p of placed) {
    while (gap < problem.gaps.length - 1 && p.start >= problem.gaps[gap].rightTime) sequence.push(problem.n + gap++);
    sequence.push(p.index);
  }
  return decodeSequence(problem, sequence);
}
