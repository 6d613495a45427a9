import { z } from 'zod';
import { SPEED_OF_LIGHT_M_PER_S } from '../units/spectral-units';
import { parseEngineInput } from '../units/engine-error';
import { pulseShapes, type PulseShape } from './autocorrelation';

/**
 * Transform-limited Δτ·Δν (FWHM) (Diels & Rudolph; Kärtner, Ultrafast Optics):
 * Gaussian 2 ln2/π ≈ 0.441, sech² 4 ln²(1+√2)/π² ≈ 0.315.
 */
export const transformLimitedProducts: Record<PulseShape, number> = {
  gaussian: (2 * Math.LN2) / Math.PI,
  sech2: (4 * Math.log(1 + Math.SQRT2) ** 2) / Math.PI ** 2,
};

const spectrumSchema = z.object({
  centreNm: z.number().positive(),
  spectralFwhmNm: z.number().positive(),
  shape: z.enum(pulseShapes),
});
export const timeBandwidthInputSchema = spectrumSchema.extend({ pulseFwhmFs: z.number().positive() });
export type TimeBandwidthInput = z.input<typeof timeBandwidthInputSchema>;

export interface TimeBandwidthResult {
  spectralFwhmHz: number;
  timeBandwidthProduct: number;
  transformLimitedProduct: number;
  transformLimitedFs: number;
  /** Measured duration ÷ transform-limited duration; 1 is a transform-limited pulse. */
  timesTransformLimit: number;
}

/** Δν = c·Δλ/λ², valid for Δλ ≪ λ. */
export function spectralFwhmHz(centreNm: number, spectralFwhmNm: number): number {
  return (SPEED_OF_LIGHT_M_PER_S * spectralFwhmNm * 1e-9) / (centreNm * 1e-9) ** 2;
}

export function transformLimitedDurationFs(centreNm: number, spectralFwhmNm: number, shape: PulseShape): number {
  const input = parseEngineInput(spectrumSchema, { centreNm, spectralFwhmNm, shape });
  return (transformLimitedProducts[input.shape] / spectralFwhmHz(input.centreNm, input.spectralFwhmNm)) * 1e15;
}

export function timeBandwidth(input: TimeBandwidthInput): TimeBandwidthResult {
  const v = parseEngineInput(timeBandwidthInputSchema, input);
  const bandwidth = spectralFwhmHz(v.centreNm, v.spectralFwhmNm);
  const transformLimitedFs = (transformLimitedProducts[v.shape] / bandwidth) * 1e15;
  return {
    spectralFwhmHz: bandwidth,
    timeBandwidthProduct: v.pulseFwhmFs * 1e-15 * bandwidth,
    transformLimitedProduct: transformLimitedProducts[v.shape],
    transformLimitedFs,
    timesTransformLimit: v.pulseFwhmFs / transformLimitedFs,
  };
}
