import { IncrementalDecoder } from './incremental-decoder';
import { decodeSequence, isBetter, type Evaluation, type PlanProblem } from './plan-problem';
import { seededRandom } from './seeded-random';

export interface HeuristicSolution extends Evaluation {
  sequence: number[];
}

/** The sequence holds every request and the G−1 gap separators; unplaceable requests are skipped by the decoder. */
function construct(problem: PlanProblem, random: () => number, perturbOrder: boolean): number[] {
  const { n, requests, gaps } = problem;
  let sequence: number[] = [];
  for (let g = 0; g < gaps.length - 1; g += 1) sequence.push(n + g);
  // Tightest windows first, then by configuration and wavelength so that like states meet
  // (common practice for insertion heuristics); seeds other than the first shuffle the order.
  const slackBand = (r: (typeof requests)[number]) => Math.floor((r.latest - r.earliest - r.duration) / 240);
  const order = requests
    .map((r, i) => ({ i, r, noise: perturbOrder ? random() : 0 }))
    .sort(
      (a, b) =>
        slackBand(a.r) - slackBand(b.r) ||
        a.noise - b.noise ||
        a.r.state.configurationKey.localeCompare(b.r.state.configurationKey) ||
        a.r.state.nm - b.r.state.nm ||
        a.i - b.i,
    )
    .map((x) => x.i);
  const unplaced: number[] = [];
  let current = decodeSequence(problem, sequence);
  for (const j of order) {
    let bestSequence: number[] | null = null;
    let best: Evaluation | null = null;
    for (let p = 0; p <= sequence.length; p += 1) {
      const trial = sequence.slice(0, p);
      trial.push(j);
      for (let q = p; q < sequence.length; q += 1) trial.push(sequence[q]);
      const result = decodeSequence(problem, trial);
      if (result.placed > current.placed && (!best || isBetter(result, best))) {
        best = result;
        bestSequence = trial;
      }
    }
    if (bestSequence && best) {
      sequence = bestSequence;
      current = best;
    } else unplaced.push(j);
  }
  return [...sequence, ...unplaced];
}

/** Writes `sequence` with the segment [from, from+length) moved before position `to` of the rest. */
function writeMove(sequence: ArrayLike<number>, out: Int32Array, from: number, length: number, to: number): void {
  const len = sequence.length;
  let w = 0;
  let restIndex = 0;
  for (let i = 0; i < len; i += 1) {
    if (i >= from && i < from + length) continue;
    if (restIndex === to) for (let s = 0; s < length; s += 1) out[w++] = sequence[from + s];
    out[w++] = sequence[i];
    restIndex += 1;
  }
  if (restIndex === to) for (let s = 0; s < length; s += 1) out[w++] = sequence[from + s];
}

function moveSegment(sequence: number[], from: number, length: number, to: number): number[] {
  const out = new Int32Array(sequence.length);
  writeMove(sequence, out, from, length, to);
  return Array.from(out);
}

/** Or-opt (segments of 1–3 moved anywhere, across gaps too), swap and 2-opt reversal, first improvement. */
function localSearch(problem: PlanProblem, start: number[], maxPasses: number): { sequence: number[]; value: Evaluation } {
  const len = start.length;
  const sequence = Int32Array.from(start);
  const buffer = new Int32Array(len);
  const decoder = new IncrementalDecoder(problem, len);
  let value = decoder.setBase(sequence);
  const accept = (changedFrom: number): boolean => {
    const result = decoder.evaluate(buffer, changedFrom, value);
    if (!result) return false;
    sequence.set(buffer);
    value = decoder.setBase(sequence);
    return true;
  };
  const n = problem.n;
  for (let pass = 0; pass < maxPasses; pass += 1) {
    let improved = false;
    for (let length = 1; length <= 3; length += 1) {
      for (let from = 0; from + length <= len; from += 1) {
        if (length === 1 && sequence[from] >= n) continue;
        for (let to = 0; to <= len - length; to += 1) {
          if (to === from) continue;
          writeMove(sequence, buffer, from, length, to);
          if (accept(Math.min(from, to))) improved = true;
        }
      }
    }
    for (let a = 0; a < len; a += 1) {
      for (let b = a + 1; b < len; b += 1) {
        if (sequence[a] >= n && sequence[b] >= n) continue;
        buffer.set(sequence);
        buffer[a] = sequence[b];
        buffer[b] = sequence[a];
        if (accept(a)) improved = true;
      }
    }
    for (let a = 0; a < len - 2; a += 1) {
      for (let b = a + 3; b <= len; b += 1) {
        buffer.set(sequence);
        for (let x = a, y = b - 1; x < y; x += 1, y -= 1) {
          buffer[x] = sequence[y];
          buffer[y] = sequence[x];
        }
        if (accept(a)) improved = true;
      }
    }
    if (!improved) break;
  }
  return { sequence: Array.from(sequence), value };
}

function perturb(sequence: number[], random: () => number): number[] {
  let result = sequence;
  const moves = 2 + Math.floor(random() * 3);
  for (let m = 0; m < moves; m += 1) {
    const length = 1 + Math.floor(random() * Math.min(3, result.length));
    const from = Math.floor(random() * (result.length - length + 1));
    const to = Math.floor(random() * (result.length - length + 1));
    result = moveSegment(result, from, length, to);
  }
  return result;
}

/**
 * Cheapest insertion, then iterated local search with a seeded generator: deterministic for a
 * seed, and no claim of optimality.
 */
export function solveHeuristic(problem: PlanProblem, seed: number, searchRounds: number): HeuristicSolution {
  const random = seededRandom(seed);
  const initial = construct(problem, random, seed !== 1);
  let best = localSearch(problem, initial, 50);
  let current = best;
  for (let round = 0; round < searchRounds; round += 1) {
    const candidate = localSearch(problem, perturb(current.sequence, random), 50);
    if (!isBetter(current.value, candidate.value)) current = candidate;
    if (isBetter(candidate.value, best.value)) best = candidate;
  }
  return { ...best.value, sequence: best.sequence };
}
