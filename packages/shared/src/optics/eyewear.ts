import { z } from 'zod';
import { eyewearBandSchema, type EyewearBand, type RequiredOdBand } from '../facility/facility.schemas';
import { parseEngineInput } from '../units/engine-error';
import { tableBands, type TableBandsInput } from './table-wavelengths';

const coverageTargetSchema = z.union([
  z.number().positive(),
  z.object({ nm: z.number().positive() }),
  z
    .object({ minNm: z.number().positive(), maxNm: z.number().positive() })
    .refine((b) => b.minNm <= b.maxNm, { message: 'minNm must not exceed maxNm' }),
]);
export type CoverageTarget = z.input<typeof coverageTargetSchema>;

const bandListSchema = z.array(eyewearBandSchema);
export const eyewearCoveringInputSchema = z.object({
  wavelengths: z.array(coverageTargetSchema),
  eyewearItems: z.array(z.object({ bands: bandListSchema })),
  requiredOdBands: bandListSchema,
});

/** One stretch of wavelengths with one required OD (the maximum of every band that covers it). */
export interface OdSegment {
  minNm: number;
  maxNm: number;
  /** null: no band set by the laser-safety officer covers this stretch. */
  od: number | null;
}

function asInterval(target: z.output<typeof coverageTargetSchema>): [number, number] {
  if (typeof target === 'number') return [target, target];
  if ('nm' in target) return [target.nm, target.nm];
  return [target.minNm, target.maxNm];
}

/** Bands are closed intervals: at a shared edge both apply, so the higher OD is required there. */
function maxOdOver(bands: readonly EyewearBand[], lo: number, hi: number): number | null {
  let od: number | null = null;
  for (const b of bands) if (b.minNm <= lo && hi <= b.maxNm && (od === null || b.od > od)) od = b.od;
  return od;
}

/**
 * The required OD across [minNm, maxNm]: split at every band edge inside it; each edge point and each stretch between
 * edges takes the maximum OD of the bands covering it. Neighbours with the same OD are joined.
 */
export function requiredOdProfile(interval: { minNm: number; maxNm: number }, bands: readonly RequiredOdBand[]): OdSegment[] {
  const { minNm, maxNm } = interval;
  const edges = [...new Set([minNm, maxNm, ...bands.flatMap((b) => [b.minNm, b.maxNm]).filter((e) => e > minNm && e < maxNm)])].sort((a, b) => a - b);
  const pieces: OdSegment[] = [];
  edges.forEach((edge, i) => {
    pieces.push({ minNm: edge, maxNm: edge, od: maxOdOver(bands, edge, edge) });
    const next = edges[i + 1];
    if (next !== undefined) pieces.push({ minNm: edge, maxNm: next, od: maxOdOver(bands, edge, next) });
  });
  // Joins for display and fewer checks: a stretch's edges carry at least its OD, so an edge point that asks no more
  // than the stretch beside it adds nothing.
  const joined: OdSegment[] = [];
  const atMost = (a: number | null, b: number | null) => a !== null && b !== null && a <= b;
  for (const p of pieces) {
    const last = joined[joined.length - 1];
    if (!last) joined.push({ ...p });
    else if (last.od === p.od) last.maxNm = Math.max(last.maxNm, p.maxNm);
    else if (p.minNm === p.maxNm && atMost(p.od, last.od)) continue;
    else if (last.minNm === last.maxNm && atMost(last.od, p.od)) Object.assign(last, { maxNm: p.maxNm, od: p.od });
    else joined.push({ ...p });
  }
  return joined;
}

/** Whether the item's rating (the highest OD of its bands at each wavelength) reaches `od` over [lo, hi]. */
function rated(bands: readonly EyewearBand[], lo: number, hi: number, od: number): boolean {
  const merged: Array<[number, number]> = [];
  for (const [a, b] of bands.filter((x) => x.od >= od).map((x): [number, number] => [x.minNm, x.maxNm]).sort((x, y) => x[0] - y[0])) {
    const last = merged[merged.length - 1];
    if (last && a <= last[1]) last[1] = Math.max(last[1], b);
    else merged.push([a, b]);
  }
  return merged.some(([a, b]) => a <= lo && hi <= b);
}

function coversProfile(item: { bands: readonly EyewearBand[] }, profile: OdSegment[]): boolean {
  return profile.every((s) => s.od !== null && rated(item.bands, s.minNm, s.maxNm, s.od));
}

export interface WavelengthCoverage<T> {
  role?: string;
  minNm: number;
  maxNm: number;
  /** The highest OD required anywhere in this band; null when part of it has no required OD set. */
  requiredOd: number | null;
  profile: OdSegment[];
  /** Stretches with no required OD set: no eyewear can be judged there. */
  unsetNm: { minNm: number; maxNm: number }[];
  covering: T[];
}

/**
 * Per wavelength on the table, the OD required there and the eyewear rated for it; and the items that cover every
 * wavelength. The laser-safety officer sets the bands; this only compares ratings with them.
 */
export function eyewearCoverage<T extends { bands: EyewearBand[] }, W extends { minNm: number; maxNm: number; role?: string }>(
  table: W[],
  requiredOdBands: RequiredOdBand[],
  eyewearItems: T[],
): { wavelengths: WavelengthCoverage<T>[]; covering: T[] } {
  parseEngineInput(eyewearCoveringInputSchema, { wavelengths: table.map((w) => ({ minNm: w.minNm, maxNm: w.maxNm })), eyewearItems, requiredOdBands });
  const wavelengths = table.map((w): WavelengthCoverage<T> => {
    const profile = requiredOdProfile(w, requiredOdBands);
    const unset = profile.filter((s) => s.od === null);
    return {
      ...(w.role ? { role: w.role } : {}), minNm: w.minNm, maxNm: w.maxNm, profile,
      requiredOd: unset.length ? null : Math.max(...profile.map((s) => s.od!)),
      unsetNm: unset.map(({ minNm, maxNm }) => ({ minNm, maxNm })),
      covering: eyewearItems.filter((item) => coversProfile(item, profile)),
    };
  });
  return { wavelengths, covering: eyewearItems.filter((item) => wavelengths.every((w) => w.covering.includes(item))) };
}

/** The eyewear items whose rating reaches the required OD at every wavelength and band given. */
export function eyewearCovering<T extends { bands: EyewearBand[] }>(wavelengths: CoverageTarget[], eyewearItems: T[], requiredOdBands: RequiredOdBand[]): T[] {
  const input = parseEngineInput(eyewearCoveringInputSchema, { wavelengths, eyewearItems, requiredOdBands });
  const table = input.wavelengths.map(asInterval).map(([minNm, maxNm]) => ({ minNm, maxNm }));
  return eyewearCoverage(table, requiredOdBands, eyewearItems).covering;
}

/**
 * Wavelengths a configuration can put on the table over its whole tuning range (pump residual and partners
 * included) that no required-OD band covers: the laser-safety officer must set an OD for every one of them.
 */
export function requiredOdGaps(configuration: TableBandsInput, requiredOdBands: RequiredOdBand[]): { minNm: number; maxNm: number }[] {
  return tableBands(configuration).flatMap((band) => requiredOdProfile(band, requiredOdBands).filter((s) => s.od === null).map(({ minNm, maxNm }) => ({ minNm, maxNm })));
}
