import PgBoss from 'pg-boss';
import type { DataSource, EntityManager } from 'typeorm';
import type { Logger } from '../logger';
import type { MailTransport } from './mailer';
import { OutboxMessage, type OutboxAttachment } from './outbox-message.entity';
import type { RenderedMail } from './templates';

const QUEUE = 'outbox-deliver';
const DELIVERY_BATCH = 10;
const JOB_RETRIES = { retryLimit: 5, retryDelay: 30, retryBackoff: true } as const;

/** A background job to queue in the same transaction as the change it follows. */
export interface OutboxJob {
  queue: string;
  data: object;
  startAfter?: Date;
}

const toInsert = (j: OutboxJob): PgBoss.JobInsert => ({ name: j.queue, data: j.data, startAfter: j.startAfter, ...JOB_RETRIES });

export interface OutboxOptions {
  retryLimit: number;
  retryDelaySeconds: number;
  pollingIntervalSeconds?: number;
  /** Run pg-boss's cron clock in this process (working processes only); schedules fire once across all processes. */
  schedule?: boolean;
}

/**
 * Every e-mail is first a row in outbox_messages, written in the caller's transaction together with a pg-boss job
 * (same transaction, through pg-boss's `db` option): a rolled-back action sends nothing and a committed one is
 * never lost. pg-boss retries failed sends with exponential backoff; the row records attempts and the last error.
 */
export class Outbox {
  private boss: PgBoss;
  private started = false;
  private readonly queues = new Set<string>();

  constructor(private readonly db: DataSource, connectionString: string, private readonly transport: MailTransport,
    private readonly logger: Logger, private readonly options: OutboxOptions) {
    this.boss = new PgBoss({ connectionString, max: 3, schedule: options.schedule ?? false, application_name: 'femtoslot-outbox' });
    this.boss.on('error', (err) => this.logger.error({ err }, 'outbox queue error'));
  }

  async start({ work }: { work: boolean }): Promise<void> {
    await this.boss.start();
    await this.boss.createQueue(QUEUE).catch(() => undefined);
    this.started = true;
    if (!work) return;
    // Several messages per poll: after an outage the backlog drains in seconds; deliver() skips what was already sent.
    const worker: string = await this.boss.work<{ id: string }>(QUEUE, { pollingIntervalSeconds: this.options.pollingIntervalSeconds ?? 1, batchSize: DELIVERY_BATCH }, async (jobs) => {
      // The batch's messages go out side by side; only the ones that failed are handed back for a retry (pg-boss then
      // completes the rest, which are still active). One bad address no longer holds up, or re-queues, the others.
      const results = await Promise.allSettled(jobs.map((job) => this.deliver(job.data.id)));
      const failed = jobs.filter((_, i) => results[i]!.status === 'rejected').map((j) => j.id);
      // The error itself is on the outbox row (last_error).
      if (failed.length > 0) await this.boss.fail(QUEUE, failed);
      // A full batch means a backlog (after an outage, a busy hour): fetch the next one now, not after the interval.
      if (jobs.length === DELIVERY_BATCH) this.boss.notifyWorker(worker);
    });
    await this.requeueStranded();
  }

  async stop(): Promise<void> {
    if (!this.started) return;
    this.started = false;
    await this.boss.stop({ graceful: true, timeout: 5000, wait: true }).catch(() => undefined);
    this.transport.close();
  }

  /** Background work on the same queue system (reminders, later the period close), transactional when given a manager. */
  async sendJob(queue: string, data: object, options: { startAfter?: Date; singletonKey?: string } = {}, manager?: EntityManager): Promise<void> {
    await this.ensureQueue(queue);
    await this.boss.send(queue, data, { ...options, ...JOB_RETRIES, db: manager ? this.dbFor(manager) : undefined });
  }

