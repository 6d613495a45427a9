import { z } from 'zod';

/**
 * Date and instant text as every edge accepts it. zod's ISO formats already refuse days a month does not have
 * (2031-02-30) and times like 24:00; these add what PostgreSQL or the calendar would choke on further in:
 * year 0000 (no such year in the Gregorian AD/BC count that PostgreSQL and ISO 8601's basic four-digit years share),
 * and UTC offsets beyond the real ones — the IANA tz database's zones run from −12:00 (Etc/GMT+12) to +14:00
 * (Pacific/Kiritimati); PostgreSQL refuses ±16:00 and beyond outright (22009).
 */
const MIN_OFFSET_MINUTES = -12 * 60;
const MAX_OFFSET_MINUTES = 14 * 60;

const notYearZero = (v: string) => !v.startsWith('0000');

function offsetMinutes(instant: string): number {
  const m = /([+-])(\d{2}):(\d{2})$/.exec(instant);
  return m ? (m[1] === '-' ? -1 : 1) * (Number(m[2]) * 60 + Number(m[3])) : 0;
}

/** An ISO 8601 instant with its offset (RFC 3339 profile), years 0001–9999, offsets −12:00…+14:00. */
export const isoInstantSchema = (message = 'Use an ISO 8601 instant with its offset, e.g. 2026-12-03T14:00:00Z') =>
  z.iso.datetime({ offset: true, message })
    .refine(notYearZero, { message: 'Use a year from 0001 to 9999' })
    .refine((v) => { const o = offsetMinutes(v); return o >= MIN_OFFSET_MINUTES && o <= MAX_OFFSET_MINUTES; }, {
      message: 'Use a UTC offset between -12:00 and +14:00',
    });

/** A calendar date as YYYY-MM-DD that exists (no 2031-02-30), years 0001–9999. */
export const calendarDateSchema = z.iso.date({ message: 'Use a calendar date as YYYY-MM-DD' })
  .refine(notYearZero, { message: 'Use a year from 0001 to 9999' });

/** A month as YYYY-MM, years 0001–9999. */
export const calendarMonthSchema = z.string()
  .regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'Use a month as YYYY-MM')
  .refine(notYearZero, { message: 'Use a year from 0001 to 9999' });
