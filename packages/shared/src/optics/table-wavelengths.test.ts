import { describe, expect, it } from 'vitest';
import { eyewearCovering } from './eyewear';
import { tableBands, tableWavelengths } from './table-wavelengths';

const rounded = (list: { role: string; nm: number }[]) => list.map((w) => ({ role: w.role, nm: Number(w.nm.toFixed(1)) }));

describe('wavelengths on the table', () => {
  it('when the fundamental is at 800 nm, then only 800 nm is on the table', () => {
    expect(tableWavelengths({ outputKind: 'fundamental', targetNm: 800 })).toEqual([{ role: 'fundamental', nm: 800 }]);
  });

  it('when SHG is at 400 nm, then 400 nm and the 800 nm residual are on the table', () => {
    // Source: SHG halves the wavelength (Boyd, Nonlinear Optics); residual fundamental passes the crystal
    expect(tableWavelengths({ outputKind: 'shg', targetNm: 400 })).toEqual([
      { role: 'shg', nm: 400 },
      { role: 'pump_residual', nm: 800 },
    ]);
  });

  it('when the OPA signal is at 1300 nm, then pump 800, signal 1300 and idler 2080 are on the table', () => {
    // Source: energy conservation (Boyd, Nonlinear Optics)
    expect(rounded(tableWavelengths({ outputKind: 'opa_signal', targetNm: 1300 }))).toEqual([
      { role: 'pump_residual', nm: 800 },
      { role: 'signal', nm: 1300 },
      { role: 'idler', nm: 2080 },
    ]);
  });

  it('when the OPA idler is at 2080 nm, then pump 800, signal 1300 and idler 2080 are on the table', () => {
    // Source: energy conservation (Boyd, Nonlinear Optics)
    expect(rounded(tableWavelengths({ outputKind: 'opa_idler', targetNm: 2080 }))).toEqual([
      { role: 'pump_residual', nm: 800 },
      { role: 'signal', nm: 1300 },
      { role: 'idler', nm: 2080 },
    ]);
  });

  it('when DFG is at 3466.7 nm, then pump, signal 1300, idler 2080 and DFG are on the table', () => {
    // Source: 1/λs = (1/λp + 1/λDFG)/2, 1/λi = (1/λp − 1/λDFG)/2 (Boyd, Nonlinear Optics)
    expect(rounded(tableWavelengths({ outputKind: 'dfg', targetNm: 3466.6667 }))).toEqual([
      { role: 'pump_residual', nm: 800 },
      { role: 'signal', nm: 1300 },
      { role: 'idler', nm: 2080 },
      { role: 'dfg', nm: 3466.7 },
    ]);
  });

  it('when a signal range 1300–1400 nm is asked, then the idler band runs 1866.7–2080 nm', () => {
    const bands = tableBands({ outputKind: 'opa_signal', minNm: 1300, maxNm: 1400 });
    const idler = bands.find((b) => b.role === 'idler');
    // Source: energy conservation (Boyd, Nonlinear Optics); idler falls as signal rises
    expect(idler?.minNm).toBeCloseTo(1866.67, 2);
    expect(idler?.maxNm).toBeCloseTo(2080, 6);
    expect(bands.find((b) => b.role === 'pump_residual')).toEqual({ role: 'pump_residual', minNm: 800, maxNm: 800 });
  });
});

describe('eyewear covering', () => {
  // One required OD over the whole spectrum, as a single band (the per-band rules are in eyewear-bands.test.ts).
  const everywhere = (od: number) => [{ minNm: 100, maxNm: 20000, od }];
  const nearIr = { id: 'near-ir', bands: [{ minNm: 740, maxNm: 1100, od: 7 }, { minNm: 1100, maxNm: 2200, od: 6 }] };
  const broad = { id: 'broad', bands: [{ minNm: 190, maxNm: 11000, od: 5 }] };
  const visible = { id: 'visible', bands: [{ minNm: 190, maxNm: 532, od: 6 }] };

  it('when every wavelength falls in bands at high enough OD, then the item is returned', () => {
    const result = eyewearCovering([800, 1300, 2080], [nearIr, broad, visible], everywhere(6));
    expect(result.map((e) => e.id)).toEqual(['near-ir']);
  });

  it('when one wavelength is outside every band at the OD, then no eyewear covers the table', () => {
    expect(eyewearCovering([800, 1300, 2400], [nearIr, visible], everywhere(6))).toEqual([]);
  });

  it('when a band is asked, then two adjoining bands of one item can cover it together', () => {
    expect(eyewearCovering([{ minNm: 800, maxNm: 2000 }], [nearIr], everywhere(6)).map((e) => e.id)).toEqual(['near-ir']);
    expect(eyewearCovering([{ minNm: 800, maxNm: 2000 }], [nearIr], everywhere(7))).toEqual([]);
  });
});
