import { z } from 'zod';

export const outputKinds = ['fundamental', 'shg', 'opa_signal', 'opa_idler', 'dfg'] as const;
export const outputKindSchema = z.enum(outputKinds);
export type OutputKind = z.infer<typeof outputKindSchema>;

export const rateClasses = ['standard', 'dfg'] as const;
export const rateClassSchema = z.enum(rateClasses);
export type RateClass = z.infer<typeof rateClassSchema>;

export const instrumentKinds = ['source', 'bench'] as const;

export const facilitySchema = z.object({
  name: z.string(),
  timeZone: z.string(),
  currency: z.string().length(3),
});
export type Facility = z.infer<typeof facilitySchema>;

export const eyewearBandSchema = z
  .object({ minNm: z.number().positive(), maxNm: z.number().positive(), od: z.number().min(0).max(12) })
  .refine((b) => b.minNm < b.maxNm, { message: 'minNm must be below maxNm' });
export type EyewearBand = z.infer<typeof eyewearBandSchema>;
