import { type PickerUnit, fromNm, toNm } from '@femtoslot/shared';

export const unitLabels: Record<PickerUnit, string> = { nm: 'nm', um: 'µm', cm1: 'cm⁻¹' };

export interface RangeNm {
  minNm: number;
  maxNm: number;
}

/** A positive decimal as typed (a decimal comma is read as a point), else null. */
export function parsePositive(text: string): number | null {
  const trimmed = text.trim();
  const value = Number(trimmed.replace(',', '.'));
  return trimmed !== '' && Number.isFinite(value) && value > 0 ? value : null;
}

/** A non-negative decimal as typed; '' is "not given" (undefined), anything unreadable is null. */
export function parseOptionalNumber(text: string): number | null | undefined {
  const trimmed = text.trim();
  if (trimmed === '') return undefined;
  const value = Number(trimmed.replace(',', '.'));
  return Number.isFinite(value) && value >= 0 ? value : null;
}

/** nm to 3 decimals (1 pm): finer than any tuning step and free of float noise in the request. */
export function roundNm(nm: number): number {
  return Math.round(nm * 1000) / 1000;
}

/**
 * The tuning range covered, in nm, from the two typed ends in the picked unit. Wavenumber runs opposite
 * to wavelength, so the ends are put back in short-to-long order whatever the unit.
 */
export function rangeToNm(minText: string, maxText: string, unit: PickerUnit): RangeNm | null {
  const a = parsePositive(minText);
  const b = parsePositive(maxText);
  if (a === null || b === null) return null;
  const first = roundNm(toNm(a, unit));
  const second = roundNm(toNm(b, unit));
  return { minNm: Math.min(first, second), maxNm: Math.max(first, second) };
}

const digitsFor: Record<PickerUnit, number> = { nm: 2, um: 4, cm1: 2 };

/** A wavelength in nm as the form shows it in `unit`. */
export function nmToText(nm: number, unit: PickerUnit): string {
  return String(Number(fromNm(nm, unit).toFixed(digitsFor[unit])));
}

/** Re-expresses a typed value when the unit picker changes, so it stays the same wavelength. */
export function convertTyped(text: string, from: PickerUnit, to: PickerUnit): string {
  const value = parsePositive(text);
  if (value === null || from === to) return text;
  return nmToText(toNm(value, from), to);
}

const nmFormat = new Intl.NumberFormat('en', { maximumFractionDigits: 1 });

/** "1150–1600 nm" */
export function rangeText(range: RangeNm): string {
  return range.minNm === range.maxNm
    ? `${nmFormat.format(range.minNm)} nm`
    : `${nmFormat.format(range.minNm)}–${nmFormat.format(range.maxNm)} nm`;
}
