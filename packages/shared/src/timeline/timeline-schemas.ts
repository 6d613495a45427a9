import { z } from 'zod';
import { changeoverModelSchema, sourceStateSchema } from '../changeover/changeover-model';
import { isoInstantSchema } from '../time/iso-schemas';

/** An instant: a Date, or ISO 8601 text that carries its offset (times without a zone are refused). */
export const instantInputSchema = z
  .union([z.date(), isoInstantSchema()])
  .transform((v) => (v instanceof Date ? v : new Date(v)));
export type InstantInput = z.input<typeof instantInputSchema>;

export const blockKinds = ['booking', 'maintenance'] as const;

export const timelineBlockInputSchema = z.object({
  id: z.string().min(1),
  kind: z.enum(blockKinds),
  start: instantInputSchema,
  end: instantInputSchema,
  state: sourceStateSchema.nullish(),
});
export type TimelineBlockInput = z.input<typeof timelineBlockInputSchema>;
export type TimelineBlock = z.output<typeof timelineBlockInputSchema>;

export const timelineCandidateInputSchema = z.object({
  /** When moving an existing booking, its own block is left out of the checks. */
  id: z.string().min(1).optional(),
  start: instantInputSchema,
  end: instantInputSchema,
  state: sourceStateSchema,
});
export type TimelineCandidateInput = z.input<typeof timelineCandidateInputSchema>;

export const timelineCheckInputSchema = z.object({
  blocks: z.array(timelineBlockInputSchema),
  candidate: timelineCandidateInputSchema,
  model: changeoverModelSchema,
  horizonEnd: instantInputSchema.optional(),
});

export const alternativeSlotsInputSchema = timelineCheckInputSchema.extend({
  count: z.number().int().min(1).max(100),
  horizonEnd: instantInputSchema,
  stepMinutes: z.number().positive().max(24 * 60).default(60),
});
