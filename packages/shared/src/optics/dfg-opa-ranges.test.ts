import { describe, expect, it } from 'vitest';
import { checkTargetFeasibility } from './feasibility';

// The instrument's own OPA outputs (demo ranges); a DFG stage is fed by them, so its signal and idler must lie in them.
const opa = { signal: { minNm: 1150, maxNm: 1600 }, idler: { minNm: 1600, maxNm: 2600 } };
// A DFG configuration whose own tuning range reaches down to 1800 nm: only the OPA ranges can refuse 2000 nm.
const wideDfg = { outputKind: 'dfg' as const, minNm: 1800, maxNm: 11000, pumpNm: 800, name: 'DFG mid-IR', opa };

/**
 * Hand calculation, independent of the engine: photon energy E = hc/λ with hc = 1239.841984 eV·nm (CODATA 2018, h and
 * c and e exact). Energy conservation in parametric generation (Boyd, Nonlinear Optics): Ep = Es + Ei and
 * EDFG = Es − Ei, so Es = (Ep + EDFG)/2 and Ei = (Ep − EDFG)/2.
 */
const HC_EV_NM = 1239.841984;
function handSignalIdler(pumpNm: number, dfgNm: number) {
  const ep = HC_EV_NM / pumpNm;
  const ed = HC_EV_NM / dfgNm;
  return { signalNm: HC_EV_NM / ((ep + ed) / 2), idlerNm: HC_EV_NM / ((ep - ed) / 2) };
}

describe('DFG target against the OPA signal and idler ranges', () => {
  it('when a 2000 nm DFG target needs a 1142.9 nm signal, then it is refused with the derived figures and the OPA ranges', () => {
    const hand = handSignalIdler(800, 2000);
    expect(hand.signalNm).toBeCloseTo(1142.857, 3); // 1/λs = (1/800 + 1/2000)/2 → 8000/7 nm
    expect(hand.idlerNm).toBeCloseTo(2666.667, 3); // 1/λi = (1/800 − 1/2000)/2 → 8000/3 nm
    const result = checkTargetFeasibility({ targetNm: 2000 }, wideDfg);
    expect(result.feasible).toBe(false);
    const reasons = result.reasons.filter((r) => r.code === 'opa_out_of_range');
    expect(reasons.map((r) => r.details?.role)).toEqual(['signal', 'idler']);
    expect(reasons[0]!.message).toBe('DFG 2000 nm needs the OPA signal at 1142.9 nm, outside its range 1150–1600 nm');
    expect(reasons[1]!.message).toBe('DFG 2000 nm needs the OPA idler at 2666.7 nm, outside its range 1600–2600 nm');
    expect(reasons[0]!.details?.derivedMinNm).toBeCloseTo(hand.signalNm, 6);
    expect(reasons[1]!.details?.derivedMaxNm).toBeCloseTo(hand.idlerNm, 6);
    expect(reasons[0]!.details).toMatchObject({ rangeMinNm: 1150, rangeMaxNm: 1600 });
  });

  it('when only the idler falls outside (2050 nm DFG → idler 2624 nm), then only the idler is named', () => {
    const hand = handSignalIdler(800, 2050);
    expect(hand.signalNm).toBeCloseTo(1150.88, 2);
    expect(hand.idlerNm).toBeCloseTo(2624.0, 1);
    const result = checkTargetFeasibility({ targetNm: 2050 }, wideDfg);
    expect(result.reasons.map((r) => [r.code, r.details?.role])).toEqual([['opa_out_of_range', 'idler']]);
  });

  it('when a DFG range starts where the idler is out of range, then the range is refused; inside it is accepted', () => {
    // The idler reaches 2600 nm at 1/λDFG = 1/800 − 2/2600, i.e. λDFG = 2080 nm (energy conservation, Boyd).
    expect(handSignalIdler(800, 2080).idlerNm).toBeCloseTo(2600, 6);
    expect(checkTargetFeasibility({ minNm: 2070, maxNm: 4000 }, wideDfg).feasible).toBe(false);
    const ok = checkTargetFeasibility({ minNm: 2090, maxNm: 4000 }, wideDfg);
    expect(ok.feasible).toBe(true);
    expect(ok.derived.signal?.maxNm).toBeCloseTo(handSignalIdler(800, 4000).signalNm, 6);
    expect(ok.derived.idler?.maxNm).toBeCloseTo(handSignalIdler(800, 2090).idlerNm, 6);
  });

  it('when the demo DFG range ends are checked with the OPA ranges, then both are accepted', () => {
    for (const targetNm of [2600, 11000]) {
      expect(checkTargetFeasibility({ targetNm }, { ...wideDfg, minNm: 2600 }).feasible).toBe(true);
    }
  });
});
