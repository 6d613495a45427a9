import type { EntityManager } from 'typeorm';

export interface AuditEntry {
  actorUserId: string | null;
  action: string;
  entityType: string;
  entityId: string;
  before?: Record<string, unknown> | null;
  after?: Record<string, unknown> | null;
  requestId?: string | null;
}

/** One plain INSERT: every write route records an event, so this stays off TypeORM's entity machinery. */
export async function recordAudit(manager: EntityManager, e: AuditEntry): Promise<void> {
  await manager.query(
    `INSERT INTO audit_events (actor_user_id, action, entity_type, entity_id, before, after, request_id) VALUES ($1, $2, $3, $4, $5::jsonb, $6::jsonb, $7)`,
    [e.actorUserId, e.action, e.entityType, e.entityId, e.before ? JSON.stringify(e.before) : null, e.after ? JSON.stringify(e.after) : null, e.requestId ?? null],
  );
}
