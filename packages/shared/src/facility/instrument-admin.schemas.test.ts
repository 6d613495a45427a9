import { describe, expect, it } from 'vitest';
import { changeoverPairsInputSchema, configurationValuesSchema, instrumentInputSchema } from './instrument-admin.schemas';

const shg = { key: 'shg', name: 'SHG', outputKind: 'shg', minNm: 390, maxNm: 410, defaultNm: 400, rateClass: 'standard', requiredOdBands: [{ minNm: 380, maxNm: 900, od: 6 }] };
const paths = (r: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) => r.error?.issues.map((i) => i.path.join('.')) ?? [];

describe('administration schemas', () => {
  it('when a configuration is in order, then it parses with the defaults filled in', () => {
    expect(configurationValuesSchema.parse(shg)).toMatchObject({ retuneMinutesPerNm: null, active: true });
  });

  it('when the range runs backwards or the default lies outside it, then the field is named', () => {
    expect(paths(configurationValuesSchema.safeParse({ ...shg, minNm: 410, maxNm: 390 }))).toEqual(['maxNm']);
    expect(paths(configurationValuesSchema.safeParse({ ...shg, defaultNm: 420 }))).toEqual(['defaultNm']);
  });

  it('when an OD band is inverted, above OD 12 or missing, then it is refused', () => {
    expect(configurationValuesSchema.safeParse({ ...shg, requiredOdBands: [{ minNm: 900, maxNm: 380, od: 6 }] }).success).toBe(false);
    expect(configurationValuesSchema.safeParse({ ...shg, requiredOdBands: [{ minNm: 380, maxNm: 900, od: 13 }] }).success).toBe(false);
    expect(configurationValuesSchema.safeParse({ ...shg, requiredOdBands: [] }).success).toBe(false);
  });

  it('when changeover minutes are fractional, a pair joins a configuration to itself or repeats, then it is refused', () => {
    const a = '00000000-0000-4000-8000-000000000001';
    const b = '00000000-0000-4000-8000-000000000002';
    expect(changeoverPairsInputSchema.safeParse({ pairs: [{ fromConfigurationId: a, toConfigurationId: b, baseMinutes: 12.5 }] }).success).toBe(false);
    expect(changeoverPairsInputSchema.safeParse({ pairs: [{ fromConfigurationId: a, toConfigurationId: a, baseMinutes: 5 }] }).success).toBe(false);
    expect(changeoverPairsInputSchema.safeParse({ pairs: [0, 1].map(() => ({ fromConfigurationId: a, toConfigurationId: b, baseMinutes: 5 })) }).success).toBe(false);
    expect(changeoverPairsInputSchema.safeParse({ pairs: [{ fromConfigurationId: a, toConfigurationId: b, baseMinutes: 5 }, { fromConfigurationId: b, toConfigurationId: a, baseMinutes: 7 }] }).success).toBe(true);
  });

  it('when an instrument has a negative warm-up or a bad kind, then it is refused; a bench needs no pump', () => {
    const bench = { name: 'Autocorrelator', kind: 'bench', retuneMinutesPerNm: 0, warmupAfterMaintenanceMinutes: 0, pulseCheckMinutes: 0, defaultChangeoverMinutes: 0 };
    expect(instrumentInputSchema.parse(bench)).toMatchObject({ pumpNm: null, active: true });
    expect(paths(instrumentInputSchema.safeParse({ ...bench, warmupAfterMaintenanceMinutes: -5 }))).toEqual(['warmupAfterMaintenanceMinutes']);
    expect(paths(instrumentInputSchema.safeParse({ ...bench, kind: 'laser' }))).toEqual(['kind']);
  });
});
