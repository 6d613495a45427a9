import { z } from 'zod';
import { EngineError, parseEngineInput } from '../units/engine-error';
import { analysePoints, MAX_TRACE_POINTS, MIN_TRACE_POINTS, type AutocorrelationResult, type PulseShape } from './autocorrelation';

export const autocorrelationCsvInputSchema = z.string().max(5_000_000);

/** No row of a two-column trace comes near this; a longer one is refused before it is split into cells. */
export const MAX_TRACE_LINE_CHARS = 1000;
// Text handled between two yields of the stepwise reader.
const STEP_CHARS = 64 * 1024;

export interface ParsedTrace {
  /** [delay fs, signal] in file order. */
  points: Array<[number, number]>;
  header: string[] | null;
  delimiter: ',' | ';' | '\t';
}

/**
 * A plain decimal number: sign, digits with at most one point, optional exponent. One pass over the cell, no
 * regular expression (a backtracking pattern is quadratic on a long run of digits).
 */
function isDecimal(text: string): boolean {
  const n = text.length;
  let i = 0;
  let c = text.charCodeAt(0);
  if (c === 43 || c === 45) c = text.charCodeAt(++i); // + -
  let mantissaDigits = 0;
  while (c >= 48 && c <= 57) { mantissaDigits += 1; c = text.charCodeAt(++i); }
  if (c === 46) { // .
    c = text.charCodeAt(++i);
    while (c >= 48 && c <= 57) { mantissaDigits += 1; c = text.charCodeAt(++i); }
  }
  if (mantissaDigits === 0) return false;
  if (c === 101 || c === 69) { // e E
    c = text.charCodeAt(++i);
    if (c === 43 || c === 45) c = text.charCodeAt(++i);
    if (!(c >= 48 && c <= 57)) return false;
    while (c >= 48 && c <= 57) c = text.charCodeAt(++i);
  }
  return i === n;
}

function toNumber(cell: string, decimalComma: boolean): number | null {
  const text = decimalComma ? cell.replace(',', '.') : cell;
  if (!isDecimal(text)) return null;
  const value = Number(text);
  return Number.isFinite(value) ? value : null;
}

/**
 * Tab, then semicolon, then comma: files that use ';' or tab between cells often write decimal
 * commas, so a comma count alone would pick the wrong delimiter.
 */
function detectDelimiter(firstLine: string): ParsedTrace['delimiter'] {
  if (firstLine.includes('\t')) return '\t';
  if (firstLine.includes(';')) return ';';
  return ',';
}

/**
 * Cells of one line, CSV style (RFC 4180 quotes, `""` inside quotes; '#' outside quotes starts a comment),
 * trimmed. A quoted cell may not span lines: a trace holds numbers and a short header.
 */
function splitLine(line: string, delimiter: string, lineNumber: number): string[] {
  if (!line.includes('"') && !line.includes('#')) return line.split(delimiter).map((cell) => cell.trim());
  const cells: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < line.length; i += 1) {
    const ch = line[i]!;
    if (quoted) {
      if (ch !== '"') cell += ch;
      else if (line[i + 1] === '"') { cell += '"'; i += 1; }
      else quoted = false;
    } else if (ch === '"') quoted = true;
    else if (ch === delimiter) { cells.push(cell.trim()); cell = ''; }
    else if (ch === '#') break;
    else cell += ch;
  }
  if (quoted) throw new EngineError('malformed_csv', `Line ${lineNumber}: a quoted cell is not closed on its line`, { line: lineNumber });
  cells.push(cell.trim());
  return cells;
}

function wrongColumns(line: number, columns: number): EngineError {
  return new EngineError('wrong_columns', `Line ${line}: expected 2 columns (delay fs, signal), found ${columns}`, { line, columns });
}

/**
 * Reads a two-column autocorrelation trace (delay in fs, signal), header optional, in one pass over the text
 * (linear in its length), pausing after each ~64 KiB so that a caller on a shared thread can let other work run.
 * The number of points is bounded by MAX_TRACE_POINTS and each line by MAX_TRACE_LINE_CHARS.
 */
