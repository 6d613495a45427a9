import { describe, expect, it } from 'vitest';
import { MAX_TRACE_POINTS } from './autocorrelation';
import { analyseAutocorrelationCsv, MAX_TRACE_LINE_CHARS, parseAutocorrelationCsv, readAutocorrelationCsvInSteps } from './autocorrelation-csv';

const code = (c: string, extra: Record<string, unknown> = {}) => expect.objectContaining({ code: c, ...(Object.keys(extra).length ? { details: expect.objectContaining(extra) } : {}) });

/** A clean Gaussian AC of 120 fs FWHM on a 0.1 baseline, as rows of text. */
function gaussianRows(delimiter: string, decimalComma = false): string[] {
  return Array.from({ length: 61 }, (_, i) => {
    const d = -600 + 20 * i;
    const s = 0.1 + Math.exp((-4 * Math.LN2 * d * d) / (120 * 120));
    const fmt = (x: number) => (decimalComma ? String(x).replace('.', ',') : String(x));
    return `${fmt(d)}${delimiter}${fmt(Number(s.toFixed(6)))}`;
  });
}

describe('autocorrelation CSV reader', () => {
  it('when the file has a header, comma delimiter and CRLF, then the header is kept and points read', () => {
    const text = ['delay_fs,signal', ...gaussianRows(',')].join('\r\n');
    const trace = parseAutocorrelationCsv(text);
    expect(trace.header).toEqual(['delay_fs', 'signal']);
    expect(trace.points).toHaveLength(61);
    expect(trace.points[0]).toEqual([-600, 0.1]);
  });

  it('when the file has no header, semicolons, decimal commas and blank lines, then it is read', () => {
    const rows = gaussianRows(';', true);
    const text = [...rows.slice(0, 10), '', '   ', ...rows.slice(10)].join('\n');
    const trace = parseAutocorrelationCsv(text);
    expect(trace.header).toBeNull();
    expect(trace.delimiter).toBe(';');
    expect(trace.points).toHaveLength(61);
  });

  it('when the file is tab separated, then the AC FWHM of 120 fs is recovered', () => {
    const result = analyseAutocorrelationCsv(['delay\tsignal', ...gaussianRows('\t')].join('\n'), 'gaussian');
    // Source: the trace is a Gaussian of 120 fs FWHM by construction; Gaussian AC/pulse = √2 (Diels & Rudolph)
    expect(result.autocorrelationFwhmFs).toBeCloseTo(120, 0);
    expect(result.pulseFwhmFs).toBeCloseTo(120 / Math.SQRT2, 0);
  });

  it('when a cell is not a number, then non_numeric names its 1-based line and the cell', () => {
    const rows = ['delay,signal', ...gaussianRows(',')];
    rows[4] = '-540,abc';
    expect(() => parseAutocorrelationCsv(rows.join('\n'))).toThrow(code('non_numeric', { line: 5, cell: 'abc' }));
  });

  it('when a row has three columns, then wrong_columns names its line', () => {
    const rows = gaussianRows(',');
    rows[2] = '-560,0.1,9';
    expect(() => parseAutocorrelationCsv(['', ...rows].join('\n'))).toThrow(code('wrong_columns', { line: 4, columns: 3 }));
  });

  it('when the file holds three data rows, then too_few_points', () => {
    expect(() => parseAutocorrelationCsv('delay,signal\n0,1\n1,2\n2,1\n')).toThrow(code('too_few_points', { count: 3 }));
  });

  it('when the signal is flat, then no_peak', () => {
    const text = Array.from({ length: 20 }, (_, i) => `${i * 10},0.5`).join('\n');
    expect(() => analyseAutocorrelationCsv(text, 'sech2')).toThrow(code('no_peak'));
  });

  it('when the scan ends on the rising edge, then peak_at_edge', () => {
    const text = gaussianRows(',').slice(0, 32).join('\n');
    expect(() => analyseAutocorrelationCsv(text, 'gaussian')).toThrow(code('peak_at_edge'));
  });
});

describe('autocorrelation CSV reader on hostile input', () => {
  /** A valid Gaussian AC trace with `rows` samples (AC FWHM 200 fs), as CSV text. */
  const longTrace = (rows: number) => ['delay_fs,signal', ...Array.from({ length: rows }, (_, i) => {
    const d = -2000 + (4000 * i) / (rows - 1);
    return `${d.toFixed(4)},${(0.05 + Math.exp((-4 * Math.LN2 * d * d) / (200 * 200))).toFixed(6)}`;
  })].join('\n');

  it('when a row holds more than the line limit, then line_too_long names the line and the limit', () => {
    const text = `delay,signal\n0,${'1'.repeat(20_000)}x\n`;
    expect(() => parseAutocorrelationCsv(text)).toThrow(code('line_too_long', { line: 2, maximum: MAX_TRACE_LINE_CHARS }));
  });

  it('when the file has more rows than the point limit, then too_many_points carries the limit', () => {
    expect(() => parseAutocorrelationCsv(longTrace(MAX_TRACE_POINTS + 1))).toThrow(code('too_many_points', { maximum: MAX_TRACE_POINTS }));
  });

  it('when the trace has as many rows as the limit, then it is analysed (no argument-spread stack overflow)', () => {
    const result = analyseAutocorrelationCsv(longTrace(MAX_TRACE_POINTS), 'gaussian');
    // Source: the trace is a Gaussian of 200 fs AC FWHM by construction
    expect(result.autocorrelationFwhmFs).toBeCloseTo(200, 0);
    expect(result.pointCount).toBe(MAX_TRACE_POINTS);
  });

  it('when 2 MB of delimiters, quotes or blank lines arrive, then each ends in a 4xx-style engine error', () => {
    for (const text of [';'.repeat(2_000_000), '"'.repeat(2_000_000), '\n'.repeat(2_000_000), '1,2\n'.repeat(500_000)]) {
      expect(() => parseAutocorrelationCsv(text)).toThrow(expect.objectContaining({ name: 'EngineError' }));
    }
  });

  it('when a cell is quoted or a comment follows, then the reader keeps the csv conventions', () => {
    const text = ['"delay (fs)";"signal"', '# scan 3', ...gaussianRows(';', true).map((r, i) => (i === 3 ? `${r} # glitch?` : r))].join('\n');
    const trace = parseAutocorrelationCsv(text);
    expect(trace.header).toEqual(['delay (fs)', 'signal']);
    expect(trace.points).toHaveLength(61);
    expect(() => parseAutocorrelationCsv('delay,signal\n"0,1\n')).toThrow(code('malformed_csv', { line: 2 }));
  });

  it('when a large trace is read in steps, then control returns to the caller between steps (a count of yields, not a clock)', async () => {
    let steps = 0;
    const trace = await readAutocorrelationCsvInSteps(longTrace(40_000), async () => { steps += 1; });
    expect(trace.points).toHaveLength(40_000);
    // ~1 MB of text read in steps of at most 64 KiB of lines: at least 10 yields
    expect(steps).toBeGreaterThanOrEqual(10);
  });
});
