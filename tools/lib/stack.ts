import path from 'node:path';
import { existsSync } from 'node:fs';
import { dataRoot, repoRoot, webDist } from './paths';
import { ensureDatabase, ensurePostgresBinaries, startCluster, stopCluster, type Cluster } from './postgres';
import { startMailCapture, type MailCapture } from './maildev';
import { startStripeFake, type RunningStripeFake } from './stripe-fake';
import { BootstrapError, isRoot, run, runOk, step } from './step';

/** What both `npm start` and `npm test` bring up: PostgreSQL, a migrated database, the mail capture. */
export interface Stack {
  cluster: Cluster;
  databaseUrl: string;
  mail: MailCapture;
  appDataDir: string;
  /** The Stripe-compatible fake (billing), when the options asked for one. */
  stripe: RunningStripeFake | null;
  stop(): Promise<void>;
}

export interface StackOptions {
  name: 'app' | 'test';
  pgPort: number;
  database: string;
  freshDatabase: boolean;
  smtpPort: number;
  mailWebPort: number;
  pgTuning?: string[];
  /** Start the Stripe fake on this port, sending webhooks to the URL (none in tests: each test API starts its own). */
  stripePort?: number;
  stripeWebhookUrl?: string;
}

export async function bringUp(o: StackOptions): Promise<Stack> {
  const binDir = await step('PostgreSQL server binaries', ensurePostgresBinaries);
  const pgData = path.join(dataRoot, 'pg', o.name);
  const stopped = { pg: false, mail: false };
  let mail: MailCapture | null = null;
  let stripe: RunningStripeFake | null = null;
  const cluster = await step(`PostgreSQL cluster "${o.name}" on 127.0.0.1:${o.pgPort}`, () => startCluster(binDir, pgData, o.pgPort, o.pgTuning));
  const stop = async () => {
    await stripe?.stop();
    if (mail && !stopped.mail) { stopped.mail = true; await mail.stop(); }
    if (!stopped.pg) { stopped.pg = true; await stopCluster(binDir, pgData); }
  };
  try {
    const databaseUrl = await step(`database ${o.database}${o.freshDatabase ? ' (fresh)' : ''}`, () => ensureDatabase(cluster, o.database, { fresh: o.freshDatabase }));
    await step('migrations', async () => {
      const { migrate } = await import('../../apps/api/src/db/migrate');
      await migrate(databaseUrl);
    });
    const seeded = await step('demo data (once)', async () => {
      const { createDataSource } = await import('../../apps/api/src/db/data-source');
      const { seedDemo } = await import('../../apps/api/src/db/seed/seed');
      const ds = createDataSource(databaseUrl, 2);
      await ds.initialize();
      try { return await seedDemo(ds); } finally { await ds.destroy(); }
    });
    console.log(`[femtoslot]   demo data: ${seeded === 'seeded' ? 'seeded now' : 'already there, kept as it is'}`);
    const appDataDir = path.join(dataRoot, o.name);
    mail = await step(`mail capture (SMTP ${o.smtpPort}, web ${o.mailWebPort})`, () =>
      startMailCapture(o.smtpPort, o.mailWebPort, path.join(appDataDir, 'mail')));
    if (o.stripePort !== undefined) {
      stripe = await step(`Stripe fake on 127.0.0.1:${o.stripePort}`, () =>
        startStripeFake(o.stripePort!, { webhookUrl: o.stripeWebhookUrl, stateDir: o.name === 'app' ? path.join(appDataDir, 'stripe') : undefined }));
    }
    return { cluster, databaseUrl, mail, appDataDir, stripe, stop };
  } catch (err) {
    await stop();
    throw err;
  }
}

export async function buildWeb(): Promise<string> {
  await step('web app build (vite)', () =>
    runOk(path.join(repoRoot, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'warn'], { cwd: path.join(repoRoot, 'apps', 'web'), timeoutMs: 5 * 60_000 }));
  return webDist;
}

export async function ensureChromium(): Promise<string> {
  return step('Chromium for browser tests', async () => {
    const candidates = [process.env.CHROMIUM_PATH, '/usr/bin/chromium', '/usr/bin/chromium-browser'].filter(Boolean) as string[];
    const found = candidates.find((c) => existsSync(c));
    if (found) return found;
    if (!isRoot()) throw new BootstrapError('Chromium was not found.', 'sudo apt-get update && sudo apt-get install -y chromium');
    const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
    await runOk('apt-get', ['update'], { env, timeoutMs: 5 * 60_000 });
    await runOk('apt-get', ['install', '-y', '--no-install-recommends', 'chromium', 'fonts-liberation'], { env, timeoutMs: 15 * 60_000 });
    if (!existsSync('/usr/bin/chromium')) throw new BootstrapError('chromium was installed but /usr/bin/chromium is missing', 'apt-get install -y chromium');
    return '/usr/bin/chromium';
  });
}

export function reportFailure(err: unknown): void {
  if (err instanceof BootstrapError) {
    console.error(`[femtoslot] ${err.message}`);
    if (err.fix) console.error(`[femtoslot] to fix: ${err.fix}`);
  } else {
    console.error('[femtoslot] unexpected failure:', err);
  }
}

export { run };
