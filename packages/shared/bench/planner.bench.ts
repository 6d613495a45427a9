/**
 * Day-planner benchmark (a script, not a timed test): median time, changeover minutes, whether the
 * plan is proven optimal, and the gap to the best of many randomised heuristic restarts.
 * Instances are invented, generated from a fixed seed.
 */
import { defaultChangeoverModel } from '../src/changeover/default-changeover-model';
import { demoConfigurations } from '../src/optics/demo-configurations';
import { planDay } from '../src/planner/plan-day';
import type { DayPlan, PlanDayInput, PlanRequestInput } from '../src/planner/plan-schemas';
import { seededRandom } from '../src/planner/seeded-random';

const SIZES = [6, 8, 10, 12, 20, 40];
const TIMING_RUNS = 7;
const RESTARTS = Number(process.env.PLANNER_BENCH_RESTARTS ?? 200);
const MINUTE = 60_000;

function instance(n: number, seed: number): PlanDayInput {
  const random = seededRandom(seed);
  const dayStart = Date.UTC(2030, 2, 4, 6, 0);
  const spanMinutes = Math.max(16 * 60, n * 140);
  const pick = <T>(list: readonly T[]): T => list[Math.floor(random() * list.length)];
  const stateOf = () => {
    const c = pick(demoConfigurations);
    const nm = c.minNm + Math.round((random() * (c.maxNm - c.minNm)) / 10) * 10;
    return { configurationKey: c.key, nm };
  };
  const iso = (minutes: number) => new Date(dayStart + minutes * MINUTE).toISOString();
  const maintenanceAt = Math.round(spanMinutes / 3 / 30) * 30;
  const approvedAt = Math.round((2 * spanMinutes) / 3 / 30) * 30;
  const requests: PlanRequestInput[] = Array.from({ length: n }, (_, i) => {
    const durationMinutes = pick([60, 90, 120, 180]);
    const windowed = random() < 0.4;
    const earliest = windowed ? Math.round((random() * (spanMinutes - durationMinutes)) / 30) * 30 : 0;
    const latest = windowed ? Math.min(spanMinutes, earliest + durationMinutes * (2 + Math.floor(random() * 3))) : spanMinutes;
    return {
      id: `request-${i + 1}`,
      durationMinutes,
      state: stateOf(),
      earliestStart: iso(earliest),
      latestEnd: iso(latest),
      submittedAt: new Date(dayStart - (1 + random() * 10_000) * MINUTE).toISOString(),
    };
  });
  return {
    dayStart: iso(0),
    dayEnd: iso(spanMinutes),
    fixedBlocks: [
      { id: 'maintenance', kind: 'maintenance', start: iso(maintenanceAt), end: iso(maintenanceAt + 60) },
      { id: 'approved', kind: 'booking', start: iso(approvedAt), end: iso(approvedAt + 90), state: stateOf() },
    ],
    requests,
    model: defaultChangeoverModel,
    initialState: { configurationKey: 'fundamental', nm: 800 },
  };
}

function better(a: DayPlan, b: DayPlan): boolean {
  return a.order.length > b.order.length || (a.order.length === b.order.length && a.changeoverMinutes < b.changeoverMinutes);
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

const rows: string[] = [];
for (const n of SIZES) {
  const input = instance(n, 1000 + n);
  planDay(input); // warm-up: JIT and first-call costs are not what a request pays later
  const times: number[] = [];
  let plan: DayPlan | null = null;
  for (let run = 0; run < TIMING_RUNS; run += 1) {
    const t0 = performance.now();
    plan = planDay(input);
    times.push(performance.now() - t0);
  }
  if (!plan) throw new Error('no plan');
  let best: DayPlan | null = null;
  const restartStart = performance.now();
  for (let seed = 2; seed < 2 + RESTARTS; seed += 1) {
    const candidate = planDay(input, { seed, exactLimit: 0 });
    if (!best || better(candidate, best)) best = candidate;
  }
  const restartMs = performance.now() - restartStart;
  if (!best) throw new Error('no restart');
  const sameCount = best.order.length === plan.order.length;
  const gap = best.changeoverMinutes > 0 ? ((plan.changeoverMinutes - best.changeoverMinutes) / best.changeoverMinutes) * 100 : 0;
  rows.push(
    [
      String(n).padStart(3),
      median(times).toFixed(1).padStart(9),
      `${plan.order.length}/${n}`.padStart(7),
      String(plan.changeoverMinutes).padStart(10),
      (plan.provenOptimal ? 'yes' : 'no').padStart(7),
      `${best.order.length}/${n}`.padStart(7),
      String(best.changeoverMinutes).padStart(10),
      (sameCount ? `${gap.toFixed(2)} %` : 'count differs').padStart(14),
      (restartMs / 1000).toFixed(1).padStart(8),
    ].join(' '),
  );
  console.log(rows[rows.length - 1]);
}
console.log('');
console.log(`  n median ms  placed changeover  proven  best-of-${RESTARTS} placed / changeover   gap vs best   restarts s`);
for (const row of rows) console.log(row);
