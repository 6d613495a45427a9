// The browser build bundles its own Buffer shim, so the same reader runs in Node and in the web app.
import { parse } from 'csv-parse/browser/esm/sync';
import { z } from 'zod';
import { EngineError, parseEngineInput } from '../units/engine-error';
import { analyseAutocorrelation, MIN_TRACE_POINTS, type AutocorrelationResult, type PulseShape } from './autocorrelation';

export const autocorrelationCsvInputSchema = z.string().max(5_000_000);

export interface ParsedTrace {
  /** [delay fs, signal] in file order. */
  points: Array<[number, number]>;
  header: string[] | null;
  delimiter: ',' | ';' | '\t';
}

const NUMBER_PATTERN = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Tab, then semicolon, then comma: files that use ';' or tab between cells often write decimal
 * commas, so a comma count alone would pick the wrong delimiter.
 */
function detectDelimiter(text: string): ParsedTrace['delimiter'] {
  const firstLine = text.split(/\r?\n/).find((line) => line.trim() !== '') ?? '';
  if (firstLine.includes('\t')) return '\t';
  if (firstLine.includes(';')) return ';';
  return ',';
}

function toNumber(cell: string, decimalComma: boolean): number | null {
  const text = decimalComma ? cell.replace(',', '.') : cell;
  if (!NUMBER_PATTERN.test(text)) return null;
  const value = Number(text);
  return Number.isFinite(value) ? value : null;
}

/** Reads a two-column autocorrelation trace (delay in fs, signal), header optional. */
export function parseAutocorrelationCsv(text: string): ParsedTrace {
  const source = parseEngineInput(autocorrelationCsvInputSchema, text).replace(/^\uFEFF/, '');
  const delimiter = detectDelimiter(source);
  let records: Array<{ record: string[]; info: { lines: number } }>;
  try {
    records = parse(source, {
      delimiter,
      info: true,
      trim: true,
      skip_empty_lines: true,
      relax_column_count: true,
      comment: '#',
    }) as unknown as Array<{ record: string[]; info: { lines: number } }>;
  } catch (error) {
    const line = (error as { lines?: number }).lines;
    throw new EngineError('malformed_csv', `The file is not readable CSV: ${(error as Error).message}`, { line });
  }
  const decimalComma = delimiter !== ',';
  const rows = records.filter(({ record }) => record.some((cell) => cell !== ''));
  let header: string[] | null = null;
  const points: Array<[number, number]> = [];
  rows.forEach(({ record, info }, index) => {
    const line = info.lines;
    if (index === 0 && record.every((cell) => toNumber(cell, decimalComma) === null)) {
      header = record;
      if (record.length !== 2) {
        throw new EngineError('wrong_columns', `Line ${line}: expected 2 columns (delay fs, signal), found ${record.length}`, {
          line,
          columns: record.length,
        });
      }
      return;
    }
    if (record.length !== 2) {
      throw new EngineError('wrong_columns', `Line ${line}: expected 2 columns (delay fs, signal), found ${record.length}`, {
        line,
        columns: record.length,
      });
    }
    const values = record.map((cell) => toNumber(cell, decimalComma));
    const badColumn = values.findIndex((v) => v === null);
    if (badColumn >= 0) {
      const cell = record[badColumn];
      throw new EngineError('non_numeric', `Line ${line}, column ${badColumn + 1}: "${cell}" is not a number`, {
        line,
        column: badColumn + 1,
        cell,
      });
    }
    points.push([values[0] as number, values[1] as number]);
  });
  if (points.length < MIN_TRACE_POINTS) {
    throw new EngineError('too_few_points', `A trace needs at least ${MIN_TRACE_POINTS} points; the file has ${points.length}`, {
      count: points.length,
      minimum: MIN_TRACE_POINTS,
    });
  }
  return { points, header, delimiter };
}

/** Reads and analyses in one step: the upload path of a usage log. */
export function analyseAutocorrelationCsv(text: string, shape: PulseShape): AutocorrelationResult & { header: string[] | null } {
  const trace = parseAutocorrelationCsv(text);
  return { ...analyseAutocorrelation(trace.points, shape), header: trace.header };
}
