import type { Placement, PlanProblem } from './plan-problem';

/**
 * The day as it stands as a decoder sequence: requests in order of their current start, each in the gap between
 * fixed blocks that holds it (a value ≥ n opens the next gap). Null unless every request has a current start.
 */
export function currentSequence(problem: PlanProblem, currentStarts: Array<number | null>): number[] | null {
  if (currentStarts.some((s) => s === null)) return null;
  const order = currentStarts.map((s, i) => ({ i, s: s as number })).sort((a, b) => a.s - b.s || a.i - b.i);
  const sequence: number[] = [];
  let gap = 0;
  for (const { i, s } of order) {
    while (gap < problem.gaps.length - 1 && s >= problem.gaps[gap].rightTime) {
      sequence.push(problem.n + gap);
      gap += 1;
    }
    sequence.push(i);
  }
  return sequence;
}

/**
 * Keeps the placements' order (and so their changeover) but moves each as close to its current start as the
 * order allows: latest feasible starts are found backwards through each gap, then each start is its current one
 * clamped between the earliest start after its predecessor and that latest start. A booking whose place in the
 * order is unchanged thus stays put instead of sliding to the earliest minute of its window.
 */
export function settleTowardsCurrent(problem: PlanProblem, placements: Placement[], currentStarts: Array<number | null>): void {
  const { n, requests, gaps, cReq, cLeft, cRight } = problem;
  const G = gaps.length;
  let k = 0;
  while (k < placements.length) {
    const g = placements[k].gap;
    let last = k;
    while (last + 1 < placements.length && placements[last + 1].gap === g) last += 1;
    const latestStart: number[] = [];
    for (let t = last; t >= k; t -= 1) {
      const i = placements[t].index;
      const r = requests[i];
      const bound = t === last ? gaps[g].rightTime - cRight[i * G + g] : latestStart[t + 1 - k] - cReq[i * n + placements[t + 1].index];
      latestStart[t - k] = Math.min(r.latest, bound) - r.duration;
    }
    for (let t = k; t <= last; t += 1) {
      const p = placements[t];
      const r = requests[p.index];
      const previous = t > k ? placements[t - 1] : null;
      const ready = Math.max(r.earliest, previous ? previous.end + cReq[previous.index * n + p.index] : gaps[g].leftTime + cLeft[g * n + p.index]);
      const wanted = currentStarts[p.index] ?? ready;
      p.start = Math.min(Math.max(wanted, ready), Math.max(ready, latestStart[t - k]));
      p.end = p.start + r.duration;
    }
    k = last + 1;
  }
}
