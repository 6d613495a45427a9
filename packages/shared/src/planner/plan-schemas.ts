import { z } from 'zod';
import { changeoverModelSchema, sourceStateSchema } from '../changeover/changeover-model';
import { instantInputSchema, timelineBlockInputSchema } from '../timeline/timeline-schemas';

export const planRequestInputSchema = z.object({
  id: z.string().min(1),
  durationMinutes: z.number().positive().max(24 * 60),
  state: sourceStateSchema,
  earliestStart: instantInputSchema.optional(),
  latestEnd: instantInputSchema.optional(),
  /** Where the booking sits now; given for every request, the plan moves nothing unless that saves changeover. */
  currentStart: instantInputSchema.optional(),
  submittedAt: instantInputSchema,
});
export type PlanRequestInput = z.input<typeof planRequestInputSchema>;

export const planDayInputSchema = z
  .object({
    dayStart: instantInputSchema,
    dayEnd: instantInputSchema,
    fixedBlocks: z.array(timelineBlockInputSchema).default([]),
    requests: z.array(planRequestInputSchema).max(200),
    model: changeoverModelSchema,
    initialState: sourceStateSchema.nullish(),
  })
  .refine((v) => v.dayEnd.getTime() > v.dayStart.getTime(), { message: 'dayEnd must be after dayStart', path: ['dayEnd'] })
  .refine((v) => new Set(v.requests.map((r) => r.id)).size === v.requests.length, {
    message: 'request ids must be unique',
    path: ['requests'],
  });
export type PlanDayInput = z.input<typeof planDayInputSchema>;
export type ParsedPlanDayInput = z.output<typeof planDayInputSchema>;

export const planDayOptionsSchema = z.object({
  /** Seed of the heuristic's random number generator; the same seed gives the same plan. */
  seed: z.number().int().default(1),
  /** Largest request count solved exactly; the DP grows as 2^n. */
  exactLimit: z.number().int().min(0).max(14).default(10),
  /** Rounds of perturbation + local search in the heuristic. */
  searchRounds: z.number().int().min(0).max(10_000).optional(),
});
export type PlanDayOptions = z.input<typeof planDayOptionsSchema>;

export const unplacedReasons = ['window_too_short', 'no_room', 'crowded_out'] as const;
export type UnplacedReason = (typeof unplacedReasons)[number];

export interface PlannedBooking {
  id: string;
  start: Date;
  end: Date;
  changeoverBeforeMinutes: number;
}

export interface DayPlan {
  order: PlannedBooking[];
  unplaced: Array<{ id: string; reason: UnplacedReason; message: string }>;
  /** Every changeover of the day's timeline, fixed blocks included. */
  changeoverMinutes: number;
  /**
   * The current timeline's changeover minus this plan's when every request has a current start, else first-come's
   * minus this plan's; negative when the plan fits more requests in.
   */
  savedMinutes: number;
  /** Changeover of the day as it stands (null unless every request has a current start). */
  currentChangeoverMinutes: number | null;
  firstCome: { placedCount: number; changeoverMinutes: number };
  provenOptimal: boolean;
  method: 'exact' | 'heuristic';
}
