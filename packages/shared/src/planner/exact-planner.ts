import type { Evaluation, PlanProblem } from './plan-problem';

interface Label {
  mask: number;
  last: number;
  gap: number;
  start: number;
  end: number;
  cost: number;
  parent: Label | null;
}

export interface ExactSolution extends Evaluation {
  /** The sequence in decodeSequence form: request indices with gap separators (values ≥ n). */
  sequence: number[];
}

/** Adds a label unless one with the same key ends no later at no greater cost; drops those it beats. */
function insertLabel(bucket: Label[], label: Label): boolean {
  for (const other of bucket) {
    if (other.end <= label.end && other.cost <= label.cost) return false;
  }
  let write = 0;
  for (let k = 0; k < bucket.length; k += 1) {
    const other = bucket[k];
    if (!(label.end <= other.end && label.cost <= other.cost)) bucket[write++] = other;
  }
  bucket.length = write;
  bucket.push(label);
  return true;
}

/**
 * Exact plan by dynamic programming over (placed set, last request, gap), keeping the Pareto
 * front of (end time, changeover so far). Within one gap an earlier end at no greater cost can
 * always copy the other label's continuation, and moving to a later gap costs the same from
 * both, so pruning dominated labels keeps every optimum. Gaps are branched on explicitly because
 * waiting until after a fixed block can save a changeover that the earliest start would spend.
 */
export function solveExact(problem: PlanProblem): ExactSolution {
  const { n, requests, gaps, cReq, cLeft, cRight, emptyGapCost, emptySuffix } = problem;
  const G = gaps.length;
  const full = 1 << n;
  const buckets: Array<Label[] | undefined> = new Array(full * (n + 1) * G);
  const key = (mask: number, last: number, gap: number) => (mask * (n + 1) + (last + 1)) * G + gap;

  const root: Label = { mask: 0, last: -1, gap: 0, start: 0, end: gaps[0].leftTime, cost: 0, parent: null };
  buckets[key(0, -1, 0)] = [root];
  let best: Label = root;
  let bestEval: Evaluation = { placed: 0, cost: emptySuffix[0] };
  let bestCount = 0;

  for (let mask = 0; mask < full; mask += 1) {
    let count = 0;
    for (let m = mask; m; m &= m - 1) count += 1;
    for (let last = -1; last < n; last += 1) {
      if (last >= 0 && !(mask & (1 << last))) continue;
      for (let gap = 0; gap < G; gap += 1) {
        const bucket = buckets[key(mask, last, gap)];
        if (!bucket) continue;
        for (const label of bucket) {
          const closeCost = last < 0 ? emptyGapCost[gap] : cRight[last * G + gap];
          const closable = last < 0 || label.end + cRight[last * G + gap] <= gaps[gap].rightTime;
          if (closable) {
            const total = label.cost + closeCost + emptySuffix[gap + 1];
            if (count > bestCount || (count === bestCount && total < bestEval.cost - 1e-9)) {
              best = label;
              bestCount = count;
              bestEval = { placed: count, cost: total };
            }
          }
          for (let j = 0; j < n; j += 1) {
            if (mask & (1 << j)) continue;
            const r = requests[j];
            const nextMask = mask | (1 << j);
            // Same gap, straight after the last request (or the gap's left boundary).
            const before = last < 0 ? cLeft[gap * n + j] : cReq[last * n + j];
            let start = Math.max(r.earliest, label.end + before);
            let end = start + r.duration;
            if (end <= r.latest && end <= gaps[gap].rightTime) {
              const child = { mask: nextMask, last: j, gap, start, end, cost: label.cost + before, parent: label };
              const k = key(nextMask, j, gap);
              insertLabel((buckets[k] ??= []), child);
            }
            if (!closable) continue;
            // A later gap: close this one, pay the empty gaps skipped, enter after the left boundary.
            let skipped = closeCost;
            for (let g2 = gap + 1; g2 < G; g2 += 1) {
              const entry = cLeft[g2 * n + j];
              start = Math.max(r.earliest, gaps[g2].leftTime + entry);
              end = start + r.duration;
              if (end > r.latest) break;
              if (end <= gaps[g2].rightTime) {
                const child = { mask: nextMask, last: j, gap: g2, start, end, cost: label.cost + skipped + entry, parent: label };
                insertLabel((buckets[key(nextMask, j, g2)] ??= []), child);
              }
              skipped += emptyGapCost[g2];
            }
          }
        }
      }
    }
  }

  const chain: Label[] = [];
  for (let l: Label | null = best; l && l.last >= 0; l = l.parent) chain.push(l);
  chain.reverse();
  const sequence: number[] = [];
  let gap = 0;
  for (const l of chain) {
    while (gap < l.gap) sequence.push(n + gap++);
    sequence.push(l.last);
  }
  return { ...bestEval, sequence };
}
