import { stringify } from 'csv-stringify/sync';

/** A value for one CSV field; null and undefined are empty fields. */
export type CsvCell = string | number | bigint | boolean | null | undefined;

/**
 * First characters that make a spreadsheet read a cell as a formula (OWASP "CSV Injection": = + - @ TAB CR), plus
 * their full-width forms, which some spreadsheet programs fold to the ASCII ones (the list csv-stringify's own
 * `escape_formulas` option uses).
 */
const FORMULA_START = /^[=+\-@\t\r\uFF1D\uFF0B\uFF0D\uFF20]/;
/** An exact decimal number ("-12.50", "3", "0.25"), as the app writes amounts and hours: a spreadsheet reads it as a number, never as a formula. */
const PLAIN_NUMBER = /^-?\d+(\.\d+)?$/;
/** What neutraliseCsvCell leaves behind, so the field is also enclosed in double quotes (OWASP's advice). */
const NEUTRALISED = new RegExp(`^'${FORMULA_START.source.slice(1)}`);

/**
 * OWASP CSV Injection: a text cell that begins like a formula is prefixed with a single quote, so that spreadsheet
 * programs show it as text. Numbers (and exact decimal strings such as a negative amount "-12.50") are left alone:
 * they evaluate to themselves, and quoting them would turn money columns into text.
 */
export function neutraliseCsvCell(value: string): string {
  return FORMULA_START.test(value) && !PLAIN_NUMBER.test(value) ? `'${value}` : value;
}

/**
 * Every CSV the app exports goes through here: RFC 4180 (CRLF record ends; fields with a comma, a double quote or a
 * line break enclosed in double quotes, inner quotes doubled; written by csv-stringify) with formula-like text
 * neutralised as OWASP advises.
 */
export function toCsv(rows: readonly (readonly CsvCell[])[]): string {
  const safe = rows.map((row) => row.map((cell) => (typeof cell === 'string' ? neutraliseCsvCell(cell) : cell)));
  return stringify(safe, { record_delimiter: 'windows', quoted_match: NEUTRALISED });
}
