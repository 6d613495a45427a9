import type { BookingCheckDto, NeighbourCheckDto } from '@femtoslot/shared';

/**
 * One verdict for a checked request, the worst finding winning: an overlap with a maintenance window or another
 * booking, then a changeover too short for a neighbour, then any other rule the request breaks (training, eyewear,
 * horizon, account…, listed beside the verdict), and only then "fits". Anything but "fits" refuses, and the form
 * will not send it.
 */
export type VerdictKind = 'maintenance' | 'overlap' | 'changeover_short' | 'rule' | 'fits';

export interface RequestVerdict {
  kind: VerdictKind;
  refuses: boolean;
  /** the neighbour whose changeover is shortest of room, for 'changeover_short' */
  short: { side: 'before' | 'after'; neighbour: NeighbourCheckDto } | null;
  earliestStart: string | null;
}

const timelineCodes = new Set(['overlap', 'changeover_gap']);

export function requestVerdict(check: BookingCheckDto): RequestVerdict {
  const { timeline } = check;
  const earliestStart = timeline.earliestStart;
  const sides = (['before', 'after'] as const)
    .map((side) => ({ side, neighbour: timeline[side] }))
    .filter((s): s is { side: 'before' | 'after'; neighbour: NeighbourCheckDto } => !!s.neighbour && s.neighbour.shortfallMinutes > 0)
    .sort((a, b) => b.neighbour.shortfallMinutes - a.neighbour.shortfallMinutes);
  const base = { refuses: true, short: null, earliestStart };
  if (timeline.overlaps.length > 0 || check.problems.some((p) => p.code === 'overlap')) return { ...base, kind: timeline.overlapsMaintenance ? 'maintenance' : 'overlap' };
  if (sides.length > 0) return { ...base, kind: 'changeover_short', short: sides[0]! };
  if (!check.ok || check.problems.some((p) => !timelineCodes.has(p.code))) return { ...base, kind: 'rule' };
  return { kind: 'fits', refuses: false, short: null, earliestStart };
}
