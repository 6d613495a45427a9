import type { CalendarDto, StationDto } from '@femtoslot/shared';
import { describe, expect, test } from 'vitest';
import { compatibleStations } from '../components/station-picker';
import { stationsSuffix, toGridEvents } from './calendar-events';
import { buildRequest } from './request-form-values';

const stations: StationDto[] = [
  { id: 's-pp', name: 'Pump-probe station', description: '', configurationIds: ['c-800', 'c-opa'] },
  { id: 's-ac', name: 'Autocorrelator bench', description: '', configurationIds: ['c-800'] },
];

describe('end stations in the web app', () => {
  test('when a configuration is chosen, then only the stations it feeds are offered', () => {
    expect(compatibleStations(stations, 'c-800').map((s) => s.id)).toEqual(['s-pp', 's-ac']);
    expect(compatibleStations(stations, 'c-opa').map((s) => s.id)).toEqual(['s-pp']);
    expect(compatibleStations(stations, 'c-dfg')).toEqual([]);
  });

  test('when stations are ticked, then the request body carries them; with none, the field is left out', () => {
    const values = {
      instrumentId: 'i', configurationId: 'c-800', targetMode: 'single' as const, targetValue: '800', targetToValue: '', unit: 'nm' as const,
      startDate: '2026-06-01', startTime: '09:00', endDate: '2026-06-01', endTime: '11:00', accountId: 'a', purpose: 'Carrier dynamics',
    };
    expect(buildRequest({ ...values, stationIds: ['s-pp'] }, 'America/New_York')!.body.stationIds).toEqual(['s-pp']);
    expect('stationIds' in buildRequest({ ...values, stationIds: [] }, 'America/New_York')!.body).toBe(false);
  });

  test('when a booking includes stations, then its grid event names them and carries their ids', () => {
    const name = (id: string) => stations.find((s) => s.id === id)!.name;
    expect(stationsSuffix(['s-pp', 's-ac'], name)).toBe(' · with Pump-probe station, Autocorrelator bench');
    expect(stationsSuffix([], name)).toBe('');
    const calendar: CalendarDto = {
      bookings: [{ id: 'b1', instrumentId: 'i', configurationId: 'c-800', configurationKey: 'fundamental', outputKind: 'fundamental', status: 'approved',
        startsAt: '2026-06-01T13:00:00Z', endsAt: '2026-06-01T15:00:00Z', own: false, stationIds: ['s-pp'], detail: null }],
      maintenance: [], changeovers: [],
    };
    const [event] = toGridEvents(calendar, { configurationName: () => 'Fundamental 800 nm', canEditMaintenance: false, stationName: name });
    expect(event!.title).toBe('Busy · Fundamental 800 nm · with Pump-probe station');
    expect(event!.classNames).toContain('fs-with-station');
  });
});
