import { toast } from 'sonner';
import type { MaintenanceResult } from '../api/create-maintenance';

export function displacedToast(verb: string, result: MaintenanceResult) {
  const n = result.displaced.length;
  toast.success(`Maintenance ${verb}`, {
    description: n === 0 ? 'No bookings were displaced.' : `${n} booking${n === 1 ? ' was' : 's were'} displaced and offered new slots.`,
  });
  for (const c of result.warmupConflicts ?? []) {
    // Only bookings that overlap a window are displaced; the one after it keeps its time and staff decide.
    toast.warning('Warm-up cut short', {
      duration: 15_000,
      description: `The next booking starts ${c.availableMinutes} min after the window, but the warm-up needs ${c.neededMinutes} min. It was kept; shorten the window, move the booking or talk to its owner.`,
    });
  }
}
