import type { DataSource } from 'typeorm';
import type { Env } from '../config/env';
import type { Logger } from './logger';
import type { Outbox } from './mail/outbox';
import type { ReferenceCache } from '../modules/instruments/reference-data';

/** What every module factory receives: explicit dependencies, no globals. */
export interface AppContext {
  db: DataSource;
  env: Env;
  logger: Logger;
  outbox: Outbox;
  /** Facility, organisations, instruments, configurations, changeover model, eyewear: per process, revision-checked. */
  reference: ReferenceCache;
}
