import { describe, expect, test } from 'vitest';
import { formatMinor, formatRatePerHour, minorToDecimalString, minorUnitExponent, parseMajorToMinor } from './money';

// Minor-unit exponents from ISO 4217 (USD 2, JPY 0, KWD 3).
describe('parseMajorToMinor', () => {
  test('when "137.50" is typed for USD, then it is 13750 cents', () => {
    expect(parseMajorToMinor('137.50', minorUnitExponent('USD'))).toEqual({ ok: true, minor: 13750 });
  });

  test('when amounts that float arithmetic gets wrong are typed, then the cents are exact', () => {
    // IEEE 754 binary64 (checked in Node 20): 0.1 + 0.2 !== 0.3, 4.35 * 100 = 434.99999999999994, 19.99 * 100 = 1998.9999999999998
    expect(0.1 + 0.2).not.toBe(0.3);
    const cents = (text: string) => {
      const parsed = parseMajorToMinor(text, 2);
      if (!parsed.ok) throw new Error(parsed.message);
      return parsed.minor;
    };
    expect(cents('0.1') + cents('0.2')).toBe(cents('0.3'));
    expect(cents('0.3')).toBe(30);
    expect(4.35 * 100).not.toBe(435);
    expect(Math.trunc(19.99 * 100)).toBe(1998);
    expect(cents('4.35')).toBe(435);
    expect(cents('19.99')).toBe(1999);
  });

  test('when fewer decimals than the exponent are typed, then they are padded, and whitespace is ignored', () => {
    expect(parseMajorToMinor(' 60 ', 2)).toEqual({ ok: true, minor: 6000 });
    expect(parseMajorToMinor('60.5', 2)).toEqual({ ok: true, minor: 6050 });
    expect(parseMajorToMinor('60.', 2)).toEqual({ ok: true, minor: 6000 });
    expect(parseMajorToMinor('007.25', 2)).toEqual({ ok: true, minor: 725 });
    expect(parseMajorToMinor('0', 2)).toEqual({ ok: true, minor: 0 });
  });

  test('when the currency is JPY (exponent 0), then "5000" is 5000 yen and decimals are refused', () => {
    expect(parseMajorToMinor('5000', minorUnitExponent('JPY'))).toEqual({ ok: true, minor: 5000 });
    expect(parseMajorToMinor('5000.5', 0)).toMatchObject({ ok: false });
  });

  test('when the currency has three decimals (KWD), then "1.5" is 1500 fils', () => {
    expect(parseMajorToMinor('1.5', minorUnitExponent('KWD'))).toEqual({ ok: true, minor: 1500 });
  });

  test('when more decimals than the currency has are typed, then it is refused rather than rounded', () => {
    const parsed = parseMajorToMinor('137.505', 2);
    expect(parsed).toEqual({ ok: false, message: 'Use at most 2 decimal places' });
  });

  test('when the text is not a plain positive decimal, then it is refused', () => {
    for (const text of ['', 'abc', '-5', '1e3', '1,000.00', '.5', '12.3.4', '$10', 'Infinity']) {
      expect(parseMajorToMinor(text, 2).ok, text).toBe(false);
    }
  });

  test('when the amount is beyond safe integers, then it is refused', () => {
    expect(parseMajorToMinor('99999999999999999', 2).ok).toBe(false);
  });
});

describe('formatting', () => {
  test('when cents are shown in USD, then two decimals and the dollar sign appear', () => {
    expect(formatMinor(13750, 'USD')).toBe('$137.50');
    expect(formatMinor(0, 'USD')).toBe('$0.00');
    expect(formatMinor(123456789, 'USD')).toBe('$1,234,567.89');
  });

  test('when yen are shown, then there are no decimals', () => {
    expect(formatMinor(5000, 'JPY')).toBe('¥5,000');
  });

  test('when a rate is shown, then it is money per hour', () => {
    expect(formatRatePerHour(11000, 'USD')).toBe('$110.00/h');
  });

  test('when parsed text is formatted back to a decimal string, then it round-trips exactly', () => {
    for (const text of ['137.50', '0.10', '0.01', '260.00', '1234567.89']) {
      const parsed = parseMajorToMinor(text, 2);
      expect(parsed.ok && minorToDecimalString(parsed.minor, 'USD')).toBe(text);
    }
  });
});
