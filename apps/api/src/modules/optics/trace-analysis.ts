import { analysePoints, assertPhysicalPulse, opticalCycleFs, readAutocorrelationCsvInSteps, timeBandwidth, type AutocorrelationResult, type PulseShape } from '@femtoslot/shared';
import type { AppContext } from '../../lib/context';

/** Lets queued I/O (other requests, database replies) run between steps of a long computation. */
export const yieldToEventLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

/** Reads and analyses an uploaded CSV trace in steps, so one large file does not hold up the process. */
export async function analyseTraceText(text: string, shape: PulseShape): Promise<AutocorrelationResult> {
  const trace = await readAutocorrelationCsvInSteps(text, yieldToEventLoop);
  await yieldToEventLoop();
  return analysePoints(trace.points, shape);
}

export interface PulseContext {
  /** Centre wavelength of the pulse; when unknown, the shortest wavelength the facility configures (the most lenient cycle). */
  centreNm?: number | null;
  spectralFwhmNm?: number | null;
}

/** The shortest wavelength any active configuration puts out: no pulse on the table is shorter than one cycle of it. */
export async function shortestConfiguredNm(ctx: AppContext): Promise<number> {
  const { configurations } = await ctx.reference.get(ctx.db.manager);
  let shortest = Infinity;
  for (const c of configurations.values()) if (c.active) shortest = Math.min(shortest, c.minNm);
  // No configuration at all: 200 nm, below anything the facility's outputs reach (vacuum-UV is not a beam-time output).
  return Number.isFinite(shortest) ? shortest : 200;
}

/**
 * Refuses a pulse FWHM no real pulse can have (422 below_optical_cycle / below_transform_limit) and returns the
 * figures it was checked against.
 */
export async function checkPulse(ctx: AppContext, pulseFwhmFs: number, shape: PulseShape, pulse: PulseContext) {
  const centreNm = pulse.centreNm ?? (await shortestConfiguredNm(ctx));
  assertPhysicalPulse({ pulseFwhmFs, centreNm, spectralFwhmNm: pulse.spectralFwhmNm ?? null, shape });
  const limits = pulse.spectralFwhmNm ? timeBandwidth({ pulseFwhmFs, centreNm, spectralFwhmNm: pulse.spectralFwhmNm, shape }) : null;
  return { centreNm, opticalCycleFs: opticalCycleFs(centreNm), transformLimitedFs: limits?.transformLimitedFs ?? null, timeBandwidthProduct: limits?.timeBandwidthProduct ?? null };
}
