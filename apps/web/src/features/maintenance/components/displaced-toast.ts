import { toast } from 'sonner';
import type { MaintenanceResult } from '../api/create-maintenance';

export function displacedToast(verb: string, result: MaintenanceResult) {
  const n = result.displaced.length;
  toast.success(`Maintenance ${verb}`, {
    description: n === 0 ? 'No bookings were displaced.' : `${n} booking${n === 1 ? ' was' : 's were'} displaced and offered new slots.`,
  });
}
