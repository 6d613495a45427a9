import type { QueryClient } from '@tanstack/react-query';
import { canReach } from '../../../config/navigation';
import { calendarQueryOptions } from '../../../features/bookings/api/get-calendar';
import { weekShownAt } from '../../../features/bookings/lib/calendar-week';
import { configurationsQueryOptions } from '../../../features/configurations/api/get-configurations';
import { instrumentsQueryOptions } from '../../../features/configurations/api/get-instruments';
import { facilityQueryOptions } from '../../../features/facility/api/get-facility';
import { currentUserQueryOptions } from '../../../lib/auth';
import { defaultInstrumentId } from './default-instrument';

/**
 * Asks for the opening week's bookings as soon as the zone and the instruments are known, alongside the
 * configurations and the page's script, instead of after the grid has mounted and reported its range.
 * The page makes the same queries (same keys), so it finds them in flight or answered.
 */
export async function prefetchFirstWeek(queryClient: QueryClient, now = new Date()): Promise<void> {
  try {
    // together rather than after the session check: signed out, all three say 401 and the guard sends the
    // visitor to sign-in, as it would have anyway
    const [user, facility, instruments] = await Promise.all([
      queryClient.ensureQueryData(currentUserQueryOptions()),
      queryClient.ensureQueryData(facilityQueryOptions()),
      queryClient.ensureQueryData(instrumentsQueryOptions()),
    ]);
    if (!user || !canReach(user.role, 'calendar')) return;
    const instrumentId = defaultInstrumentId(instruments);
    const week = instrumentId ? [queryClient.prefetchQuery(calendarQueryOptions({ ...weekShownAt(now, facility.timeZone), instrumentId }))] : [];
    await Promise.all([...week, ...instruments.map((i) => queryClient.prefetchQuery(configurationsQueryOptions(i.id)))]);
  } catch {
    // nothing to do here: the page runs the same queries and shows their errors
  }
}
