import { describe, expect, it } from 'vitest';
import { convertTyped, rangeToNm, rangeText } from './range-units';

describe('tuning range units', () => {
  it('when a range is typed in µm, then it goes out in nm', () => {
    // Source: SI prefixes, 1 µm = 1000 nm
    expect(rangeToNm('1.2', '1,45', 'um')).toEqual({ minNm: 1200, maxNm: 1450 });
  });

  it('when a range is typed in cm⁻¹, then the ends come back short-to-long in nm', () => {
    // Source: ν̃[cm⁻¹] = 10⁷ / λ[nm]; 2500 cm⁻¹ = 4000 nm, 2000 cm⁻¹ = 5000 nm
    expect(rangeToNm('2500', '2000', 'cm1')).toEqual({ minNm: 4000, maxNm: 5000 });
  });

  it('when the ends are typed long-to-short in nm, then they are put in order', () => {
    expect(rangeToNm('1600', '1150', 'nm')).toEqual({ minNm: 1150, maxNm: 1600 });
  });

  it('when an end is missing or not positive, then there is no range', () => {
    expect(rangeToNm('', '1600', 'nm')).toBeNull();
    expect(rangeToNm('-3', '1600', 'nm')).toBeNull();
    expect(rangeToNm('abc', '1600', 'nm')).toBeNull();
  });

  it('when the unit picker moves nm → µm → cm⁻¹, then the typed value stays the same wavelength', () => {
    // Source: SI prefixes; ν̃[cm⁻¹] = 10⁷ / λ[nm] ⇒ 4000 nm = 2500 cm⁻¹
    expect(convertTyped('4000', 'nm', 'um')).toBe('4');
    expect(convertTyped('4', 'um', 'cm1')).toBe('2500');
    expect(convertTyped('', 'nm', 'um')).toBe('');
  });

  it('when a range is shown, then a single wavelength reads without a dash', () => {
    expect(rangeText({ minNm: 1300, maxNm: 1300 })).toBe('1,300 nm');
    expect(rangeText({ minNm: 1150, maxNm: 1600 })).toBe('1,150–1,600 nm');
  });
});
