/**
 * Autocorrelation-reader benchmark (a script that prints figures, never a timed test): milliseconds to read and
 * analyse 2 MB inputs — degenerate ones that used to stall the API for seconds, and a valid trace at the point limit —
 * and the longest single step between two yields of the stepwise reader (what another request may wait behind).
 */
import { performance } from 'node:perf_hooks';
import { analysePoints, MAX_TRACE_POINTS } from '../src/metrology/autocorrelation';
import { parseAutocorrelationCsv, readAutocorrelationCsvInSteps } from '../src/metrology/autocorrelation-csv';

const TWO_MB = 2 * 1024 * 1024;
const validTrace = (rows: number) => ['delay_fs,signal', ...Array.from({ length: rows }, (_, i) => {
  const d = -2000 + (4000 * i) / (rows - 1);
  return `${d.toFixed(3)},${(0.05 + Math.exp((-4 * Math.LN2 * d * d) / (200 * 200))).toFixed(5)}`;
})].join('\n');

const inputs: Record<string, string> = {
  'one 2 MB cell of digits': `delay,signal\n0,${'1'.repeat(TWO_MB)}x\n`,
  '2 MB of semicolons': ';'.repeat(TWO_MB),
  '2 MB of quotes': '"'.repeat(TWO_MB),
  '2 MB of blank lines': '\n'.repeat(TWO_MB),
  '2 MB of "1,2" rows (over the point limit)': '1,2\n'.repeat(TWO_MB / 4),
  [`valid trace, ${MAX_TRACE_POINTS} rows`]: validTrace(MAX_TRACE_POINTS),
};

function median(values: number[]) {
  const s = [...values].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)]!;
}

async function main() {
  console.log('input | size | read + analyse (median of 5, ms) | outcome | longest step between yields (ms)');
  for (const [label, text] of Object.entries(inputs)) {
    const times: number[] = [];
    let outcome = '';
    for (let run = 0; run < 5; run += 1) {
      const t0 = performance.now();
      try {
        const trace = parseAutocorrelationCsv(text);
        outcome = `ok, pulse ${analysePoints(trace.points, 'gaussian').pulseFwhmFs.toFixed(1)} fs`;
      } catch (error) {
        outcome = (error as { code?: string }).code ?? String(error);
      }
      times.push(performance.now() - t0);
    }
    let longest = 0;
    let last = performance.now();
    await readAutocorrelationCsvInSteps(text, async () => {
      const now = performance.now();
      longest = Math.max(longest, now - last);
      await new Promise((r) => setImmediate(r));
      last = performance.now();
    }).catch(() => undefined);
    longest = Math.max(longest, performance.now() - last);
    console.log(`${label} | ${(text.length / 1024 / 1024).toFixed(2)} MB | ${median(times).toFixed(1)} | ${outcome} | ${longest.toFixed(1)}`);
  }
}

void main();
