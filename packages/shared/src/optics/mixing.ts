import { z } from 'zod';
import { EngineError, parseEngineInput } from '../units/engine-error';

/** The default pump of the demo source: the Ti:sapphire amplifier near 800 nm. */
export const DEFAULT_PUMP_NM = 800;

// Relative tolerance for "signal equals idler": floating point never gives exact equality.
const DEGENERACY_TOLERANCE = 1e-9;

const wavelengthSchema = z.number().positive();
export const opaMixingInputSchema = z.object({ pumpNm: wavelengthSchema, signalNm: wavelengthSchema });
export const dfgMixingInputSchema = z.object({ signalNm: wavelengthSchema, idlerNm: wavelengthSchema });
export const sumFrequencyInputSchema = z.object({ firstNm: wavelengthSchema, secondNm: wavelengthSchema });
export const dfgTargetInputSchema = z.object({ pumpNm: wavelengthSchema, dfgNm: wavelengthSchema });
export const idlerTargetInputSchema = z.object({ pumpNm: wavelengthSchema, idlerNm: wavelengthSchema });

export interface OpaMixing {
  pumpNm: number;
  signalNm: number;
  idlerNm: number;
  /** Signal − idler difference frequency; null at degeneracy, where it is undefined. */
  dfgNm: number | null;
  degenerate: boolean;
}

function isDegenerate(signalNm: number, idlerNm: number): boolean {
  return Math.abs(signalNm - idlerNm) <= DEGENERACY_TOLERANCE * Math.max(signalNm, idlerNm);
}

function checkedOpa(pumpNm: number, signalNm: number): { idlerNm: number; degenerate: boolean } {
  if (signalNm <= pumpNm) {
    throw new EngineError('invalid_wavelengths', `Signal ${signalNm} nm must be longer than the pump ${pumpNm} nm`, {
      pumpNm,
      signalNm,
    });
  }
  const degenerate = isDegenerate(signalNm, 2 * pumpNm);
  if (!degenerate && signalNm > 2 * pumpNm) {
    throw new EngineError(
      'invalid_wavelengths',
      `Signal ${signalNm} nm is beyond degeneracy (${2 * pumpNm} nm); by convention the shorter OPA output is the signal`,
      { pumpNm, signalNm },
    );
  }
  const idlerNm = degenerate ? signalNm : 1 / (1 / pumpNm - 1 / signalNm);
  return { idlerNm, degenerate };
}

/** Energy conservation in the OPA: 1/λp = 1/λs + 1/λi. Degeneracy (λs = λi = 2λp) is allowed here. */
export function idlerFromPumpAndSignal(pumpNm: number, signalNm: number): number {
  const input = parseEngineInput(opaMixingInputSchema, { pumpNm, signalNm }, 'invalid_wavelengths');
  return checkedOpa(input.pumpNm, input.signalNm).idlerNm;
}

/** Inverse of the above: the signal partner of an idler, 1/λs = 1/λp − 1/λi. */
export function signalFromPumpAndIdler(pumpNm: number, idlerNm: number): number {
  const input = parseEngineInput(idlerTargetInputSchema, { pumpNm, idlerNm }, 'invalid_wavelengths');
  const degenerate = isDegenerate(input.idlerNm, 2 * input.pumpNm);
  if (!degenerate && input.idlerNm < 2 * input.pumpNm) {
    throw new EngineError(
      'invalid_wavelengths',
      `Idler ${input.idlerNm} nm is below degeneracy (${2 * input.pumpNm} nm); by convention the longer OPA output is the idler`,
      { pumpNm: input.pumpNm, idlerNm: input.idlerNm },
    );
  }
  return degenerate ? input.idlerNm : 1 / (1 / input.pumpNm - 1 / input.idlerNm);
}

/** Difference frequency of signal and idler: 1/λDFG = 1/λs − 1/λi. */
export function dfgFromSignalAndIdler(signalNm: number, idlerNm: number): number {
  const input = parseEngineInput(dfgMixingInputSchema, { signalNm, idlerNm }, 'invalid_wavelengths');
  if (isDegenerate(input.signalNm, input.idlerNm)) {
    throw new EngineError('degenerate', 'Signal and idler are degenerate; their difference frequency is undefined', {
      signalNm: input.signalNm,
      idlerNm: input.idlerNm,
    });
  }
  if (input.signalNm > input.idlerNm) {
    throw new EngineError('invalid_wavelengths', `Signal ${input.signalNm} nm must be shorter than idler ${input.idlerNm} nm`, {
      signalNm: input.signalNm,
      idlerNm: input.idlerNm,
    });
  }
  return 1 / (1 / input.signalNm - 1 / input.idlerNm);
}

/** Idler and DFG for a pump and signal; throws `degenerate` at λs = 2λp where DFG is undefined. */
export function opaMixing(pumpNm: number, signalNm: number): OpaMixing {
  const input = parseEngineInput(opaMixingInputSchema, { pumpNm, signalNm }, 'invalid_wavelengths');
  const { idlerNm, degenerate } = checkedOpa(input.pumpNm, input.signalNm);
  if (degenerate) {
    throw new EngineError('degenerate', `Signal ${input.signalNm} nm is at degeneracy (2 × pump); DFG is undefined`, {
      pumpNm: input.pumpNm,
      signalNm: input.signalNm,
    });
  }
  return { ...input, idlerNm, dfgNm: 1 / (1 / input.signalNm - 1 / idlerNm), degenerate };
}

export function secondHarmonicNm(nm: number): number {
  return parseEngineInput(wavelengthSchema, nm, 'invalid_wavelengths') / 2;
}

/** Sum-frequency generation: 1/λ = 1/λ1 + 1/λ2. */
export function sumFrequencyNm(firstNm: number, secondNm: number): number {
  const input = parseEngineInput(sumFrequencyInputSchema, { firstNm, secondNm }, 'invalid_wavelengths');
  return 1 / (1 / input.firstNm + 1 / input.secondNm);
}

/**
 * Signal and idler that give a DFG target with a fixed pump. From 1/λDFG = 1/λs − 1/λi and
 * 1/λp = 1/λs + 1/λi: 1/λs = (1/λp + 1/λDFG)/2 and 1/λi = (1/λp − 1/λDFG)/2.
 */
export function opaForDfgTarget(pumpNm: number, dfgNm: number): { pumpNm: number; signalNm: number; idlerNm: number; dfgNm: number } {
  const input = parseEngineInput(dfgTargetInputSchema, { pumpNm, dfgNm }, 'invalid_wavelengths');
  if (input.dfgNm <= input.pumpNm) {
    throw new EngineError(
      'invalid_wavelengths',
      `DFG ${input.dfgNm} nm cannot be reached from a ${input.pumpNm} nm pump; it must be longer than the pump`,
      { pumpNm: input.pumpNm, dfgNm: input.dfgNm },
    );
  }
  const signalNm = 2 / (1 / input.pumpNm + 1 / input.dfgNm);
  const idlerNm = 2 / (1 / input.pumpNm - 1 / input.dfgNm);
  return { pumpNm: input.pumpNm, signalNm, idlerNm, dfgNm: input.dfgNm };
}
