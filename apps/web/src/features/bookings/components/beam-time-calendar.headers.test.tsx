import { act } from 'react';
import { type Root, createRoot } from 'react-dom/client';
import { afterEach, describe, expect, test, vi } from 'vitest';
import { BeamTimeCalendar, type BeamTimeCalendarProps } from './beam-time-calendar';

(globalThis as { IS_REACT_ACT_ENVIRONMENT?: boolean }).IS_REACT_ACT_ENVIRONMENT = true;

let root: Root | null = null;

afterEach(() => {
  act(() => root?.unmount());
  root = null;
  vi.useRealTimers();
});

const noop = () => undefined;

async function renderAt(now: string, timeZone: string) {
  vi.useFakeTimers({ toFake: ['Date'] });
  vi.setSystemTime(new Date(now));
  const props: BeamTimeCalendarProps = {
    timeZone, calendar: undefined, configurationName: () => 'SHG', canEditMaintenance: false,
    onRangeChange: noop, onSelectRange: noop, onBookingClick: noop, onMaintenanceClick: noop, onMaintenanceChange: noop,
  };
  const el = document.createElement('div');
  document.body.innerHTML = '';
  document.body.append(el);
  root = createRoot(el);
  await act(async () => root!.render(<BeamTimeCalendar {...props} />));
  return el;
}

const headerTexts = (el: HTMLElement) => [...el.querySelectorAll('th.fc-col-header-cell')].map((th) => th.textContent?.trim());
const weekdayOf = (isoDate: string) => new Intl.DateTimeFormat('en-US', { weekday: 'short', timeZone: 'UTC' }).format(new Date(`${isoDate}T00:00:00Z`));

// Month grids start on the Monday on or before the 1st (the grid's weeks start on Monday). Weekdays of these dates
// are from the proleptic Gregorian calendar: 1 Dec 2026 is a Tuesday, 1 Nov 2026 a Sunday, 1 Apr 2026 a Wednesday,
// 1 Oct 2026 a Thursday, 1 Mar 2026 a Sunday. DST changes inside the shown weeks (IANA tz database): New York
// 8 Mar and 1 Nov 2026, Auckland 5 Apr 2026, Lord Howe 4 Oct 2026 (30-minute change).
const months = [
  ['December 2026 in New York', '2026-12-15T17:00:00Z', 'America/New_York', '2026-11-30', 'December 2026'],
  ['November 2026 in New York (clocks go back on the 1st)', '2026-11-10T17:00:00Z', 'America/New_York', '2026-10-26', 'November 2026'],
  ['March 2026 in New York (clocks go forward on the 8th)', '2026-03-10T17:00:00Z', 'America/New_York', '2026-02-23', 'March 2026'],
  ['April 2026 in Auckland (clocks go back on the 5th)', '2026-04-10T00:00:00Z', 'Pacific/Auckland', '2026-03-30', 'April 2026'],
  ['October 2026 on Lord Howe Island (30-minute change on the 4th)', '2026-10-10T00:00:00Z', 'Australia/Lord_Howe', '2026-09-28', 'October 2026'],
  ['December 2026 in Kathmandu', '2026-12-15T06:00:00Z', 'Asia/Kathmandu', '2026-11-30', 'December 2026'],
] as const;

describe('grid column headers', () => {
  test.each(months)('when the month view shows %s, then the headers are weekday names from Monday and the first cell is the right date', async (_, now, zone, firstCell, title) => {
    const el = await renderAt(now, zone);
    await act(async () => el.querySelector<HTMLButtonElement>('.fc-dayGridMonth-button')!.click());
    expect(el.querySelector('.fc-toolbar-title')?.textContent).toBe(title);
    // A month's columns stand for weekdays, not for the dates of one week: no date may appear in them.
    expect(headerTexts(el)).toEqual(['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun']);
    const cells = [...el.querySelectorAll<HTMLElement>('td.fc-daygrid-day[data-date]')].map((td) => td.dataset.date!);
    expect(cells[0]).toBe(firstCell);
    // Consecutive cells are consecutive civil days, whatever the zone's clock change does to the hours.
    for (let i = 1; i < cells.length; i += 1) {
      expect(Date.parse(`${cells[i]}T00:00:00Z`) - Date.parse(`${cells[i - 1]}T00:00:00Z`)).toBe(86_400_000);
    }
    const dayNumbers = [...el.querySelectorAll('td.fc-daygrid-day[data-date]')].slice(0, 7).map((td) => td.querySelector('.fc-daygrid-day-number')?.textContent);
    expect(dayNumbers).toEqual(cells.slice(0, 7).map((d) => String(Number(d.slice(8)))));
  });

  test.each(months)('when the week view shows a week of %s, then every header names its own column\'s weekday and date', async (_, now, zone) => {
    const el = await renderAt(now, zone);
    const headers = [...el.querySelectorAll<HTMLElement>('th.fc-col-header-cell[data-date]')];
    expect(headers).toHaveLength(7);
    for (const th of headers) {
      const date = th.dataset.date!;
      expect(th.textContent?.trim()).toBe(`${weekdayOf(date)} ${Number(date.slice(5, 7))}/${Number(date.slice(8))}`);
    }
    expect(weekdayOf(headers[0]!.dataset.date!)).toBe('Mon');
  });
});
