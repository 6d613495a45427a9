import { z } from 'zod';
import { eyewearBandSchema, type EyewearBand } from '../facility/facility.schemas';
import { parseEngineInput } from '../units/engine-error';

const coverageTargetSchema = z.union([
  z.number().positive(),
  z.object({ nm: z.number().positive() }),
  z
    .object({ minNm: z.number().positive(), maxNm: z.number().positive() })
    .refine((b) => b.minNm <= b.maxNm, { message: 'minNm must not exceed maxNm' }),
]);
export type CoverageTarget = z.input<typeof coverageTargetSchema>;

export const eyewearCoveringInputSchema = z.object({
  wavelengths: z.array(coverageTargetSchema),
  eyewearItems: z.array(z.object({ bands: z.array(eyewearBandSchema) })),
  requiredOd: z.number().min(0),
});

function asInterval(target: z.output<typeof coverageTargetSchema>): [number, number] {
  if (typeof target === 'number') return [target, target];
  if ('nm' in target) return [target.nm, target.nm];
  return [target.minNm, target.maxNm];
}

/** Merges the qualifying bands so that two adjoining bands can cover one interval together. */
function mergedBands(bands: EyewearBand[], requiredOd: number): Array<[number, number]> {
  const sorted = bands
    .filter((b) => b.od >= requiredOd)
    .map((b): [number, number] => [b.minNm, b.maxNm])
    .sort((a, b) => a[0] - b[0]);
  const merged: Array<[number, number]> = [];
  for (const band of sorted) {
    const last = merged[merged.length - 1];
    if (last && band[0] <= last[1]) last[1] = Math.max(last[1], band[1]);
    else merged.push([band[0], band[1]]);
  }
  return merged;
}

/**
 * The eyewear items rated at OD ≥ requiredOd over every wavelength and band given.
 * An empty result means no item on the shelf covers this table.
 */
export function eyewearCovering<T extends { bands: EyewearBand[] }>(
  wavelengths: CoverageTarget[],
  eyewearItems: T[],
  requiredOd: number,
): T[] {
  const input = parseEngineInput(eyewearCoveringInputSchema, { wavelengths, eyewearItems, requiredOd });
  const intervals = input.wavelengths.map(asInterval);
  return eyewearItems.filter((item) => {
    const merged = mergedBands(item.bands, input.requiredOd);
    return intervals.every(([lo, hi]) => merged.some(([a, b]) => a <= lo && hi <= b));
  });
}
