/**
 * Forgot-password answer time for an address that has an account against one that has none, requests alternating one
 * at a time over one keep-alive connection (fetch). The two medians should match: a gap tells an attacker which
 * addresses exist. A script that prints figures; nothing here is asserted.
 */
import type { BenchWorld } from './bench-world';
import { median, percentile, type Figure } from './support';

const ROUNDS = Number(process.env.BENCH_FORGOT_ROUNDS ?? 200);

export async function benchForgotPassword(o: { apiUrl: string; world: BenchWorld }): Promise<{ figures: Figure[]; detail: string }> {
  const ask = async (email: string) => {
    const t = performance.now();
    const r = await fetch(`${o.apiUrl}/api/auth/forgot-password`, {
      method: 'POST', headers: { 'content-type': 'application/json', origin: o.apiUrl }, body: JSON.stringify({ email }),
    });
    await r.arrayBuffer();
    if (r.status !== 202) throw new Error(`forgot-password: ${r.status} (set MAIL_RATE_LIMIT above ${2 * ROUNDS} for the bench API)`);
    return performance.now() - t;
  };
  const existing: number[] = [];
  const unknown: number[] = [];
  for (let i = 0; i < 10; i++) { await ask(o.world.booker.email); await ask(`warm-up-${i}@nowhere.test`); }
  for (let i = 0; i < ROUNDS; i++) {
    // Alternating which goes first, so that neither side always follows the other's mail work.
    if (i % 2 === 0) { existing.push(await ask(o.world.booker.email)); unknown.push(await ask(`nobody-${i}@nowhere.test`)); }
    else { unknown.push(await ask(`nobody-${i}@nowhere.test`)); existing.push(await ask(o.world.booker.email)); }
  }
  const gap = median(existing) - median(unknown);
  const line = `[bench] forgot-password median: existing e-mail ${median(existing).toFixed(2)} ms, unknown e-mail ${median(unknown).toFixed(2)} ms (p95 ${percentile(existing, 95).toFixed(2)} / ${percentile(unknown, 95).toFixed(2)} ms, ${ROUNDS} each)`;
  console.log(line);
  return {
    figures: [
      { section: '7', name: 'forgot-password median, existing e-mail', value: median(existing), unit: 'ms', note: `p95 ${percentile(existing, 95).toFixed(2)} ms, ${ROUNDS} requests` },
      { section: '7', name: 'forgot-password median, unknown e-mail', value: median(unknown), unit: 'ms', note: `p95 ${percentile(unknown, 95).toFixed(2)} ms, ${ROUNDS} requests` },
      { section: '7', name: 'forgot-password median gap (existing − unknown)', value: gap, unit: 'ms', note: 'common practice: no measurable gap, so that the answer time does not tell which addresses exist' },
    ],
    detail: line.replace('[bench] ', '7 '),
  };
}
