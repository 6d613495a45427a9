/**
 * Period close of the seeded month (5,000 confirmed sessions over 200 accounts; external ones pushed to the in-process
 * Stripe fake at latency 0): time from the close request to the job's completion, and the API process's peak resident
 * memory (VmHWM from /proc/<pid>/status, reset just before, with VmRSS also sampled every 100 ms).
 */
import type { BenchWorld } from './bench-world';
import { memoryOf, resetPeakMemory, signIn, type Figure } from './support';
import { BENCH_PASSWORD } from './bench-world';

interface Job { id: string; status: string; done: number; total: number; errors: unknown[] }

export async function benchPeriodClose(o: { apiUrl: string; apiPid: number; world: BenchWorld }): Promise<{ figures: Figure[]; detail: string }> {
  const cookie = await signIn(o.apiUrl, o.world.finance.email, BENCH_PASSWORD);
  const headers = { cookie, origin: o.apiUrl, 'content-type': 'application/json' };
  const reset = resetPeakMemory(o.apiPid);
  const before = memoryOf(o.apiPid);
  let sampledPeak = before.rssMb;
  const sampler = setInterval(() => { try { sampledPeak = Math.max(sampledPeak, memoryOf(o.apiPid).rssMb); } catch { /* process gone */ } }, 100);
  try {
    const t0 = performance.now();
    const opened = await fetch(`${o.apiUrl}/api/billing/periods`, { method: 'POST', headers, body: JSON.stringify({ month: o.world.closeMonth }) });
    const openedBody = (await opened.json()) as { period: { id: string }; preview: { accounts: { lines: unknown[] }[]; totalFormatted: string } };
    if (opened.status !== 200) throw new Error(`open period: ${opened.status} ${JSON.stringify(openedBody).slice(0, 300)}`);
    const previewSeconds = (performance.now() - t0) / 1000;
    const lines = openedBody.preview.accounts.reduce((n, a) => n + a.lines.length, 0);
    const t1 = performance.now();
    const close = await fetch(`${o.apiUrl}/api/billing/periods/${openedBody.period.id}/close`, { method: 'POST', headers, body: '{}' });
    const closeBody = (await close.json()) as { job: Job };
    if (close.status !== 202) throw new Error(`close: ${close.status} ${JSON.stringify(closeBody).slice(0, 300)}`);
    const requestSeconds = (performance.now() - t1) / 1000;
    let job = closeBody.job;
    const deadline = performance.now() + 180_000;
    while (job.status !== 'completed' && job.status !== 'failed') {
      if (performance.now() > deadline) throw new Error(`close did not finish in 180 s (${job.done}/${job.total})`);
      await new Promise((r) => setTimeout(r, 200));
      job = ((await (await fetch(`${o.apiUrl}/api/billing/jobs/${job.id}`, { headers: { cookie } })).json()) as { job: Job }).job;
    }
    const closeSeconds = (performance.now() - t1) / 1000;
    const after = memoryOf(o.apiPid);
    const peak = reset ? after.hwmMb : Math.max(sampledPeak, after.rssMb);
    return {
      figures: [
        { section: '3', name: 'period close: request to completed job', value: closeSeconds, unit: 's', target: { max: 20 }, note: `${job.status}, ${job.done}/${job.total} accounts, ${lines} lines; the close request itself took ${requestSeconds.toFixed(1)} s` },
        { section: '3', name: 'period preview (open period)', value: previewSeconds, unit: 's', note: `total ${openedBody.preview.totalFormatted}` },
        { section: '3', name: 'API peak RSS during preview + close', value: peak, unit: 'MB', target: { max: 300 }, note: `fresh API process; ${reset ? 'VmHWM, reset by clear_refs just before' : 'sampled VmRSS (VmHWM reset not permitted)'}; RSS at start ${before.rssMb.toFixed(0)} MB, sampled max ${sampledPeak.toFixed(0)} MB` },
      ],
      detail: `close of ${o.world.closeMonth}: ${job.errors.length} account errors`,
    };
  } finally {
    clearInterval(sampler);
  }
}
