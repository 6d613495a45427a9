import type { EntityManager } from 'typeorm';
import { AppError } from '../../lib/errors/app-error';
import { User } from '../users/user.entity';
import type { UsageLog } from './usage-log.entity';

/** 409 log_locked for a billed log, naming who billed it and when: nothing about a billed session changes. */
export async function logLockedError(m: EntityManager, log: UsageLog): Promise<AppError> {
  const billedBy = (log.billedBy ? await m.getRepository(User).findOneBy({ id: log.billedBy }) : null)?.name ?? 'finance';
  return new AppError('log_locked', `This session was billed by ${billedBy} on ${log.billedAt!.toISOString().slice(0, 10)}; a billed log cannot be changed`, 409, { billedBy, billedAt: log.billedAt!.toISOString() });
}
