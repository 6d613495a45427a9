// Apart from the form values so the booking details on the calendar can read a refusal without loading zod.
export interface ChangeoverGapDetails {
  neededMinutes: number;
  availableMinutes: number;
  earliestStart: string | null;
}

export function changeoverGapDetails(details: unknown): ChangeoverGapDetails | null {
  if (typeof details !== 'object' || details === null) return null;
  const d = details as Record<string, unknown>;
  if (typeof d.neededMinutes !== 'number' || typeof d.availableMinutes !== 'number') return null;
  return { neededMinutes: d.neededMinutes, availableMinutes: d.availableMinutes, earliestStart: typeof d.earliestStart === 'string' ? d.earliestStart : null };
}
