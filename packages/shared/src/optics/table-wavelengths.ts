import { z } from 'zod';
import { outputKindSchema } from '../facility/facility.schemas';
import type { OutputKind } from '../facility/output-kinds';
import { EngineError, parseEngineInput } from '../units/engine-error';
import { DEFAULT_PUMP_NM, idlerFromPumpAndSignal, opaForDfgTarget, signalFromPumpAndIdler } from './mixing';

export const tableRoles = ['pump_residual', 'fundamental', 'shg', 'signal', 'idler', 'dfg'] as const;
export type TableRole = (typeof tableRoles)[number];

export { outputKindLabels } from '../facility/output-kinds';

export interface TableWavelength {
  role: TableRole;
  nm: number;
}
export interface TableBand {
  role: TableRole;
  minNm: number;
  maxNm: number;
}

const positiveNm = z.number().positive();
export const tableWavelengthsInputSchema = z.object({
  outputKind: outputKindSchema,
  targetNm: positiveNm,
  pumpNm: positiveNm.default(DEFAULT_PUMP_NM),
});
export type TableWavelengthsInput = z.input<typeof tableWavelengthsInputSchema>;

export const tableBandsInputSchema = z
  .object({ outputKind: outputKindSchema, minNm: positiveNm, maxNm: positiveNm, pumpNm: positiveNm.default(DEFAULT_PUMP_NM) })
  .refine((v) => v.minNm <= v.maxNm, { message: 'minNm must not exceed maxNm', path: ['maxNm'] });
export type TableBandsInput = z.input<typeof tableBandsInputSchema>;

function wavelengthsFor(outputKind: OutputKind, targetNm: number, pumpNm: number): TableWavelength[] {
  switch (outputKind) {
    case 'fundamental':
      return [{ role: 'fundamental', nm: targetNm }];
    case 'shg':
      // The doubling crystal passes the unconverted fundamental at twice the target.
      return [
        { role: 'shg', nm: targetNm },
        { role: 'pump_residual', nm: 2 * targetNm },
      ];
    case 'opa_signal':
      return [
        { role: 'pump_residual', nm: pumpNm },
        { role: 'signal', nm: targetNm },
        { role: 'idler', nm: idlerFromPumpAndSignal(pumpNm, targetNm) },
      ];
    case 'opa_idler':
      return [
        { role: 'pump_residual', nm: pumpNm },
        { role: 'signal', nm: signalFromPumpAndIdler(pumpNm, targetNm) },
        { role: 'idler', nm: targetNm },
      ];
    case 'dfg': {
      const mix = opaForDfgTarget(pumpNm, targetNm);
      return [
        { role: 'pump_residual', nm: pumpNm },
        { role: 'signal', nm: mix.signalNm },
        { role: 'idler', nm: mix.idlerNm },
        { role: 'dfg', nm: targetNm },
      ];
    }
  }
}

/** Every wavelength present on the table for one output at one target, shortest first. */
export function tableWavelengths(input: TableWavelengthsInput): TableWavelength[] {
  const { outputKind, targetNm, pumpNm } = parseEngineInput(tableWavelengthsInputSchema, input, 'invalid_wavelengths');
  return wavelengthsFor(outputKind, targetNm, pumpNm).sort((a, b) => a.nm - b.nm);
}

/**
 * Bands on the table for a target range. Each role's wavelength is monotonic in the target,
 * so the two range ends bound every wavelength in between.
 */
export function tableBands(input: TableBandsInput): TableBand[] {
  const { outputKind, minNm, maxNm, pumpNm } = parseEngineInput(tableBandsInputSchema, input, 'invalid_wavelengths');
  const low = wavelengthsFor(outputKind, minNm, pumpNm);
  const high = wavelengthsFor(outputKind, maxNm, pumpNm);
  return low
    .map((entry) => {
      const partner = high.find((h) => h.role === entry.role);
      if (!partner) throw new EngineError('invalid_wavelengths', `No ${entry.role} partner at ${maxNm} nm`);
      return { role: entry.role, minNm: Math.min(entry.nm, partner.nm), maxNm: Math.max(entry.nm, partner.nm) };
    })
    .sort((a, b) => a.minNm - b.minNm);
}
