import { parseEngineInput } from '../units/engine-error';
import { solveExact } from './exact-planner';
import { firstComeEvaluation } from './first-come';
import { solveHeuristic } from './heuristic-planner';
import { currentSequence, settleTowardsCurrent } from './current-day';
import { buildProblem, decodeSequence, fitsAlone, isBetter, type Placement, type PlanProblem } from './plan-problem';
import {
  planDayInputSchema,
  planDayOptionsSchema,
  type DayPlan,
  type PlanDayInput,
  type PlanDayOptions,
  type UnplacedReason,
} from './plan-schemas';

const MS_PER_MINUTE = 60_000;

function unplacedReason(problem: PlanProblem, index: number): { reason: UnplacedReason; message: string } {
  const r = problem.requests[index];
  if (r.latest - r.earliest < r.duration) {
    return { reason: 'window_too_short', message: `The window within the day is shorter than the ${r.duration} min asked` };
  }
  if (!fitsAlone(problem, index)) {
    return { reason: 'no_room', message: 'No gap between fixed blocks holds it with the changeover it needs' };
  }
  return { reason: 'crowded_out', message: 'It fits alone, but placing it would leave more requests out' };
}

function roundMinutes(value: number): number {
  return Math.round(value * 1e6) / 1e6;
}

/**
 * Orders a day's requests around the fixed blocks: as many placed as possible, then the least
 * changeover. Exact up to options.exactLimit requests (default 10), heuristic beyond. When every request
 * has a current start, the day as it stands is kept unless the plan strictly beats it, and the chosen
 * order is placed as near the current starts as it allows.
 */
export function planDay(input: PlanDayInput, options: PlanDayOptions = {}): DayPlan {
  const parsed = parseEngineInput(planDayInputSchema, input);
  const settings = parseEngineInput(planDayOptionsSchema, options);
  const problem = buildProblem(parsed);
  const exact = problem.n <= settings.exactLimit;
  const rounds = settings.searchRounds ?? (problem.n <= 20 ? 40 : 16);
  const solution = exact ? solveExact(problem) : solveHeuristic(problem, settings.seed, rounds);
  const currentStarts = parsed.requests.map((r) => (r.currentStart ? (r.currentStart.getTime() - problem.dayStartMs) / MS_PER_MINUTE : null));
  const asItStands = currentSequence(problem, currentStarts);
  const current = asItStands ? decodeSequence(problem, asItStands) : null;
  const sequence = asItStands && current && !isBetter(decodeSequence(problem, solution.sequence), current) ? asItStands : solution.sequence;

  const placements: Placement[] = [];
  const value = decodeSequence(problem, sequence, placements);
  if (asItStands) settleTowardsCurrent(problem, placements, currentStarts);
  const placedIds = new Set(placements.map((p) => p.index));
  const firstCome = firstComeEvaluation(problem, parsed.model, parsed.initialState ?? null);
  const toDate = (minutes: number) => new Date(problem.dayStartMs + minutes * MS_PER_MINUTE);

  return {
    order: placements.map((p) => ({
      id: problem.requests[p.index].id,
      start: toDate(p.start),
      end: toDate(p.end),
      changeoverBeforeMinutes: p.changeoverBefore,
    })),
    unplaced: problem.requests
      .map((r, i) => ({ r, i }))
      .filter(({ i }) => !placedIds.has(i))
      .map(({ r, i }) => ({ id: r.id, ...unplacedReason(problem, i) })),
    changeoverMinutes: roundMinutes(value.cost),
    savedMinutes: roundMinutes((current ? current.cost : firstCome.cost) - value.cost),
    currentChangeoverMinutes: current ? roundMinutes(current.cost) : null,
    firstCome: { placedCount: firstCome.placed, changeoverMinutes: roundMinutes(firstCome.cost) },
    provenOptimal: exact,
    method: exact ? 'exact' : 'heuristic',
  };
}
