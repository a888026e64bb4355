import { and, desc, eq } from 'drizzle-orm'
import { lots } from '../database/schema'
import type { Database, Executor } from '../database/client'
import type { LotInput } from '../../shared/schemas/records'
import { audit } from './audit'
import { conflictOnDuplicate, fail } from './http-errors'

export function listLots(db: Executor, workshopId: string) {
  return db.select().from(lots).where(eq(lots.workshopId, workshopId)).orderBy(desc(lots.createdAt))
}

export function createLot(db: Database, workshopId: string, actorId: string, input: LotInput) {
  const duplicate = `A lot with code ${input.code} already exists.`
  // The check gives the usual answer; the unique index decides when two requests race.
  return conflictOnDuplicate(() => db.transaction(async (tx) => {
    const [dup] = await tx.select({ id: lots.id }).from(lots).where(and(eq(lots.workshopId, workshopId), eq(lots.code, input.code)))
    if (dup) fail(409, duplicate)
    const [lot] = await tx.insert(lots).values({ ...input, workshopId, receivedOn: input.receivedOn ?? null, moisturePct: input.moisturePct ?? null }).returning()
    await audit(tx, { workshopId, actorId, action: 'lot.create', subjectType: 'lot', subjectId: lot!.id })
    return lot!
  }), duplicate, 'lots_workshop_code_key')
}
