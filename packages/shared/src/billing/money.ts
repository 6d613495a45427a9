/**
 * Money is an integer count of the currency's minor unit (cents for USD, yen for JPY); no floats are ever stored.
 * Minor-unit exponents from ISO 4217 (the "minor unit" column of the standard's list one), for the currencies a
 * facility is likely to bill in.
 */
export const minorUnitExponents: Readonly<Record<string, number>> = {
  USD: 2, EUR: 2, GBP: 2, CHF: 2, CAD: 2, AUD: 2, NZD: 2, SEK: 2, NOK: 2, DKK: 2, PLN: 2, CZK: 2, HUF: 2,
  CNY: 2, HKD: 2, SGD: 2, INR: 2, ILS: 2, BRL: 2, MXN: 2, ZAR: 2,
  JPY: 0, KRW: 0, ISK: 0, CLP: 0,
  KWD: 3, BHD: 3, OMR: 3, JOD: 3, TND: 3,
};

export function minorUnitExponent(currency: string): number {
  const exponent = minorUnitExponents[currency.toUpperCase()];
  if (exponent === undefined) throw new Error(`Currency ${currency} is not in Femtoslot's ISO 4217 table`);
  return exponent;
}

function assertInteger(value: number, what: string): void {
  if (!Number.isSafeInteger(value)) throw new Error(`${what} must be a safe integer (got ${value})`);
}

/** numerator / divisor rounded half-up (half away from zero for negatives), on integers only. */
export function divideHalfUp(numerator: number, divisor: number): number {
  assertInteger(numerator, 'numerator');
  assertInteger(divisor, 'divisor');
  if (divisor <= 0) throw new Error('divisor must be positive');
  const sign = numerator < 0 ? -1 : 1;
  const n = Math.abs(numerator);
  const quotient = Math.floor(n / divisor);
  const remainder = n - quotient * divisor;
  return sign * (remainder * 2 >= divisor ? quotient + 1 : quotient);
}

/** A line: minutes × hourly rate, divided by 60 and rounded half-up to the minor unit. */
export function lineAmountMinor(minutes: number, rateMinorPerHour: number): number {
  return divideHalfUp(minutes * rateMinorPerHour, 60);
}

/** percent % of an hourly rate of minutes, in one integer division (so the half-up rounding happens once). */
export function percentLineAmountMinor(minutes: number, rateMinorPerHour: number, percent: number): number {
  return divideHalfUp(minutes * rateMinorPerHour * percent, 60 * 100);
}

/** A rate raised by a surcharge in percent, rounded half-up to the minor unit (DFG class: +25 %). */
export function withSurcharge(rateMinor: number, percent: number): number {
  return divideHalfUp(rateMinor * (100 + percent), 100);
}

export function sumMinor(values: readonly number[]): number {
  let total = 0;
  for (const v of values) {
    assertInteger(v, 'amount');
    total += v;
  }
  assertInteger(total, 'total');
  return total;
}

/** The exact decimal string of a minor-unit amount ("13750" USD → "137.50"), built without floating point. */
export function minorToDecimalString(minor: number, currency: string): string {
  assertInteger(minor, 'amount');
  const exponent = minorUnitExponent(currency);
  const digits = String(Math.abs(minor)).padStart(exponent + 1, '0');
  const whole = exponent ? digits.slice(0, -exponent) : digits;
  const fraction = exponent ? `.${digits.slice(-exponent)}` : '';
  return `${minor < 0 ? '-' : ''}${whole}${fraction}`;
}

// Building a NumberFormat costs far more than using one, and a statement formats every line's rate.
const moneyFormats = new Map<string, Intl.NumberFormat>();

/** For display: Intl.NumberFormat with the ISO 4217 exponent, fed the exact decimal string. */
export function formatMoney(minor: number, currency: string, locale = 'en-US'): string {
  const exponent = minorUnitExponent(currency);
  const key = `${locale}|${currency}`;
  let format = moneyFormats.get(key);
  if (!format) {
    format = new Intl.NumberFormat(locale, { style: 'currency', currency, minimumFractionDigits: exponent, maximumFractionDigits: exponent });
    moneyFormats.set(key, format);
  }
  return format.format(minorToDecimalString(minor, currency) as unknown as number);
}
