import { useQueries } from '@tanstack/react-query';
import { useCallback, useMemo } from 'react';
import { defaultConfigurationName } from '../../../features/bookings/lib/calendar-events';
import { type Configuration, configurationsQueryOptions } from '../../../features/configurations/api/get-configurations';
import { type Instrument, useInstruments } from '../../../features/configurations/api/get-instruments';
import { useFacility } from '../../../features/facility/api/get-facility';
import { defaultInstrumentId } from './default-instrument';

/** Facility, instruments and every instrument's configurations: what the calendar pages compose from. */
export function useBeamTimeData() {
  const facility = useFacility();
  const instruments = useInstruments();
  const list: Instrument[] = useMemo(() => instruments.data ?? [], [instruments.data]);
  const perInstrument = useQueries({ queries: list.map((i) => configurationsQueryOptions(i.id)) });
  const configurationsLoading = perInstrument.some((q) => q.isPending);
  // The update stamps stand for the results (useQueries hands back a new array on every render). Taken once all
  // have settled: each new list renames every event, and redrawing the grid per instrument costs more than the wait.
  const configurationsKey = configurationsLoading ? 'loading' : perInstrument.map((q) => q.dataUpdatedAt).join(',');
  const configurations: Configuration[] = useMemo(
    () => (configurationsLoading ? [] : perInstrument.flatMap((q) => q.data ?? [])),
    [configurationsKey],
  );
  const configurationName = useCallback(
    (configurationId: string, outputKind: string) => configurations.find((c) => c.id === configurationId)?.name ?? defaultConfigurationName(outputKind),
    [configurations],
  );
  const instrumentName = useCallback((instrumentId: string) => list.find((i) => i.id === instrumentId)?.name ?? 'End station', [list]);
  const configurationsError = perInstrument.find((q) => q.error)?.error?.message ?? null;
  return {
    facility,
    instruments,
    instrumentList: list,
    defaultInstrumentId: defaultInstrumentId(list),
    configurations,
    configurationsLoading,
    configurationsError,
    configurationName,
    instrumentName,
  };
}
