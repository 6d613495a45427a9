import { z } from 'zod';
import { parseEngineInput } from '../units/engine-error';

const minutes = z.number().int().min(0).max(24 * 60);

export const changeoverPairSchema = z
  .object({ from: z.string().min(1), to: z.string().min(1), baseMinutes: minutes })
  .refine((p) => p.from !== p.to, { message: 'a pair joins two different configurations; use retune minutes within one' });

export const changeoverModelSchema = z
  .object({
    /** A pair listed one way applies both ways unless the reverse is listed too. */
    pairs: z.array(changeoverPairSchema),
    retuneMinutesPerNm: z.number().min(0).max(60),
    /** Per-configuration override of retuneMinutesPerNm (a DFG crystal retunes over thousands of nm). */
    retuneMinutesPerNmByConfiguration: z.record(z.string(), z.number().min(0).max(60)).optional(),
    warmupAfterMaintenanceMinutes: minutes,
    pulseCheckMinutes: minutes.default(0),
    defaultBaseMinutes: minutes,
  })
  .refine(
    (m) => new Set(m.pairs.map((p) => `${p.from}\u0000${p.to}`)).size === m.pairs.length,
    { message: 'each from→to pair may be listed once', path: ['pairs'] },
  );
export type ChangeoverModel = z.output<typeof changeoverModelSchema>;
export type ChangeoverModelInput = z.input<typeof changeoverModelSchema>;

export const sourceStateSchema = z.object({ configurationKey: z.string().min(1), nm: z.number().positive() });
export type SourceState = z.infer<typeof sourceStateSchema>;

export const changeoverOptionsSchema = z.object({ afterMaintenance: z.boolean().default(false) });

export interface ChangeoverBreakdown {
  baseMinutes: number;
  retuneMinutes: number;
  warmupMinutes: number;
  pulseCheckMinutes: number;
}
export interface Changeover {
  totalMinutes: number;
  breakdown: ChangeoverBreakdown;
}

// Guards the round-up against float noise: 0.05 × 200 nm is 10.000000000000002, not 11 minutes.
const ROUNDING_SLACK = 1e-9;

export function parseChangeoverModel(model: ChangeoverModelInput): ChangeoverModel {
  return parseEngineInput(changeoverModelSchema, model);
}

export function baseMinutesBetween(model: ChangeoverModel, fromKey: string, toKey: string): number {
  const direct = model.pairs.find((p) => p.from === fromKey && p.to === toKey);
  if (direct) return direct.baseMinutes;
  const reverse = model.pairs.find((p) => p.from === toKey && p.to === fromKey);
  return reverse ? reverse.baseMinutes : model.defaultBaseMinutes;
}

/** Changeover on an already-parsed model; the planner calls this in its inner loop. */
export function changeoverFor(
  from: SourceState | null,
  to: SourceState,
  model: ChangeoverModel,
  afterMaintenance: boolean,
): Changeover {
  let baseMinutes = 0;
  let retuneMinutes = 0;
  if (from && from.configurationKey === to.configurationKey) {
    const perNm = model.retuneMinutesPerNmByConfiguration?.[to.configurationKey] ?? model.retuneMinutesPerNm;
    retuneMinutes = Math.ceil(Math.abs(to.nm - from.nm) * perNm - ROUNDING_SLACK);
  } else if (from) {
    baseMinutes = baseMinutesBetween(model, from.configurationKey, to.configurationKey);
  }
  const warmupMinutes = afterMaintenance ? model.warmupAfterMaintenanceMinutes : 0;
  // A pulse check follows anything that touched the beam; an unchanged state needs none.
  const touched = baseMinutes + retuneMinutes + warmupMinutes > 0;
  const pulseCheckMinutes = touched ? model.pulseCheckMinutes : 0;
  return {
    totalMinutes: baseMinutes + retuneMinutes + warmupMinutes + pulseCheckMinutes,
    breakdown: { baseMinutes, retuneMinutes, warmupMinutes, pulseCheckMinutes },
  };
}

/**
 * Minutes needed between a state (null: nothing known before, e.g. the first booking of the day)
 * and the next. Same configuration: retune |Δnm| × per-nm, rounded up; else the pair's base minutes.
 */
export function changeoverMinutes(
  fromState: SourceState | null,
  toState: SourceState,
  model: ChangeoverModelInput,
  options: { afterMaintenance?: boolean } = {},
): Changeover {
  const from = fromState === null ? null : parseEngineInput(sourceStateSchema, fromState);
  const to = parseEngineInput(sourceStateSchema, toState);
  const { afterMaintenance } = parseEngineInput(changeoverOptionsSchema, options);
  return changeoverFor(from, to, parseChangeoverModel(model), afterMaintenance);
}
