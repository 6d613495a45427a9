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

const rangeSchema = z
  .object({ minNm: z.number().positive(), maxNm: z.number().positive() })
  .refine((r) => r.minNm <= r.maxNm, { message: 'minNm must not exceed maxNm', path: ['maxNm'] });

export const configurationRangeInputSchema = z
  .object({
    outputKind: outputKindSchema,
    minNm: z.number().positive(),
    maxNm: z.number().positive(),
    pumpNm: z.number().positive().optional(),
    name: z.string().optional(),
    /** The instrument's own OPA signal and idler tuning ranges; a DFG stage mixes those two, so both must reach. */
    opa: z.object({ signal: rangeSchema.optional(), idler: rangeSchema.optional() }).optional(),
  })
  .refine((c) => c.minNm <= c.maxNm, { message: 'tuning range minNm must not exceed maxNm', path: ['maxNm'] });
export type ConfigurationRangeInput = z.input<typeof configurationRangeInputSchema>;

export const feasibilityReasonCodes = ['invalid_wavelengths', 'inverted_range', 'out_of_range', 'unreachable', 'opa_out_of_range'] as const;
export type FeasibilityReasonCode = (typeof feasibilityReasonCodes)[number];

export interface FeasibilityReason {
  code: FeasibilityReasonCode;
  message: string;
  /** For opa_out_of_range: the OPA output, the wavelengths it would need and its range. */
  details?: { role: 'signal' | 'idler'; derivedMinNm: number; derivedMaxNm: number; rangeMinNm: number; rangeMaxNm: number };
}

export interface OpaRanges {
  signal?: { minNm: number; maxNm: number };
  idler?: { minNm: number; maxNm: number };
}

/** The OPA ranges of one instrument from its active signal and idler configurations (the widest, if several). */
export function opaRangesOf(configurations: Iterable<{ outputKind: string; minNm: number; maxNm: number; active?: boolean }>): OpaRanges {
  const ranges: OpaRanges = {};
  for (const c of configurations) {
    if (c.active === false) continue;
    const role = c.outputKind === 'opa_signal' ? 'signal' : c.outputKind === 'opa_idler' ? 'idler' : null;
    if (!role) continue;
    const seen = ranges[role];
    ranges[role] = seen ? { minNm: Math.min(seen.minNm, c.minNm), maxNm: Math.max(seen.maxNm, c.maxNm) } : { minNm: c.minNm, maxNm: c.maxNm };
  }
  return ranges;
}

/**
 * DFG mixes the OPA's signal and idler: with 1/λDFG = 1/λs − 1/λi and 1/λp = 1/λs + 1/λi (energy conservation,
 * Boyd, Nonlinear Optics) a DFG target fixes both, and each must lie in the OPA output's own range.
 */
function opaReasons(what: string, onTable: TableBand[], opa: OpaRanges | undefined): FeasibilityReason[] {
  const reasons: FeasibilityReason[] = [];
  for (const role of ['signal', 'idler'] as const) {
    const range = opa?.[role];
    const band = onTable.find((b) => b.role === role);
    if (!range || !band || (band.minNm >= range.minNm && band.maxNm <= range.maxNm)) continue;
    const needs = band.minNm === band.maxNm ? `${formatNm(band.minNm)} nm` : `${formatNm(band.minNm)}–${formatNm(band.maxNm)} nm`;
    reasons.push({
      code: 'opa_out_of_range',
      message: `${what} needs the OPA ${role} at ${needs}, outside its range ${formatNm(range.minNm)}–${formatNm(range.maxNm)} nm`,
      details: { role, derivedMinNm: band.minNm, derivedMaxNm: band.maxNm, rangeMinNm: range.minNm, rangeMaxNm: range.maxNm },
    });
  }
  return reasons;
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
  if (config.outputKind === 'dfg') reasons.push(...opaReasons(`DFG ${what.replace(/^(Target|Range) /, '')}`, onTable, config.opa));
  const derived: FeasibilityResult['derived'] = {};
  for (const band of onTable) derived[band.role] = { minNm: band.minNm, maxNm: band.maxNm };
  return { feasible: reasons.length === 0, reasons, derived, onTable };
}
