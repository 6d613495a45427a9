import { describe, expect, it } from 'vitest';
import { describeInstant, formatInstantsIn, formatZonedInstant } from './format-instant';

// Offsets from the IANA tz database: New York is UTC−5 in December, Berlin UTC+1; New York leaves daylight time
// at 02:00 on Sunday 1 Nov 2026 (06:00 UTC), Auckland is UTC+13 in December (daylight time).
describe('instants for people', () => {
  it('when an instant is shown in the facility zone only, then it reads as the wall time there', () => {
    // ICU's en-GB pattern puts a comma after the weekday in some versions and not in others.
    expect(formatZonedInstant('2026-12-08T19:00:00Z', 'America/New_York')).toMatch(/^Tue,? 8 Dec 2026, 14:00$/);
    expect(describeInstant('2026-12-08T19:00:00Z', 'America/New_York', 'America/New_York')).toMatch(/^Tue,? 8 Dec 2026, 14:00 \(America\/New_York\)$/);
  });

  it('when the viewer is in another zone, then both wall times are given, each named', () => {
    expect(describeInstant('2026-12-08T19:00:00Z', 'America/New_York', 'Europe/Berlin')).toMatch(/^Tue,? 8 Dec 2026, 14:00 \(America\/New_York\) · Tue,? 8 Dec 2026, 20:00 your time \(Europe\/Berlin\)$/);
    expect(describeInstant('2026-12-08T19:00:00Z', 'America/New_York', 'Pacific/Auckland')).toMatch(/Wed,? 9 Dec 2026, 08:00 your time \(Pacific\/Auckland\)$/);
  });

  it('when a message carries ISO instants, then each is rewritten and the rest of the text is kept', () => {
    const text = 'The earliest start that works is 2026-11-01T06:30:00.000Z. Or try 2026-11-01T01:30-04:00.';
    // 06:30 UTC on 1 Nov 2026 is 01:30 EST (after the change); 01:30−04:00 is the first 01:30 (EDT).
    expect(formatInstantsIn(text, 'America/New_York')).toMatch(/^The earliest start that works is Sun,? 1 Nov 2026, 01:30 \(America\/New_York\)\. Or try Sun,? 1 Nov 2026, 01:30 \(America\/New_York\)\.$/);
    expect(formatInstantsIn('No instant here: 2026-11-01.', 'America/New_York')).toBe('No instant here: 2026-11-01.');
  });
});
