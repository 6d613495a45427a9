import { type PickerUnit, fromNm, toNm } from '@femtoslot/shared';

export const unitLabels: Record<PickerUnit, string> = { nm: 'nm', um: 'µm', cm1: 'cm⁻¹' };

export type TargetNm = { targetNm: number } | { minNm: number; maxNm: number };

function parsePositive(text: string): number | null {
  const value = Number(text.trim().replace(',', '.'));
  return text.trim() !== '' && Number.isFinite(value) && value > 0 ? value : null;
}

/**
 * The target in nm from the form's value(s) in the picked unit. Wavenumber runs opposite to wavelength,
 * so a range typed in cm⁻¹ is put back in short-to-long order.
 */
export function targetToNm(mode: 'single' | 'range', value: string, toValue: string, unit: PickerUnit): TargetNm | null {
  const first = parsePositive(value);
  if (first === null) return null;
  if (mode === 'single') return { targetNm: roundNm(toNm(first, unit)) };
  const second = parsePositive(toValue);
  if (second === null) return null;
  const a = roundNm(toNm(first, unit));
  const b = roundNm(toNm(second, unit));
  return { minNm: Math.min(a, b), maxNm: Math.max(a, b) };
}

/** nm to 3 decimals (1 pm): finer than any tuning step and free of float noise in the request. */
export function roundNm(nm: number): number {
  return Math.round(nm * 1000) / 1000;
}

/** A value in nm shown in another unit with sensible precision. */
export function formatInUnit(nm: number, unit: PickerUnit): string {
  const value = fromNm(nm, unit);
  const digits = unit === 'um' ? 4 : unit === 'cm1' ? 1 : 1;
  return `${new Intl.NumberFormat('en', { maximumFractionDigits: digits }).format(value)} ${unitLabels[unit]}`;
}

/** Re-expresses a typed value when the unit picker changes, so the target stays the same wavelength. */
export function convertTyped(text: string, from: PickerUnit, to: PickerUnit): string {
  const value = parsePositive(text);
  if (value === null || from === to) return text;
  const converted = fromNm(toNm(value, from), to);
  const digits = to === 'um' ? 4 : to === 'cm1' ? 2 : 2;
  return String(Number(converted.toFixed(digits)));
}
