import { formatMoney, minorToDecimalString, minorUnitExponent } from '@femtoslot/shared/billing/money';

export { minorToDecimalString, minorUnitExponent };

/** Display of an integer minor-unit amount in the facility currency (ISO 4217 exponent, no floating point). */
export function formatMinor(minor: number, currency: string): string {
  return formatMoney(minor, currency);
}

/** An hourly rate as shown on a rate card: "$137.50/h". */
export function formatRatePerHour(minorPerHour: number, currency: string): string {
  return `${formatMoney(minorPerHour, currency)}/h`;
}

export type MajorParse = { ok: true; minor: number } | { ok: false; message: string };

const amountPattern = /^(\d+)(?:\.(\d*))?$/;

/**
 * Reads an amount typed in major units ("137.50") as integer minor units (13750), digit by digit from the
 * string, so no binary floating point ever touches it ("0.1" is exactly 10 cents, never 10.000000000000002).
 * More decimals than the currency has is refused rather than rounded.
 */
export function parseMajorToMinor(text: string, exponent: number): MajorParse {
  const cleaned = text.trim().replace(/[\s_]/g, '');
  const match = amountPattern.exec(cleaned);
  if (!match) return { ok: false, message: exponent ? 'Type an amount like 137.50' : 'Type a whole amount like 5000' };
  const whole = match[1]!;
  const fraction = match[2] ?? '';
  if (fraction.length > exponent) {
    return { ok: false, message: exponent ? `Use at most ${exponent} decimal places` : 'This currency has no decimal places' };
  }
  const digits = `${whole}${fraction.padEnd(exponent, '0')}`.replace(/^0+(?=\d)/, '');
  const minor = Number(digits);
  if (!Number.isSafeInteger(minor)) return { ok: false, message: 'That amount is too large' };
  return { ok: true, minor };
}

