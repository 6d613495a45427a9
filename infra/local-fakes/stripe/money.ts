/**
 * quantity × unit_amount_decimal in integer minor units, rounded half up, without floating point
 * (Femtoslot rule: money is integer minor units).
 */
export function lineAmount(quantity: number, unitAmountDecimal: string): number {
  const [whole = '0', fraction = ''] = unitAmountDecimal.split('.');
  const scale = 10n ** BigInt(fraction.length);
  const scaled = BigInt(whole + fraction) * BigInt(quantity);
  const rounded = (scaled * 2n + scale) / (scale * 2n);
  return Number(rounded);
}

/** Minor-unit exponent per ISO 4217 as Intl knows it (e.g. 2 for usd, 0 for jpy). */
export function minorUnitDigits(currency: string): number {
  try {
    return new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
  } catch {
    return 2;
  }
}

/** Display only: 123456 usd → "USD 1,234.56", built from the integer so no float rounding creeps in. */
export function formatMinorUnits(amount: number, currency: string): string {
  const digits = minorUnitDigits(currency);
  const sign = amount < 0 ? '−' : '';
  const text = String(Math.abs(amount)).padStart(digits + 1, '0');
  const whole = text.slice(0, text.length - digits).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  const fraction = digits > 0 ? `.${text.slice(text.length - digits)}` : '';
  return `${sign}${currency.toUpperCase()} ${whole}${fraction}`;
}
