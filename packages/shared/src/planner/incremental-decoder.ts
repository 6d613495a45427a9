import { isBetter, type Evaluation, type PlanProblem } from './plan-problem';

/**
 * The local search's evaluator: the same decoding as decodeSequence, but a candidate that shares
 * a prefix with the current sequence resumes from a checkpoint, and a candidate that can no
 * longer beat the bound is abandoned early. Plans handed out are always re-decoded by
 * decodeSequence, so this class only ever affects speed.
 */
export class IncrementalDecoder {
  private readonly problem: PlanProblem;
  private readonly cap: number;
  private readonly ckGap: Int32Array;
  private readonly ckTop: Int32Array;
  private readonly ckSeen: Int32Array;
  private readonly ckPlaced: Int32Array;
  private readonly ckCost: Float64Array;
  private readonly baseItem: Int32Array;
  private readonly baseEnd: Float64Array;
  private readonly basePref: Float64Array;
  private readonly candItem: Int32Array;
  private readonly candEnd: Float64Array;
  private readonly candPref: Float64Array;
  private readonly totalRequests: number;

  constructor(problem: PlanProblem, length: number) {
    this.problem = problem;
    this.cap = problem.n + 1;
    const G = problem.gaps.length;
    this.ckGap = new Int32Array(length + 1);
    this.ckTop = new Int32Array(length + 1);
    this.ckSeen = new Int32Array(length + 1);
    this.ckPlaced = new Int32Array(length + 1);
    this.ckCost = new Float64Array(length + 1);
    this.baseItem = new Int32Array(G * this.cap);
    this.baseEnd = new Float64Array(G * this.cap);
    this.basePref = new Float64Array(G * this.cap);
    this.candItem = new Int32Array(this.cap);
    this.candEnd = new Float64Array(this.cap);
    this.candPref = new Float64Array(this.cap);
    this.totalRequests = problem.n;
  }

  /** Decodes the current sequence fully and records a checkpoint before every position. */
  setBase(sequence: Int32Array): Evaluation {
    return this.run(sequence, 0, null, true) as Evaluation;
  }

  /** The candidate's evaluation if it beats `bound`, else null; positions before `from` equal the base. */
  evaluate(candidate: Int32Array, from: number, bound: Evaluation): Evaluation | null {
    return this.run(candidate, from, bound, false);
  }

  private run(sequence: Int32Array, from: number, bound: Evaluation | null, record: boolean): Evaluation | null {
    const { n, requests, gaps, cReq, cLeft, cRight, emptyGapCost } = this.problem;
    const G = gaps.length;
    const cap = this.cap;
    const length = sequence.length;
    let gap = this.ckGap[from];
    let top = this.ckTop[from];
    let seen = this.ckSeen[from];
    let placed = this.ckPlaced[from];
    let cost = this.ckCost[from];
    // Stack entries below `shared` are the base's, for the gap the candidate resumed in.
    let shared = record ? 0 : top;
    const baseItem = this.baseItem;
    const baseEnd = this.baseEnd;
    const basePref = this.basePref;
    const items = record ? baseItem : this.candItem;
    const endsArr = record ? baseEnd : this.candEnd;
    const prefArr = record ? basePref : this.candPref;
    const total = this.totalRequests;
    let gapBase = gap * cap;
    let off = record ? gapBase : 0;
    // Top of the stack: item, end and chain cost, read from the base below `shared`.
    let lastItem = -1;
    let lastEnd = 0;
    let lastPref = 0;
    if (top > 0) {
      lastItem = baseItem[gapBase + top - 1];
      lastEnd = baseEnd[gapBase + top - 1];
      lastPref = basePref[gapBase + top - 1];
    }

    for (let k = from; k <= length; k += 1) {
      if (record && k < length) {
        this.ckGap[k] = gap;
        this.ckTop[k] = top;
        this.ckSeen[k] = seen;
        this.ckPlaced[k] = placed;
        this.ckCost[k] = cost;
      }
      const j = k < length ? sequence[k] : n;
      if (j < n) {
        seen += 1;
        const r = requests[j];
        const before = top === 0 ? cLeft[gap * n + j] : cReq[lastItem * n + j];
        const readyAt = (top === 0 ? gaps[gap].leftTime : lastEnd) + before;
        const start = readyAt > r.earliest ? readyAt : r.earliest;
        const end = start + r.duration;
        if (end <= r.latest && end <= gaps[gap].rightTime) {
          lastPref = (top === 0 ? 0 : lastPref) + before;
          lastItem = j;
          lastEnd = end;
          items[off + top] = j;
          endsArr[off + top] = end;
          prefArr[off + top] = lastPref;
          top += 1;
        }
      } else if (k === length || gap < G - 1) {
        const rightTime = gaps[gap].rightTime;
        while (top > 0 && lastEnd + cRight[lastItem * G + gap] > rightTime) {
          top -= 1;
          if (top > 0) {
            const t = top - 1;
            lastItem = t < shared ? baseItem[gapBase + t] : items[off + t];
            lastEnd = t < shared ? baseEnd[gapBase + t] : endsArr[off + t];
            lastPref = t < shared ? basePref[gapBase + t] : prefArr[off + t];
          }
        }
        cost += top === 0 ? emptyGapCost[gap] : lastPref + cRight[lastItem * G + gap];
        placed += top;
        top = 0;
        shared = 0;
        if (k < length) {
          gap += 1;
          gapBase = gap * cap;
          off = record ? gapBase : 0;
        }
      }
      if (bound) {
        const reachable = placed + top + (total - seen);
        if (reachable < bound.placed) return null;
        if (reachable === bound.placed && cost + (top === 0 ? 0 : lastPref) >= bound.cost - 1e-9) return null;
      }
    }
    for (let g = gap + 1; g < G; g += 1) cost += emptyGapCost[g];
    const result = { placed, cost };
    if (bound && !isBetter(result, bound)) return null;
    return result;
  }
}