  /** Several jobs in one statement, in the caller's transaction. */
  async sendJobs(manager: EntityManager, jobs: OutboxJob[]): Promise<void> {
    if (jobs.length === 0) return;
    for (const j of jobs) await this.ensureQueue(j.queue);
    await this.boss.insert(jobs.map(toInsert), { db: this.dbFor(manager) });
  }

  /** Created once per process, not before every job. */
  private async ensureQueue(queue: string): Promise<void> {
    if (this.queues.has(queue)) return;
    await this.boss.createQueue(queue).catch(() => undefined);
    this.queues.add(queue);
  }

  /** A recurring job (cron in the given IANA zone); re-declaring it at each start updates it in place. */
  async schedule(queue: string, cron: string, tz: string, data: object = {}): Promise<void> {
    await this.ensureQueue(queue);
    await this.boss.schedule(queue, cron, data, { tz, ...JOB_RETRIES });
  }

  async work<T extends object>(queue: string, handler: (data: T) => Promise<void>): Promise<void> {
    await this.ensureQueue(queue);
    await this.boss.work<T>(queue, { pollingIntervalSeconds: this.options.pollingIntervalSeconds ?? 1 }, async (jobs) => {
      for (const job of jobs) await handler(job.data);
    });
  }

  private dbFor(manager: EntityManager) {
    const runner = manager.queryRunner;
    return runner ? { executeSql: async (text: string, values: unknown[]) => ({ rows: (await runner.query(text, values, true)).records }) } : undefined;
  }

  /** The message row, then its delivery job together with `alsoJobs` (the caller's other jobs) in one statement. */
  async enqueue(manager: EntityManager, to: string, mail: RenderedMail, attachments: OutboxAttachment[] = [], alsoJobs: OutboxJob[] = []): Promise<string> {
    const [row] = (await manager.query(
      `INSERT INTO outbox_messages (to_address, subject, text_body, html_body, template, attachments) VALUES ($1, $2, $3, $4, $5, $6::jsonb) RETURNING id`,
      [to, mail.subject, mail.text, mail.html, mail.template, JSON.stringify(attachments)],
    )) as { id: string }[];
    for (const j of alsoJobs) await this.ensureQueue(j.queue);
    await this.boss.insert([
      { name: QUEUE, data: { id: row.id }, retryLimit: this.options.retryLimit, retryDelay: this.options.retryDelaySeconds, retryBackoff: true },
      ...alsoJobs.map(toInsert),
    ], { db: this.dbFor(manager) });
    return row!.id;
  }

  private async deliver(id: string): Promise<void> {
    const repo = this.db.getRepository(OutboxMessage);
    const message = await repo.findOne({ where: { id } });
    if (!message || message.status === 'sent') return;
    try {
      await this.transport.send(message);
      await repo.update({ id, status: 'pending' }, { status: 'sent', sentAt: new Date(), attempts: message.attempts + 1, lastError: null });
    } catch (err) {
      await repo.update({ id }, { attempts: message.attempts + 1, lastError: String((err as Error).message).slice(0, 500) });
      this.logger.warn({ outboxId: id, attempt: message.attempts + 1 }, 'mail delivery failed; will retry');
      throw err;
    }
  }

  /** Pending rows whose job was exhausted (a long mail outage) get a fresh job at start-up. */
  private async requeueStranded(): Promise<void> {
    const rows: { id: string }[] = await this.db.query(
      `SELECT o.id FROM outbox_messages o WHERE o.status = 'pending' AND NOT EXISTS (
         SELECT 1 FROM pgboss.job j WHERE j.name = $1 AND j.data->>'id' = o.id::text AND j.state IN ('created','retry','active'))
       ORDER BY o.created_at LIMIT 1000`, [QUEUE]);
    for (const r of rows) {
      await this.boss.send(QUEUE, { id: r.id }, { retryLimit: this.options.retryLimit, retryDelay: this.options.retryDelaySeconds, retryBackoff: true });
    }
  }
}
