import { z } from 'zod';
import { outputKindSchema } from '../facility/facility.schemas';
import { isEngineError, parseEngineInput } from '../units/engine-error';
import { DEFAULT_PUMP_NM } from './mixing';
import { outputKindLabels, tableBands, type TableBand, type TableRole } from './table-wavelengths';

export const targetInputSchema = z.union([
  z.object({ targetNm: z.number() }),
  z.object({ minNm: z.number(), maxNm: z.number() }),
]);
export type TargetInput = z.input<typeof targetInputSchema>;

export const configurationRangeInputSchema = z
  .object({
    outputKind: outputKindSchema,
    minNm: z.number().positive(),
    maxNm: z.number().positive(),
    pumpNm: z.number().positive().optional(),
    name: z.string().optional(),
  })
  
  .refine((c) => c.minNm <= c.maxNm, { message: 'tuning range minNm must not exceed maxNm', path: ['maxNm'] });
export type ConfigurationRangeInput = z.input<typeof configurationRangeInputSchema>;

export const feasibilityReasonCodes = ['invalid_wavelengths', 'inverted_range', 'out_of_range', 'unreachable'] as const;
export type FeasibilityReasonCode = (typeof feasibilityReasonCodes)[number];

export interface FeasibilityReason {
  code: FeasibilityReasonCode;
  message: string;
}

export interface FeasibilityResult {
  feasible: boolean;
  reasons: FeasibilityReason[];
  /** Wavelength of each role on the table; a point target gives minNm = maxNm. */
  derived: Partial<Record<TableRole, { minNm: number; maxNm: number }>>;
  onTable: TableBand[];
}

/** Formats nm for messages: at most one decimal, no trailing zeros. */
export function formatNm(nm: number): string {
  return String(Number(nm.toFixed(1)));
}

export function checkTargetFeasibility(target: TargetInput, configuration: ConfigurationRangeInput): FeasibilityResult {
  const t = parseEngineInput(targetInputSchema, target);
  const config = parseEngineInput(configurationRangeInputSchema, configuration);
  const label = config.name ?? outputKindLabels[config.outputKind];
  const range = `${label}'s tuning range ${formatNm(config.minNm)}–${formatNm(config.maxNm)} nm`;
  const [minNm, maxNm] = 'targetNm' in t ? [t.targetNm, t.targetNm] : [t.minNm, t.maxNm];
  const what = 'targetNm' in t ? `Target ${formatNm(minNm)} nm` : `Range ${formatNm(minNm)}–${formatNm(maxNm)} nm`;
  const reasons: FeasibilityReason[] = [];

  if (!(minNm > 0) || !(maxNm > 0)) {
    reasons.push({ code: 'invalid_wavelengths', message: `${what} must be a positive wavelength` });
    return { feasible: false, reasons, derived: {}, onTable: [] };
  }
  if (minNm > maxNm) {
    reasons.push({ code: 'inverted_range', message: `${what} is inverted: the lower end must come first` });
    return { feasible: false, reasons, derived: {}, onTable: [] };
  }
  if (minNm < config.minNm || maxNm > config.maxNm) {
    const verb = 'targetNm' in t ? 'is outside' : 'extends outside';
    reasons.push({ code: 'out_of_range', message: `${what} ${verb} ${range}` });
  }

  let onTable: TableBand[] = [];
  try {
    onTable = tableBands({ outputKind: config.outputKind, minNm, maxNm, pumpNm: config.pumpNm ?? DEFAULT_PUMP_NM });
  } catch (error) {
    if (!isEngineError(error)) throw error;
    reasons.push({ code: 'unreachable', message: `${what} cannot be generated: ${error.message}` });
  }
  const derived: FeasibilityResult['derived'] = {};
  for (const band of onTable) derived[band.role] = { minNm: band.minNm, maxNm: band.maxNm };
  return { feasible: reasons.length === 0, reasons, derived, onTable };
}
