import 'reflect-metadata';
import { pathToFileURL } from 'node:url';
import PgBoss from 'pg-boss';
import { createDataSource } from './data-source';

/** Runs pending TypeORM migrations and installs pg-boss's own schema, once, before any API process starts. */
export async function migrate(databaseUrl: string): Promise<string[]> {
  const ds = createDataSource(databaseUrl, 2);
  await ds.initialize();
  try {
    const ran = await ds.runMigrations({ transaction: 'each' });
    const boss = new PgBoss({ connectionString: databaseUrl, max: 2, supervise: false, schedule: false });
    await boss.start();
    await boss.createQueue('outbox-deliver').catch(() => undefined);
    await boss.stop({ graceful: false, wait: true });
    return ran.map((m) => m.name);
  } finally {
    await ds.destroy();
  }
}

export async function revertLast(databaseUrl: string): Promise<void> {
  const ds = createDataSource(databaseUrl, 2);
  await ds.initialize();
  try {
    await ds.undoLastMigration({ transaction: 'each' });
  } finally {
    await ds.destroy();
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is required');
  if (process.argv.includes('--revert')) await revertLast(url);
  else console.log(`migrations run: ${(await migrate(url)).join(', ') || 'none pending'}`);
}
