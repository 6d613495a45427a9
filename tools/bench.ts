/**
 * `npm run bench`: a "bench" PostgreSQL cluster of its own on a free port, the mail capture, a fresh migrated and
 * demo-seeded database, then tests/benchmarks/run-benchmarks.ts (which seeds the bench data, starts the API as a
 * child process and the Stripe fake in this one), then everything stopped. Figures are printed, never asserted.
 */
import path from 'node:path';
import { dataRoot } from './lib/paths';
import { freePort } from './lib/ports';
import { ensureDatabase, ensurePostgresBinaries, startCluster, stopCluster } from './lib/postgres';
import { startMailCapture, type MailCapture } from './lib/maildev';
import { ensureChromium, reportFailure } from './lib/stack';
import { step } from './lib/step';

async function main(): Promise<number> {
  const started = Date.now();
  const [pgPort, smtpPort, mailWebPort, apiPort, stripePort] = await Promise.all([freePort(), freePort(), freePort(), freePort(), freePort()]);
  const pgData = path.join(dataRoot, 'pg', 'bench');
  let binDir: string | null = null;
  let mail: MailCapture | null = null;
  const stop = async () => {
    await mail?.stop();
    mail = null;
    if (binDir) await stopCluster(binDir, pgData);
    binDir = null;
  };
  const onSignal = async () => { await stop(); process.exit(130); };
  process.once('SIGINT', onSignal);
  process.once('SIGTERM', onSignal);
  const hardStop = setTimeout(async () => { console.error('[femtoslot] bench exceeded 10 minutes; stopping it'); await stop(); process.exit(1); }, 10 * 60_000);
  try {
    const chromium = await ensureChromium();
    binDir = await step('PostgreSQL server binaries', ensurePostgresBinaries);
    const cluster = await step(`PostgreSQL cluster "bench" on 127.0.0.1:${pgPort}`, () => startCluster(binDir!, pgData, pgPort, ['-c max_connections=200', '-c shared_preload_libraries=pg_stat_statements']));
    const databaseUrl = await step('database femtoslot_bench (fresh)', () => ensureDatabase(cluster, 'femtoslot_bench', { fresh: true }));
    await step('migrations', async () => {
      const { migrate } = await import('../apps/api/src/db/migrate');
      await migrate(databaseUrl);
    });
    await step('demo data', async () => {
      const { createDataSource } = await import('../apps/api/src/db/data-source');
      const { seedDemo } = await import('../apps/api/src/db/seed/seed');
      const ds = createDataSource(databaseUrl, 2);
      await ds.initialize();
      try { await seedDemo(ds); } finally { await ds.destroy(); }
    });
    const appDataDir = path.join(dataRoot, 'bench');
    mail = await step(`mail capture (SMTP ${smtpPort}, web ${mailWebPort})`, () => startMailCapture(smtpPort, mailWebPort, path.join(appDataDir, 'mail')));
    const { runBenchmarks } = await import('../tests/benchmarks/run-benchmarks');
    await runBenchmarks({ databaseUrl, smtpPort, dataDir: appDataDir, apiPort, stripePort, chromiumPath: chromium, pgDataDir: pgData });
    await stop();
    console.log(`[femtoslot] bench total ${((Date.now() - started) / 1000).toFixed(0)} s`);
    return 0;
  } catch (err) {
    reportFailure(err);
    await stop();
    return 1;
  } finally {
    clearTimeout(hardStop);
  }
}

main().then((code) => process.exit(code));
