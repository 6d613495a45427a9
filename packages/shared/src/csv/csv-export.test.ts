import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { neutraliseCsvCell, toCsv } from './csv-export';

// OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection): a cell that begins with = + - @ TAB or CR
// is read as a formula by spreadsheet programs; prefix it with a single quote and quote the field.
// RFC 4180 §2: records end in CRLF; fields holding a comma, a double quote or a line break are enclosed in double
// quotes, and a double quote inside is doubled. Every check parses the text back with csv-parse, an independent reader.
const back = (text: string) => parse(text, { relax_column_count: false }) as string[][];

describe('CSV export (OWASP CSV Injection, RFC 4180)', () => {
  it('when a text cell starts with = + - @ TAB or CR, then it comes back with a leading single quote and its text intact', () => {
    const hostile = ['=HYPERLINK("http://x","y")', '+1+cmd|\' /C calc\'!A0', '-2+3', '@SUM(A1:A2)', '\t=1+1', '\r=1+1', '＝1+1'];
    const text = toCsv([['name'], ...hostile.map((h) => [h])]);
    const rows = back(text);
    expect(rows.slice(1).map((r) => r[0])).toEqual(hostile.map((h) => `'${h}`));
  });

  it('when a neutralised cell holds quotes and commas, then the field is quoted, its quotes doubled, and it still parses to one cell', () => {
    const text = toCsv([['a', 'b'], ['=HYPERLINK("http://x","y")', 'plain']]);
    expect(text).toBe('a,b\r\n"\'=HYPERLINK(""http://x"",""y"")",plain\r\n');
    expect(back(text)).toEqual([['a', 'b'], ['\'=HYPERLINK("http://x","y")', 'plain']]);
  });

  it('when numbers are negative (numbers or exact decimal strings the app generated), then they stay numbers', () => {
    const text = toCsv([['amount', 'amount_minor', 'hours'], ['-12.50', -1250, -0.25], ['0.00', 0, 3]]);
    expect(back(text)).toEqual([['amount', 'amount_minor', 'hours'], ['-12.50', '-1250', '-0.25'], ['0.00', '0', '3']]);
  });

  it('when text only looks numeric at the start, then it is still neutralised', () => {
    expect(neutraliseCsvCell('-12.50+cmd')).toBe("'-12.50+cmd");
    expect(neutraliseCsvCell('-1e3')).toBe("'-1e3");
    expect(neutraliseCsvCell('+5')).toBe("'+5");
  });

  it('when text is ordinary (names, ISO dates, URLs, empty), then it is written as it is', () => {
    const row = ['Kestrel Lab, Carrier Dynamics', '2026-03-01T05:00:00.000Z', 'http://127.0.0.1/i/1', '', 'a "quoted" word', 'two\r\nlines'];
    const text = toCsv([row]);
    expect(back(text)).toEqual([row]);
    expect(text.endsWith('\r\n')).toBe(true);
  });

  it('when a cell is null or undefined, then it is an empty field', () => {
    expect(back(toCsv([['x', null, undefined, 'y']]))).toEqual([['x', '', '', 'y']]);
  });
});
