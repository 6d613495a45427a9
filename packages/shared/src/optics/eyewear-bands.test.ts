import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { eyewearCoverage, eyewearCovering, requiredOdGaps, requiredOdProfile } from './eyewear';
import { tableBands } from './table-wavelengths';

// Required ODs and eyewear ratings here are invented test values; real ones come from the laser-safety officer.
const dfgRequirement = [
  { minNm: 700, maxNm: 900, od: 7 },
  { minNm: 900, maxNm: 11000, od: 5 },
];
const od5Broad = { id: 'od5-broad', bands: [{ minNm: 190, maxNm: 11500, od: 5 }] };
const od7Pump = { id: 'od7-pump', bands: [{ minNm: 700, maxNm: 1000, od: 7 }, { minNm: 1000, maxNm: 11500, od: 5 }] };

describe('required OD per wavelength band', () => {
  it('when a DFG table carries the 800 nm pump residual needing OD 7, then an OD 5 goggle does not cover it', () => {
    // DFG at 3466.7 nm from an 800 nm pump puts 800, 1300, 2080 and 3466.7 nm on the table (energy conservation, Boyd).
    const table = tableBands({ outputKind: 'dfg', minNm: 3466.6667, maxNm: 3466.6667, pumpNm: 800 });
    const result = eyewearCoverage(table, dfgRequirement, [od5Broad, od7Pump]);
    expect(result.covering.map((e) => e.id)).toEqual(['od7-pump']);
    const pump = result.wavelengths.find((w) => w.role === 'pump_residual')!;
    expect(pump.requiredOd).toBe(7);
    expect(pump.covering.map((e) => e.id)).toEqual(['od7-pump']);
    const dfg = result.wavelengths.find((w) => w.role === 'dfg')!;
    expect(dfg.requiredOd).toBe(5);
    expect(dfg.covering.map((e) => e.id)).toEqual(['od5-broad', 'od7-pump']);
  });

  it('when bands overlap, then the maximum OD required at a wavelength applies, including at a shared edge', () => {
    expect(requiredOdProfile({ minNm: 900, maxNm: 900 }, dfgRequirement)).toEqual([{ minNm: 900, maxNm: 900, od: 7 }]);
    expect(requiredOdProfile({ minNm: 850, maxNm: 1000 }, dfgRequirement)).toEqual([
      { minNm: 850, maxNm: 900, od: 7 },
      { minNm: 900, maxNm: 1000, od: 5 },
    ]);
  });

  it('when a wavelength on the table has no required OD set, then it is reported unset and no eyewear covers it', () => {
    const result = eyewearCoverage([{ role: 'dfg', minNm: 11000, maxNm: 12000 }], dfgRequirement, [od5Broad]);
    expect(result.wavelengths[0]!.requiredOd).toBeNull();
    expect(result.wavelengths[0]!.unsetNm).toEqual([{ minNm: 11000, maxNm: 12000 }]);
    expect(result.covering).toEqual([]);
    expect(eyewearCovering([11500], [od5Broad], dfgRequirement)).toEqual([]);
  });

  it('when OD bands leave the SHG residual fundamental uncovered, then the gap is named', () => {
    // SHG 390–410 nm passes the 780–820 nm fundamental (SHG halves the wavelength; Boyd, Nonlinear Optics).
    const shg = { outputKind: 'shg' as const, minNm: 390, maxNm: 410, pumpNm: 800 };
    expect(requiredOdGaps(shg, [{ minNm: 380, maxNm: 420, od: 6 }])).toEqual([{ minNm: 780, maxNm: 820 }]);
    expect(requiredOdGaps(shg, [{ minNm: 380, maxNm: 420, od: 6 }, { minNm: 700, maxNm: 900, od: 7 }])).toEqual([]);
  });

  it('for any bands, the coverage equals the pointwise rule: rated OD ≥ required OD at every wavelength on the table', () => {
    const band = fc.tuple(fc.integer({ min: 200, max: 3000 }), fc.integer({ min: 1, max: 1500 }), fc.integer({ min: 0, max: 10 }))
      .map(([minNm, width, od]) => ({ minNm, maxNm: minNm + width, od }));
    const interval = fc.tuple(fc.integer({ min: 200, max: 4000 }), fc.integer({ min: 0, max: 800 })).map(([minNm, width]) => ({ minNm, maxNm: minNm + width }));
    fc.assert(fc.property(fc.array(band, { minLength: 1, maxLength: 4 }), fc.array(band, { minLength: 1, maxLength: 4 }), fc.array(interval, { minLength: 1, maxLength: 3 }), (required, rated, table) => {
      const covers = eyewearCovering(table, [{ bands: rated }], required).length === 1;
      // Oracle: every edge and every midpoint between consecutive edges inside each table interval.
      const maxOd = (bands: typeof required, nm: number) => Math.max(-Infinity, ...bands.filter((b) => b.minNm <= nm && nm <= b.maxNm).map((b) => b.od));
      const holds = table.every(({ minNm, maxNm }) => {
        const edges = [...new Set([minNm, maxNm, ...[...required, ...rated].flatMap((b) => [b.minNm, b.maxNm]).filter((e) => e > minNm && e < maxNm)])].sort((a, b) => a - b);
        const points = edges.flatMap((e, i) => (i + 1 < edges.length ? [e, (e + edges[i + 1]!) / 2] : [e]));
        return points.every((nm) => {
          const need = maxOd(required, nm);
          return need !== -Infinity && maxOd(rated, nm) >= need;
        });
      });
      expect(covers).toBe(holds);
    }), { numRuns: 400 });
  });

  it('for any bands, raising a required OD never adds coverage and raising a rating never removes it', () => {
    const band = fc.tuple(fc.integer({ min: 200, max: 3000 }), fc.integer({ min: 1, max: 1500 }), fc.integer({ min: 0, max: 10 }))
      .map(([minNm, width, od]) => ({ minNm, maxNm: minNm + width, od }));
    fc.assert(fc.property(fc.array(band, { minLength: 1, maxLength: 4 }), fc.array(band, { minLength: 1, maxLength: 4 }), fc.integer({ min: 200, max: 4000 }), fc.nat(3), (required, rated, nm, which) => {
      const base = eyewearCovering([nm], [{ bands: rated }], required).length;
      const i = which % required.length;
      const stricter = required.map((b, k) => (k === i ? { ...b, od: Math.min(12, b.od + 1) } : b));
      expect(eyewearCovering([nm], [{ bands: rated }], stricter).length).toBeLessThanOrEqual(base);
      const better = rated.map((b, k) => (k === which % rated.length ? { ...b, od: Math.min(12, b.od + 1) } : b));
      expect(eyewearCovering([nm], [{ bands: better }], required).length).toBeGreaterThanOrEqual(base);
    }), { numRuns: 300 });
  });
});
