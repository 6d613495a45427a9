import { describe, expect, it } from 'vitest';
import {
  dfgFromSignalAndIdler,
  idlerFromPumpAndSignal,
  opaForDfgTarget,
  opaMixing,
  secondHarmonicNm,
  signalFromPumpAndIdler,
  sumFrequencyNm,
} from './mixing';

const code = (c: string) => expect.objectContaining({ code: c });

describe('parametric mixing', () => {
  it('when an 800 nm pump gives a 1300 nm signal, then the idler is 2080.0 nm and DFG 3466.7 nm', () => {
    const mix = opaMixing(800, 1300);
    // Source: energy conservation 1/λp = 1/λs + 1/λi (IUPAC Gold Book, "parametric processes"; Boyd, Nonlinear Optics)
    expect(mix.idlerNm).toBeCloseTo(2080.0, 1);
    // Source: 1/λDFG = 1/λs − 1/λi (Boyd, Nonlinear Optics)
    expect(mix.dfgNm).toBeCloseTo(3466.7, 1);
  });

  it('when the signal is 1400 nm, then the idler is 1866.7 nm and DFG 5600.0 nm', () => {
    const mix = opaMixing(800, 1400);
    // Source: energy conservation (Boyd, Nonlinear Optics)
    expect(mix.idlerNm).toBeCloseTo(1866.7, 1);
    expect(mix.dfgNm).toBeCloseTo(5600.0, 1);
  });

  it('when signal and idler are mixed back, then DFG and idler agree with the OPA relations', () => {
    // Source: energy conservation (Boyd, Nonlinear Optics): 1/1300 − 1/2080 = 1/3466.67
    expect(dfgFromSignalAndIdler(1300, 2080)).toBeCloseTo(3466.667, 3);
    expect(signalFromPumpAndIdler(800, 2080)).toBeCloseTo(1300, 9);
    expect(idlerFromPumpAndSignal(800, 1300)).toBeCloseTo(2080, 9);
  });

  it('when a DFG target of 3466.7 nm is asked with an 800 nm pump, then signal ≈ 1300 and idler ≈ 2080', () => {
    const mix = opaForDfgTarget(800, 3466.6667);
    // Source: 1/λs = (1/λp + 1/λDFG)/2, 1/λi = (1/λp − 1/λDFG)/2 from the two relations in Boyd, Nonlinear Optics
    expect(mix.signalNm).toBeCloseTo(1300, 2);
    expect(mix.idlerNm).toBeCloseTo(2080, 2);
  });

  it('when SHG of 800 nm and SFG of 800 + 1300 nm are asked, then they are 400 nm and 495.2 nm', () => {
    // Source: SHG ω → 2ω and SFG 1/λ = 1/λ1 + 1/λ2 (Boyd, Nonlinear Optics)
    expect(secondHarmonicNm(800)).toBe(400);
    expect(sumFrequencyNm(800, 1300)).toBeCloseTo(495.238, 3);
  });

  it('when the signal is exactly twice the pump, then OPA mixing reports degenerate', () => {
    expect(() => opaMixing(800, 1600)).toThrow(code('degenerate'));
    expect(() => dfgFromSignalAndIdler(1600, 1600)).toThrow(code('degenerate'));
    expect(idlerFromPumpAndSignal(800, 1600)).toBeCloseTo(1600, 9);
  });

  it('when the signal is at or below the pump, beyond degeneracy or not positive, then invalid_wavelengths', () => {
    expect(() => opaMixing(800, 800)).toThrow(code('invalid_wavelengths'));
    expect(() => opaMixing(800, 700)).toThrow(code('invalid_wavelengths'));
    expect(() => opaMixing(800, 1700)).toThrow(code('invalid_wavelengths'));
    expect(() => opaMixing(-800, 1300)).toThrow(code('invalid_wavelengths'));
    expect(() => opaMixing(800, Number.POSITIVE_INFINITY)).toThrow(code('invalid_wavelengths'));
    expect(() => dfgFromSignalAndIdler(2080, 1300)).toThrow(code('invalid_wavelengths'));
    expect(() => opaForDfgTarget(800, 700)).toThrow(code('invalid_wavelengths'));
    expect(() => signalFromPumpAndIdler(800, 1500)).toThrow(code('invalid_wavelengths'));
  });
});
