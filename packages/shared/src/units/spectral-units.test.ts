import { describe, expect, it } from 'vitest';
import { EngineError } from './engine-error';
import { describeWavelength, fromNm, HC_EV_NM, toNm } from './spectral-units';

describe('spectral units', () => {
  it('when h, c and e take their exact SI values, then hc/e is 1239.841984 eV·nm', () => {
    // Source: CODATA 2018 (NIST), exact defining constants ⇒ hc = 1239.841984 eV·nm
    expect(HC_EV_NM).toBeCloseTo(1239.841984, 6);
  });

  it('when 800 nm is described, then it is 1.549802 eV, 12 500 cm⁻¹ and 374.7406 THz', () => {
    const d = describeWavelength(800);
    // Source: CODATA 2018 exact constants; E = hc/λ, ν̃ = 1/λ, ν = c/λ
    expect(d.eV).toBeCloseTo(1.549802, 6);
    expect(d.cm1).toBeCloseTo(12500, 9);
    expect(d.THz).toBeCloseTo(374.7406, 4);
    expect(d.um).toBe(0.8);
  });

  it('when a wavelength goes nm → eV → nm, then it comes back within 1e-9', () => {
    for (const nm of [193.3, 400, 800, 1300, 2080, 3466.7, 11000]) {
      // Source: CODATA 2018 — the conversion is an exact inverse pair
      expect(Math.abs(toNm(fromNm(nm, 'eV'), 'eV') - nm)).toBeLessThan(1e-9);
      expect(Math.abs(toNm(fromNm(nm, 'THz'), 'THz') - nm)).toBeLessThan(1e-9);
    }
  });

  it('when the unit picker gives 3.5 µm or 2000 cm⁻¹, then they are 3500 nm and 5000 nm', () => {
    // Source: SI prefixes; ν̃[cm⁻¹] = 10⁷ / λ[nm]
    expect(toNm(3.5, 'um')).toBe(3500);
    expect(toNm(2000, 'cm1')).toBe(5000);
    expect(fromNm(5000, 'cm1')).toBe(2000);
  });

  it('when a wavelength is zero, negative or not finite, then an invalid_wavelengths error is thrown', () => {
    for (const bad of [0, -5, Number.NaN, Number.POSITIVE_INFINITY]) {
      expect(() => describeWavelength(bad)).toThrow(EngineError);
      expect(() => toNm(bad, 'nm')).toThrow(expect.objectContaining({ code: 'invalid_wavelengths' }));
    }
  });
});
