import { z } from 'zod';
import { EngineError, parseEngineInput } from '../units/engine-error';
import { SPEED_OF_LIGHT_M_PER_S } from '../units/spectral-units';
import { pulseShapes } from './autocorrelation';
import { transformLimitedDurationFs, transformLimitedProducts } from './time-bandwidth';

/** One optical cycle, T = λ/c, in fs (c exact, CODATA 2018 / SI 2019). */
export function opticalCycleFs(centreNm: number): number {
  return ((centreNm * 1e-9) / SPEED_OF_LIGHT_M_PER_S) * 1e15;
}

export const pulsePlausibilityInputSchema = z.object({
  pulseFwhmFs: z.number().positive().finite(),
  centreNm: z.number().positive().finite(),
  spectralFwhmNm: z.number().positive().finite().nullable().optional(),
  shape: z.enum(pulseShapes),
});
export type PulsePlausibilityInput = z.input<typeof pulsePlausibilityInputSchema>;

const fmt = (x: number) => String(Number(x < 10 ? x.toFixed(2) : x.toFixed(1)));

/**
 * Refuses a pulse duration no real pulse can have: shorter than one optical cycle at its centre wavelength
 * (an intensity FWHM below λ/c is what a fringe-resolved, interferometric trace gives when read as an intensity
 * autocorrelation), or, when the spectral FWHM is known, shorter than the transform limit for the assumed shape
 * (Δτ·Δν ≥ 0.441 Gaussian, 0.315 sech²; Diels & Rudolph, Ultrashort Laser Pulse Phenomena).
 */
export function assertPhysicalPulse(input: PulsePlausibilityInput): void {
  const v = parseEngineInput(pulsePlausibilityInputSchema, input);
  const cycle = opticalCycleFs(v.centreNm);
  if (v.pulseFwhmFs < cycle) {
    throw new EngineError(
      'below_optical_cycle',
      `A pulse of ${fmt(v.pulseFwhmFs)} fs is shorter than one optical cycle at ${fmt(v.centreNm)} nm (${fmt(cycle)} fs). ` +
        'The trace looks fringe-resolved (interferometric); record an intensity (background-free) autocorrelation or average over the fringes.',
      { pulseFwhmFs: v.pulseFwhmFs, centreNm: v.centreNm, opticalCycleFs: cycle },
    );
  }
  if (v.spectralFwhmNm) {
    const limit = transformLimitedDurationFs(v.centreNm, v.spectralFwhmNm, v.shape);
    if (v.pulseFwhmFs < limit) {
      const product = transformLimitedProducts[v.shape];
      throw new EngineError(
        'below_transform_limit',
        `A ${v.shape === 'sech2' ? 'sech²' : 'Gaussian'} pulse with ${fmt(v.spectralFwhmNm)} nm of bandwidth at ${fmt(v.centreNm)} nm lasts at least ${fmt(limit)} fs ` +
          `(time-bandwidth product ${product.toFixed(3)}); ${fmt(v.pulseFwhmFs)} fs is below that limit. Check the pulse shape, the bandwidth or the trace.`,
        { pulseFwhmFs: v.pulseFwhmFs, centreNm: v.centreNm, spectralFwhmNm: v.spectralFwhmNm, shape: v.shape, transformLimitedFs: limit, timeBandwidthProduct: product },
      );
    }
  }
}
