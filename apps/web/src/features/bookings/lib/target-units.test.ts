import { describe, expect, test } from 'vitest';
import { convertTyped, formatInUnit, targetToNm } from './target-units';

describe('target units for the request form', () => {
  // Definitions: 1 µm = 1000 nm; wavenumber ν̃ (cm⁻¹) = 10⁷ / λ (nm) (SI; exact by definition).
  test('when 4.5 µm is typed, then 4500 nm is sent', () => {
    expect(targetToNm('single', '4.5', '', 'um')).toEqual({ targetNm: 4500 });
  });
  test('when 2000 cm⁻¹ is typed, then 5000 nm is sent', () => {
    expect(targetToNm('single', '2000', '', 'cm1')).toEqual({ targetNm: 5000 });
  });
  test('when a range is typed in cm⁻¹, then it is sent short to long in nm', () => {
    expect(targetToNm('range', '2500', '1000', 'cm1')).toEqual({ minNm: 4000, maxNm: 10000 });
  });
  test('when the text is empty or not positive, then no target is made', () => {
    expect(targetToNm('single', '', '', 'nm')).toBeNull();
    expect(targetToNm('single', '-3', '', 'nm')).toBeNull();
    expect(targetToNm('range', '1200', '', 'nm')).toBeNull();
  });
  test('when the unit flips nm → cm⁻¹ → µm → nm, then the wavelength survives the round trip', () => {
    const cm1 = convertTyped('1550', 'nm', 'cm1');
    expect(cm1).toBe('6451.61');
    const um = convertTyped(cm1, 'cm1', 'um');
    expect(um).toBe('1.55');
    expect(convertTyped(um, 'um', 'nm')).toBe('1550');
  });
  test('when a wavelength is shown in µm, then the unit sign is µm', () => {
    expect(formatInUnit(3300, 'um')).toBe('3.3 µm');
    expect(formatInUnit(5000, 'cm1')).toBe('2,000 cm⁻¹');
  });
});
