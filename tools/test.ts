import { mkdirSync, readFileSync, rmSync } from 'node:fs';
import { spawn } from 'node:child_process';
import path from 'node:path';
import { artifactsDir, repoRoot } from './lib/paths';
import { freePort } from './lib/ports';
import { buildWeb, bringUp, ensureChromium, reportFailure, type Stack } from './lib/stack';

interface VitestJson {
  numPassedTests: number;
  numFailedTests: number;
  numPendingTests: number;
  numTodoTests: number;
  numFailedTestSuites: number;
  success: boolean;
}

async function main(): Promise<number> {
  const started = Date.now();
  const [pgPort, smtpPort, mailWebPort, stripePort] = await Promise.all([freePort(), freePort(), freePort(), freePort()]);
  let stack: Stack | null = null;
  let signalled = false;
  const onSignal = async () => { if (signalled) return; signalled = true; await stack?.stop(); process.exit(130); };
  process.on('SIGINT', onSignal);
  process.on('SIGTERM', onSignal);
  try {
    const chromium = await ensureChromium();
    stack = await bringUp({
      name: 'test', pgPort, database: 'femtoslot_test', freshDatabase: true, smtpPort, mailWebPort, stripePort,
      // Durability is irrelevant for a throwaway test cluster; these make it several times faster.
      pgTuning: ['-c fsync=off', '-c synchronous_commit=off', '-c full_page_writes=off', '-c max_connections=300'],
    });
    // For quick API-only iterations; CI always builds (the browser suite needs the bundle).
    const webDist = process.env.FEMTOSLOT_SKIP_WEB_BUILD && !process.env.CI ? '' : await buildWeb();
    mkdirSync(artifactsDir, { recursive: true });
    const report = path.join(artifactsDir, 'vitest-report.json');
    rmSync(report, { force: true });
    const args = ['run', '--reporter=default', '--reporter=json', `--outputFile.json=${report}`, ...process.argv.slice(2)];
    const code = await new Promise<number>((resolve) => {
      const child = spawn(path.join(repoRoot, 'node_modules', '.bin', 'vitest'), args, {
        cwd: repoRoot,
        stdio: 'inherit',
        env: {
          ...process.env,
          NODE_ENV: 'test',
          TEST_DATABASE_URL: stack!.databaseUrl,
          TEST_SMTP_PORT: String(smtpPort),
          TEST_MAILDEV_URL: stack!.mail.webUrl,
          TEST_STRIPE_PORT: String(stack!.stripe?.port ?? stripePort),
          TEST_DATA_DIR: stack!.appDataDir,
          TEST_WEB_DIST: webDist,
          CHROMIUM_PATH: chromium,
          ARTIFACTS_DIR: artifactsDir,
        },
      });
      const timer = setTimeout(() => { console.error('[femtoslot] test run exceeded 60 minutes; stopping it'); child.kill('SIGKILL'); }, 60 * 60_000);
      child.on('close', (c) => { clearTimeout(timer); resolve(c ?? 1); });
    });
    let summary = 'tests: no report was written (the runner crashed before the end)';
    try {
      const r = JSON.parse(readFileSync(report, 'utf8')) as VitestJson;
      // A run that errored outside any test (a file that failed to load, an unhandled error) still counts as failed.
      const failed = r.numFailedTests > 0 || code === 0 ? r.numFailedTests : Math.max(1, r.numFailedTestSuites);
      summary = `tests: ${r.numPassedTests} passed, ${failed} failed, ${r.numPendingTests + r.numTodoTests} skipped`;
    } catch { /* summary says so */ }
    await stack.stop();
    stack = null;
    console.log(`[femtoslot] total ${((Date.now() - started) / 1000).toFixed(0)} s`);
    console.log(summary);
    return code;
  } catch (err) {
    reportFailure(err);
    await stack?.stop();
    console.log('tests: 0 passed, 1 failed (the bootstrap failed before the suites ran)');
    return 1;
  }
}

main().then((code) => process.exit(code));
