import { and, eq, ne } from 'drizzle-orm'
import { sets } from '../database/schema'
import type { Transactor } from '../database/client'
import { SET_FIELD_WORDS, setEditColumns, type FieldChange, type SetEditField, type UpdateSetInput } from '../../shared/schemas/setEdit'
import { audit } from './audit'
import { conflictOnDuplicate, fail } from './http-errors'

/**
 * Changes a set's buyer, serial, model, due date or notes in one transaction under
 * the set's row lock, and audits the fields that really changed (before and after).
 * Certificates are untouched: each keeps the content it froze when it was signed.
 */
export async function updateSet(db: Transactor, workshopId: string, actorId: string, setId: string, input: UpdateSetInput) {
  const wanted = setEditColumns(input)
  const duplicate = `A set with serial number ${input.serial} already exists.`
  return conflictOnDuplicate(() => db.transaction(async (tx) => {
    const [set] = await tx.select().from(sets).where(and(eq(sets.id, setId), eq(sets.workshopId, workshopId))).for('update')
    if (!set) fail(404, 'No such set in this workshop.')
    const changed = (Object.keys(wanted) as SetEditField[]).filter(k => (set[k] ?? null) !== wanted[k])
    if (changed.length === 0) return { set, changes: [] as FieldChange[] }
    if (input.serial !== undefined && changed.includes('serial')) {
      const [dup] = await tx.select({ id: sets.id }).from(sets)
        .where(and(eq(sets.workshopId, workshopId), eq(sets.serial, input.serial), ne(sets.id, setId)))
      if (dup) fail(409, duplicate)
    }
    const values = Object.fromEntries(changed.map(k => [k, wanted[k]]))
    const [updated] = await tx.update(sets).set(values).where(eq(sets.id, setId)).returning()
    const changes = changed.map(k => ({ field: SET_FIELD_WORDS[k], from: set[k] ?? null, to: wanted[k] ?? null }))
    await audit(tx, { workshopId, actorId, action: 'set.edit', subjectType: 'set', subjectId: setId, details: { changes } })
    return { set: updated!, changes }
  }), duplicate, 'sets_workshop_serial_key')
}
