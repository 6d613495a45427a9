import { useQueries } from '@tanstack/react-query';
import { useCallback, useMemo } from 'react';
import { defaultConfigurationName } from '../../../features/bookings/lib/calendar-events';
import { type Configuration, configurationsQueryOptions } from '../../../features/configurations/api/get-configurations';
import { type Instrument, useInstruments } from '../../../features/configurations/api/get-instruments';
import { useFacility } from '../../../features/facility/api/get-facility';

/** Facility, instruments and every instrument's configurations: what the calendar pages compose from. */
export function useBeamTimeData() {
  const facility = useFacility();
  const instruments = useInstruments();
  const list: Instrument[] = useMemo(() => instruments.data ?? [], [instruments.data]);
  const perInstrument = useQueries({ queries: list.map((i) => configurationsQueryOptions(i.id)) });
  const configurationsKey = perInstrument.map((q) => q.dataUpdatedAt).join(',');
  // the update stamps stand for the results: useQueries hands back a new array on every render
  const configurations: Configuration[] = useMemo(() => perInstrument.flatMap((q) => q.data ?? []), [configurationsKey]);
  const configurationName = useCallback(
    (configurationId: string, outputKind: string) => configurations.find((c) => c.id === configurationId)?.name ?? defaultConfigurationName(outputKind),
    [configurations],
  );
  const configurationsError = perInstrument.find((q) => q.error)?.error?.message ?? null;
  return {
    facility,
    instruments,
    instrumentList: list,
    defaultInstrumentId: list.find((i) => i.kind === 'source')?.id ?? list[0]?.id ?? '',
    configurations,
    configurationsLoading: perInstrument.some((q) => q.isPending),
    configurationsError,
    configurationName,
  };
}
