import { z } from 'zod';
import { instrumentKinds, outputKindSchema, rateClassSchema, requiredOdBandsSchema } from './facility.schemas';

const uuid = z.uuid({ message: 'Must be an id' });
const nm = z.number().positive('Wavelengths are positive').max(100_000, 'Wavelength is implausibly long');
const minutes = z.number().int('Whole minutes').min(0).max(24 * 60);
const perNm = z.number().min(0).max(60, 'At most 60 minutes per nm');

/** An instrument as staff create or edit it: a tunable source or a measurement bench. */
export const instrumentFieldsSchema = z.object({
  name: z.string().trim().min(2, 'Give the instrument a name').max(120),
  kind: z.enum(instrumentKinds),
  description: z.string().trim().max(500).default(''),
  pumpNm: nm.nullable().default(null),
  retuneMinutesPerNm: perNm,
  warmupAfterMaintenanceMinutes: minutes,
  pulseCheckMinutes: minutes,
  defaultChangeoverMinutes: minutes,
  active: z.boolean().default(true),
});
export const instrumentInputSchema = instrumentFieldsSchema;
export type InstrumentInput = z.input<typeof instrumentInputSchema>;
export const instrumentUpdateInputSchema = instrumentFieldsSchema.partial().strict();
export type InstrumentUpdateInput = z.infer<typeof instrumentUpdateInputSchema>;

const configurationFields = z.object({
  key: z.string().trim().regex(/^[a-z][a-z0-9_]{1,39}$/, 'Lower-case letters, digits and _; start with a letter'),
  name: z.string().trim().min(2, 'Give the configuration a name').max(120),
  outputKind: outputKindSchema,
  minNm: nm,
  maxNm: nm,
  defaultNm: nm,
  rateClass: rateClassSchema,
  requiredOdBands: requiredOdBandsSchema,
  /** null: the instrument's minutes per nm apply. */
  retuneMinutesPerNm: perNm.nullable().default(null),
  active: z.boolean().default(true),
});

type ConfigurationShape = { minNm: number; maxNm: number; defaultNm: number };
function configurationRules(v: ConfigurationShape, ctx: z.RefinementCtx) {
  if (!(v.minNm < v.maxNm)) ctx.addIssue({ code: 'custom', path: ['maxNm'], message: 'The tuning range must run from short to long' });
  else if (v.defaultNm < v.minNm || v.defaultNm > v.maxNm) ctx.addIssue({ code: 'custom', path: ['defaultNm'], message: 'The default wavelength must lie in the tuning range' });
}

/** A configuration in full: range order and default-in-range are checked here; band coverage against the table in the engine. */
export const configurationValuesSchema = configurationFields.superRefine(configurationRules);
export type ConfigurationValues = z.output<typeof configurationValuesSchema>;
export const configurationInputSchema = configurationFields.extend({ instrumentId: uuid }).superRefine(configurationRules);
export type ConfigurationInput = z.input<typeof configurationInputSchema>;
/** A partial edit; the merged result is checked with configurationValuesSchema. */
export const configurationUpdateInputSchema = configurationFields.partial().strict();
export type ConfigurationUpdateInput = z.infer<typeof configurationUpdateInputSchema>;

/** The whole from→to base-minutes matrix of one instrument; a pair listed one way applies both ways unless both are given. */
export const changeoverPairsInputSchema = z
  .object({
    pairs: z
      .array(z.object({ fromConfigurationId: uuid, toConfigurationId: uuid, baseMinutes: minutes }))
      .max(400),
  })
  .superRefine((v, ctx) => {
    const seen = new Set<string>();
    v.pairs.forEach((p, i) => {
      if (p.fromConfigurationId === p.toConfigurationId) ctx.addIssue({ code: 'custom', path: ['pairs', i, 'toConfigurationId'], message: 'A pair joins two different configurations; retuning within one uses minutes per nm' });
      const k = `${p.fromConfigurationId}>${p.toConfigurationId}`;
      if (seen.has(k)) ctx.addIssue({ code: 'custom', path: ['pairs', i], message: 'Each from→to pair may be listed once' });
      seen.add(k);
    });
  });
export type ChangeoverPairsInput = z.infer<typeof changeoverPairsInputSchema>;

/** A future booking a proposed change would affect, and why. */
export interface AffectedBookingDto {
  bookingId: string;
  startsAt: string;
  endsAt: string;
  status: string;
  configurationName: string;
  targetMinNm: number;
  targetMaxNm: number;
  problems: { code: 'changeover_gap' | 'overlap' | 'out_of_range' | 'no_eyewear' | 'configuration_inactive' | 'instrument_inactive'; message: string }[];
  /** false when the booking already had these problems before the change. */
  newlyAffected: boolean;
}

export interface InstrumentAdminDto {
  id: string;
  name: string;
  kind: (typeof instrumentKinds)[number];
  description: string;
  pumpNm: number | null;
  retuneMinutesPerNm: number;
  warmupAfterMaintenanceMinutes: number;
  pulseCheckMinutes: number;
  defaultChangeoverMinutes: number;
  active: boolean;
  configurations: (ConfigurationValues & { id: string; instrumentId: string })[];
  changeoverPairs: { fromConfigurationId: string; toConfigurationId: string; baseMinutes: number }[];
}
