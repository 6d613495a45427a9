import { useMutation } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';

export interface DayPlanProposal {
  provenOptimal: boolean;
  method: 'exact' | 'heuristic';
  changeoverMinutes: number;
  /** against the day as it stands */
  savedMinutes: number;
  currentChangeoverMinutes: number | null;
  firstComeChangeoverMinutes: number;
  order: { bookingId: string; startsAt: string; endsAt: string; changeoverBeforeMinutes: number }[];
  unplaced: { bookingId: string; reason: string }[];
}

export interface ProposeDayPlanInput {
  instrumentId: string;
  /** YYYY-MM-DD in the facility zone */
  date: string;
  flexMinutes?: number;
}

/** A proposal writes nothing, but it is a POST and costs a planner run, so it is a mutation, not a cached query. */
export const proposeDayPlan = (input: ProposeDayPlanInput) =>
  apiClient.post<{ plan: DayPlanProposal }>('/api/planner/day/proposal', input).then((body) => body.plan);

export function useProposeDayPlan() {
  return useMutation({ mutationFn: proposeDayPlan });
}
