import { auditEvents } from '../database/schema'
import type { Executor } from '../database/client'

export interface AuditEntry {
  workshopId: string
  actorId: string | null
  action: string
  subjectType: string
  subjectId?: string | null
  fromState?: string | null
  toState?: string | null
  reason?: string | null
  details?: Record<string, unknown>
}

/** Append one audit row; call it inside the transaction that makes the change. */
export async function audit(db: Executor, entry: AuditEntry) {
  await db.insert(auditEvents).values(entry)
}
