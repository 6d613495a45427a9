/// <reference lib="dom" />
/**
 * The 300-event week in headless Chromium through the real API (which serves the bench's build): signed in once,
 * then each run opens /calendar in a new tab and times navigation start → 300 `[data-testid="booking-event"]`.
 * The first run starts with an empty HTTP cache; the later ones reuse it.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium } from 'playwright-core';
import { BENCH_PASSWORD, RENDER_EVENTS, type BenchWorld } from './bench-world';
import { median, type Figure } from './support';

const RUNS = 6;

export async function benchWeekRender(o: { apiUrl: string; world: BenchWorld; chromiumPath: string }): Promise<{ figures: Figure[]; detail: string }> {
  const profile = mkdtempSync(path.join(os.tmpdir(), 'femtoslot-bench-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: o.chromiumPath, headless: true, viewport: { width: 1360, height: 860 },
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  try {
    const login = await context.request.post(`${o.apiUrl}/api/auth/login`, { data: { email: o.world.booker.email, password: BENCH_PASSWORD }, headers: { origin: o.apiUrl } });
    if (login.status() !== 200) throw new Error(`browser sign-in: ${login.status()}`);
    const times: number[] = [];
    const calendarAnswered: number[] = [];
    let seen = 0;
    for (let run = 0; run < RUNS; run++) {
      const page = await context.newPage();
      const t0 = performance.now();
      page.on('response', (r) => { if (r.url().includes('/api/bookings?')) calendarAnswered.push(performance.now() - t0); });
      await page.goto(`${o.apiUrl}/calendar`, { waitUntil: 'commit' });
      await page.waitForFunction((n) => document.querySelectorAll('[data-testid="booking-event"]').length >= n, RENDER_EVENTS, { timeout: 30_000, polling: 'raf' });
      times.push(performance.now() - t0);
      seen = await page.evaluate(() => document.querySelectorAll('[data-testid="booking-event"]').length);
      await page.close();
    }
    const warm = times.slice(1);
    return {
      figures: [
        { section: '6', name: `${RENDER_EVENTS}-event week render, warm median`, value: median(warm), unit: 'ms', target: { max: 1000 }, note: `runs ${times.map((t) => t.toFixed(0)).join(', ')} ms; ${seen} events; week query answered at ${median(calendarAnswered.slice(1)).toFixed(0)} ms (median)` },
        { section: '6', name: `${RENDER_EVENTS}-event week render, cold (first run)`, value: times[0]!, unit: 'ms', target: { max: 1000 } },
      ],
      detail: `week ${o.world.renderWeek.from} – ${o.world.renderWeek.to} on the demo source`,
    };
  } finally {
    await context.close();
    rmSync(profile, { recursive: true, force: true });
  }
}
