import path from 'node:path';
import { buildWeb, bringUp, reportFailure } from './lib/stack';
import { portInUse } from './lib/ports';
import { BootstrapError, step } from './lib/step';

const port = Number(process.env.PORT ?? 3000);
const pgPort = Number(process.env.FEMTOSLOT_PG_PORT ?? 54329);
const smtpPort = Number(process.env.MAIL_SMTP_PORT ?? 1025);
const mailWebPort = Number(process.env.MAIL_WEB_PORT ?? 1080);
const stripePort = Number(process.env.STRIPE_FAKE_PORT ?? 12111);

async function main() {
  for (const [what, p] of [['app', port], ['mail SMTP', smtpPort], ['mail web', mailWebPort], ['Stripe fake', stripePort]] as const) {
    if (await portInUse(p)) throw new BootstrapError(`Port ${p} (${what}) is already in use — is another Femtoslot running?`, `stop it, or choose another port (PORT, MAIL_SMTP_PORT, MAIL_WEB_PORT, STRIPE_FAKE_PORT)`);
  }
  const stack = await bringUp({ name: 'app', pgPort, database: 'femtoslot', freshDatabase: false, smtpPort, mailWebPort,
    stripePort, stripeWebhookUrl: `http://127.0.0.1:${port}/api/webhooks/stripe` });
  let api: Awaited<ReturnType<typeof import('../apps/api/src/index').startApi>> | null = null;
  let stopping = false;
  const shutdown = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`\n[femtoslot] ${signal}: stopping …`);
    await api?.close().catch(() => undefined);
    await stack.stop();
    console.log('[femtoslot] stopped: API, mail capture, Stripe fake and PostgreSQL are down; data kept for the next start.');
    process.exit(0);
  };
  process.on('SIGINT', () => void shutdown('SIGINT')); // on, not once: npm and tsx relay the same signal again
  process.on('SIGTERM', () => void shutdown('SIGTERM'));
  try {
    const webDist = await buildWeb();
    const { loadEnv } = await import('../apps/api/src/config/env');
    const { startApi } = await import('../apps/api/src/index');
    const env = loadEnv({
      ...process.env, NODE_ENV: process.env.NODE_ENV ?? 'development', PORT: String(port), HOST: '127.0.0.1',
      DATABASE_URL: stack.databaseUrl, DATA_DIR: path.join(stack.appDataDir), SMTP_HOST: '127.0.0.1', SMTP_PORT: String(smtpPort), WEB_DIST: webDist,
      STRIPE_HOST: process.env.STRIPE_HOST ?? '127.0.0.1', STRIPE_PORT: process.env.STRIPE_PORT ?? String(stripePort), STRIPE_PROTOCOL: process.env.STRIPE_PROTOCOL ?? 'http',
      LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn',
    });
    api = await step('API and web server', () => startApi(env));
  } catch (err) {
    await shutdown('error');
    throw err;
  }
  console.log(`
  Femtoslot is running:   ${api.url}
  Mail capture:           ${stack.mail.webUrl}
  Stripe fake:            ${stack.stripe?.url ?? 'not started'}
  Demo sign-ins (password femtoslot-demo):
    collaborator@harrowpoint.test · member@harrowpoint.test · pi@harrowpoint.test
    staff@harrowpoint.test · finance@harrowpoint.test · admin@harrowpoint.test
  Ctrl-C stops everything.`);
}

main().catch((err) => {
  reportFailure(err);
  process.exit(1);
});
