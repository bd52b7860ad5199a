import type { Kysely, Transaction } from 'kysely';
import { nowIso } from '../../clock.ts';
import type { AuditEvent, Database } from '../schema.ts';

export interface AuditInput {
  actorId: number | null;
  kind: string;
  subject?: string | null;
  detail?: Record<string, unknown>;
}

/** Appends one event to the audit log. The log is append-only: nothing updates or deletes it. */
export async function recordAudit(db: Kysely<Database> | Transaction<Database>, event: AuditInput): Promise<void> {
  await db
    .insertInto('audit_events')
    .values({
      at: nowIso(),
      actor_id: event.actorId,
      kind: event.kind,
      subject: event.subject ?? null,
      detail: event.detail ? JSON.stringify(event.detail) : null,
    })
    .execute();
}

export function listAudit(db: Kysely<Database>, limit = 200): Promise<AuditEvent[]> {
  return db.selectFrom('audit_events').selectAll().orderBy('id', 'desc').limit(limit).execute();
}
