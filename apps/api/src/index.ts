import 'reflect-metadata';
import type { Server } from 'node:http';
import type { DestinationStream } from 'pino';
import { pathToFileURL } from 'node:url';
import { loadEnv, type Env } from './config/env';
import { createDataSource } from './db/data-source';
import { createLogger } from './lib/logger';
import { smtpTransport } from './lib/mail/mailer';
import { Outbox } from './lib/mail/outbox';
import type { AppContext } from './lib/context';
import { createApp } from './server';
import { startBookingJobs } from './modules/bookings/bookings.service';
import { startUsageJobs } from './modules/usage/usage.service';
import { startBillingJobs } from './modules/billing/close-job';
import { startAuthJobs } from './modules/auth/auth.service';
import { ReferenceCache } from './modules/instruments/reference-data';
import { startTrainingJobs } from './modules/training/training-reminders';

export interface RunningApi {
  url: string;
  port: number;
  ctx: AppContext;
  close(): Promise<void>;
}

/** Builds the context (database, mail outbox with its worker), then listens. */
export async function startApi(env: Env = loadEnv(), opts: { mailWorker?: boolean; pollingIntervalSeconds?: number; logDestination?: DestinationStream } = {}): Promise<RunningApi> {
  const logger = createLogger(env.LOG_LEVEL, opts.logDestination);
  const db = createDataSource(env.DATABASE_URL);
  await db.initialize();
  const outbox = new Outbox(db, env.DATABASE_URL, smtpTransport(env.SMTP_HOST, env.SMTP_PORT, env.MAIL_FROM), logger, {
    retryLimit: env.OUTBOX_RETRY_LIMIT, retryDelaySeconds: env.OUTBOX_RETRY_DELAY_SECONDS, pollingIntervalSeconds: opts.pollingIntervalSeconds, schedule: opts.mailWorker ?? true,
  });
  await outbox.start({ work: opts.mailWorker ?? true });
  const ctx: AppContext = { db, env, logger, outbox, reference: new ReferenceCache(db) };
  if (opts.mailWorker ?? true) {
    await startBookingJobs(ctx);
    await startUsageJobs(ctx);
    await startBillingJobs(ctx);
    await startAuthJobs(ctx);
    await startTrainingJobs(ctx);
  }
  const app = createApp(ctx);
  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(env.PORT, env.HOST, () => resolve(s));
    s.on('error', reject);
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : env.PORT;
  const url = `http://${env.HOST}:${port}`;
  logger.info({ url }, 'api listening');
  let closing: Promise<void> | null = null;
  return {
    url,
    port,
    ctx,
    close: () => {
      closing ??= (async () => {
        await new Promise<void>((resolve) => {
          server.close(() => resolve());
          server.closeAllConnections();
        });
        await outbox.stop();
        await db.destroy();
      })();
      return closing;
    },
  };
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const api = await startApi();
  const stop = async (signal: string) => {
    api.ctx.logger.info({ signal }, 'shutting down');
    await api.close();
    process.exit(0);
  };
  process.once('SIGINT', () => void stop('SIGINT'));
  process.once('SIGTERM', () => void stop('SIGTERM'));
}
