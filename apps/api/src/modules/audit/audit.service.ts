import type { EntityManager } from 'typeorm';
import { AuditEvent } from './audit-event.entity';

export interface AuditEntry {
  actorUserId: string | null;
  action: string;
  entityType: string;
  entityId: string;
  before?: Record<string, unknown> | null;
  after?: Record<string, unknown> | null;
  requestId?: string | null;
}

export async function recordAudit(manager: EntityManager, e: AuditEntry): Promise<void> {
  const row = manager.getRepository(AuditEvent).create({
    actorUserId: e.actorUserId, action: e.action, entityType: e.entityType, entityId: e.entityId,
    before: e.before ?? null, after: e.after ?? null, requestId: e.requestId ?? null,
  });
  await manager.getRepository(AuditEvent).save(row);
}