function* traceReader(text: string): Generator<void, ParsedTrace> {
  const source = parseEngineInput(autocorrelationCsvInputSchema, text).replace(/^\uFEFF/, '');
  // Old Mac files end lines with CR alone; everything else has LF (CRLF included, its CR is trimmed below).
  const breakChar = source.includes('\n') || !source.includes('\r') ? '\n' : '\r';
  let delimiter: ParsedTrace['delimiter'] | null = null;
  let header: string[] | null = null;
  let rowsSeen = 0;
  const points: Array<[number, number]> = [];
  let stepStart = 0;
  let lineNumber = 0;
  for (let start = 0; start <= source.length;) {
    const found = source.indexOf(breakChar, start);
    const end = found === -1 ? source.length : found;
    lineNumber += 1;
    if (end - start > MAX_TRACE_LINE_CHARS) {
      throw new EngineError('line_too_long', `Line ${lineNumber} has ${end - start} characters; a trace row has at most ${MAX_TRACE_LINE_CHARS}`, {
        line: lineNumber, length: end - start, maximum: MAX_TRACE_LINE_CHARS,
      });
    }
    const line = source.slice(start, end > start && source.charCodeAt(end - 1) === 13 ? end - 1 : end);
    start = end + 1;
    if (line.trim() !== '') {
      delimiter ??= detectDelimiter(line);
      const record = splitLine(line, delimiter, lineNumber);
      if (record.some((cell) => cell !== '')) {
        const decimalComma = delimiter !== ',';
        const firstRow = rowsSeen === 0;
        rowsSeen += 1;
        if (record.length !== 2) throw wrongColumns(lineNumber, record.length);
        const values = record.map((cell) => toNumber(cell, decimalComma));
        if (firstRow && values.every((v) => v === null)) header = record;
        else {
          const badColumn = values.findIndex((v) => v === null);
          if (badColumn >= 0) {
            const cell = record[badColumn];
            throw new EngineError('non_numeric', `Line ${lineNumber}, column ${badColumn + 1}: "${cell}" is not a number`, { line: lineNumber, column: badColumn + 1, cell });
          }
          if (points.length === MAX_TRACE_POINTS) {
            throw new EngineError('too_many_points', `A trace may hold at most ${MAX_TRACE_POINTS} points; this file has more (line ${lineNumber})`, {
              maximum: MAX_TRACE_POINTS, line: lineNumber,
            });
          }
          points.push([values[0] as number, values[1] as number]);
        }
      }
    }
    if (found === -1) break;
    if (start - stepStart >= STEP_CHARS) {
      stepStart = start;
      yield;
    }
  }
  if (points.length < MIN_TRACE_POINTS) {
    throw new EngineError('too_few_points', `A trace needs at least ${MIN_TRACE_POINTS} points; the file has ${points.length}`, {
      count: points.length,
      minimum: MIN_TRACE_POINTS,
    });
  }
  return { points, header, delimiter: delimiter ?? ',' };
}

/** Reads the whole trace at once (the browser, on the user's own file). */
export function parseAutocorrelationCsv(text: string): ParsedTrace {
  const reader = traceReader(text);
  for (;;) {
    const step = reader.next();
    if (step.done) return step.value;
  }
}

/**
 * Reads the trace in steps of ~64 KiB, awaiting `pause` between them (the API passes a setImmediate, so requests
 * queued behind a large upload are answered while it is read).
 */
export async function readAutocorrelationCsvInSteps(text: string, pause: () => Promise<void>): Promise<ParsedTrace> {
  const reader = traceReader(text);
  for (;;) {
    const step = reader.next();
    if (step.done) return step.value;
    await pause();
  }
}

/** Reads and analyses in one step. */
export function analyseAutocorrelationCsv(text: string, shape: PulseShape): AutocorrelationResult & { header: string[] | null } {
  const trace = parseAutocorrelationCsv(text);
  return { ...analysePoints(trace.points, shape), header: trace.header };
}
