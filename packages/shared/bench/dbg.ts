import { defaultChangeoverModel } from '../src/changeover/default-changeover-model';
import { demoConfigurations } from '../src/optics/demo-configurations';
import { planDay } from '../src/planner/plan-day';
import type { PlanDayInput, PlanRequestInput } from '../src/planner/plan-schemas';
import { seededRandom } from '../src/planner/seeded-random';
const MINUTE = 60000;
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
const input = instance(40, 1040);
for (const rounds of [0, 4, 12, 40, 150]) {
  const t0 = performance.now();
  const plan = planDay(input, { searchRounds: rounds });
  console.log(rounds, (performance.now() - t0).toFixed(0), plan.order.length, plan.changeoverMinutes, plan.firstCome);
}
