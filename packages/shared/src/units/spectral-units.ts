import { z } from 'zod';
import { parseEngineInput } from './engine-error';

/** SI defining constants, exact since the 2019 redefinition (CODATA 2018). */
export const SPEED_OF_LIGHT_M_PER_S = 299_792_458;
export const PLANCK_J_S = 6.626_070_15e-34;
export const ELEMENTARY_CHARGE_C = 1.602_176_634e-19;
/** h·c/e in eV·nm ≈ 1239.841984. */
export const HC_EV_NM = (PLANCK_J_S * SPEED_OF_LIGHT_M_PER_S) / ELEMENTARY_CHARGE_C / 1e-9;

export const spectralUnits = ['nm', 'um', 'cm1', 'eV', 'THz'] as const;
export type SpectralUnit = (typeof spectralUnits)[number];
/** The units offered by the booking form's unit picker. */
export const pickerUnits = ['nm', 'um', 'cm1'] as const satisfies readonly SpectralUnit[];
export type PickerUnit = (typeof pickerUnits)[number];

export const spectralValueInputSchema = z.object({
  value: z.number().positive(),
  unit: z.enum(spectralUnits),
});
export type SpectralValueInput = z.input<typeof spectralValueInputSchema>;

const positiveNmSchema = z.number().positive();

export interface WavelengthDescription {
  nm: number;
  um: number;
  cm1: number;
  eV: number;
  THz: number;
}

function convertFromNm(nm: number, unit: SpectralUnit): number {
  switch (unit) {
    case 'nm':
      return nm;
    case 'um':
      return nm / 1000;
    case 'cm1':
      return 1e7 / nm;
    case 'eV':
      return HC_EV_NM / nm;
    case 'THz':
      return SPEED_OF_LIGHT_M_PER_S / (nm * 1e-9) / 1e12;
  }
}

/** Every spectral quantity here is either proportional or inversely proportional to λ. */
function convertToNm(value: number, unit: SpectralUnit): number {
  switch (unit) {
    case 'nm':
      return value;
    case 'um':
      return value * 1000;
    case 'cm1':
      return 1e7 / value;
    case 'eV':
      return HC_EV_NM / value;
    case 'THz':
      return SPEED_OF_LIGHT_M_PER_S / (value * 1e12) / 1e-9;
  }
}

export function toNm(value: number, unit: SpectralUnit): number {
  const input = parseEngineInput(spectralValueInputSchema, { value, unit }, 'invalid_wavelengths');
  return convertToNm(input.value, input.unit);
}

export function fromNm(nm: number, unit: SpectralUnit): number {
  const input = parseEngineInput(spectralValueInputSchema, { value: nm, unit }, 'invalid_wavelengths');
  return convertFromNm(input.value, input.unit);
}

export function describeWavelength(nm: number): WavelengthDescription {
  const value = parseEngineInput(positiveNmSchema, nm, 'invalid_wavelengths');
  return {
    nm: value,
    um: convertFromNm(value, 'um'),
    cm1: convertFromNm(value, 'cm1'),
    eV: convertFromNm(value, 'eV'),
    THz: convertFromNm(value, 'THz'),
  };
}
